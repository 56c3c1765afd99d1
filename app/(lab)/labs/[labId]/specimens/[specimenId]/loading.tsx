import { PageSkeleton } from "@/components/ui/skeleton";

export default function SpecimenLoading() {
  return <PageSkeleton label="Loading the specimen…" layout="panels" />;
}
