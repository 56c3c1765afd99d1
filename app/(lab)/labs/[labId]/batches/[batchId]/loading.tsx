import { PageSkeleton } from "@/components/ui/skeleton";

export default function BatchLoading() {
  return <PageSkeleton label="Loading the batch…" layout="panels" />;
}
