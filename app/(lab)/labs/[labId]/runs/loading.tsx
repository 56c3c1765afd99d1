import { PageSkeleton } from "@/components/ui/skeleton";

export default function RunsLoading() {
  return <PageSkeleton label="Loading the verification runs…" layout="table" />;
}
