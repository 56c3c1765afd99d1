import { PageSkeleton } from "@/components/ui/skeleton";

export default function StudiesLoading() {
  return <PageSkeleton label="Loading the studies…" layout="table" />;
}
