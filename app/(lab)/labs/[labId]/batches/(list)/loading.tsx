import { PageSkeleton } from "@/components/ui/skeleton";

export default function BatchesLoading() {
  return <PageSkeleton label="Loading the batches…" layout="table" />;
}
