"use client";

import { SectionError } from "@/components/ui/section-error";

export default function MembersError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the lab's members" error={error} retry={retry} />;
}
