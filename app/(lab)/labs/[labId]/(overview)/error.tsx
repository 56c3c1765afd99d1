"use client";

import { SectionError } from "@/components/ui/section-error";

export default function DashboardError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="this lab's overview" error={error} retry={retry} />;
}
