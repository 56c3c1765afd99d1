"use client";

import { SectionError } from "@/components/ui/section-error";

export default function AccountError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="your account" error={error} retry={retry} />;
}
