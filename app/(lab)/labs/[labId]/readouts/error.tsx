"use client";

import { SectionError } from "@/components/ui/section-error";

export default function ReadoutsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the readouts" error={error} retry={retry} />;
}
