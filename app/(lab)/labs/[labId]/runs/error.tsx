"use client";

import { SectionError } from "@/components/ui/section-error";

export default function RunsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the verification runs" error={error} retry={retry} />;
}
