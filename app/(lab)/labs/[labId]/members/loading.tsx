import { PageSkeleton } from "@/components/ui/skeleton";

export default function MembersLoading() {
  return <PageSkeleton label="Loading the lab's members…" layout="table" />;
}
