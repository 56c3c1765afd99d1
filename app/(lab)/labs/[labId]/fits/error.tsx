"use client";

import { SectionError } from "@/components/ui/section-error";

export default function FitsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the fits" error={error} retry={retry} />;
}
