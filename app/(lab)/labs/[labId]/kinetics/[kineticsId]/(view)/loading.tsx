import { PageSkeleton } from "@/components/ui/skeleton";

export default function KineticsLoading() {
  return <PageSkeleton label="Loading the kinetics…" />;
}
