"use client";

import { SectionError } from "@/components/ui/section-error";

export default function MailboxError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the mailbox" error={error} retry={retry} />;
}
