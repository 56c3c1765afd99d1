"use client";

import { SectionError } from "@/components/ui/section-error";

export default function KineticsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the kinetics" error={error} retry={retry} />;
}
