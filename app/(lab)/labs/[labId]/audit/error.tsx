"use client";

import { SectionError } from "@/components/ui/section-error";

export default function AuditError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the audit trail" error={error} retry={retry} />;
}
