import { PageSkeleton } from "@/components/ui/skeleton";

export default function RunLoading() {
  return <PageSkeleton label="Loading the verification run…" />;
}
