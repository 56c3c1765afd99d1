import { PageSkeleton } from "@/components/ui/skeleton";

export default function FitsLoading() {
  return <PageSkeleton label="Loading the fits…" layout="table" />;
}
