import { PageSkeleton } from "@/components/ui/skeleton";

export default function ReadoutsLoading() {
  return <PageSkeleton label="Loading the readouts…" layout="table" />;
}
