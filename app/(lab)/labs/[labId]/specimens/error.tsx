"use client";

import { SectionError } from "@/components/ui/section-error";

export default function SpecimenError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="this specimen" error={error} retry={retry} />;
}
