"use client";

import { SectionError } from "@/components/ui/section-error";

export default function StudiesError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the studies" error={error} retry={retry} />;
}
