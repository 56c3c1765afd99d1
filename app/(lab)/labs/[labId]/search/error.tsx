"use client";

import { SectionError } from "@/components/ui/section-error";

export default function SearchError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SectionError what="the search results" error={error} retry={retry} />;
}
