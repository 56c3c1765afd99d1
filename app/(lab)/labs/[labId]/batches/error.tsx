"use client";

import { SectionError } from "@/components/ui/section-error";

export default function BatchError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="this batch" error={error} retry={retry} />;
}
