import { PageSkeleton } from "@/components/ui/skeleton";

export default function FitLoading() {
  return <PageSkeleton label="Loading the fit…" />;
}
