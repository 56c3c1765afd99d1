import { PageSkeleton } from "@/components/ui/skeleton";

export default function DashboardLoading() {
  return <PageSkeleton label="Loading the lab's overview…" layout="panels" />;
}
