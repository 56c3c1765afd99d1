import { PageSkeleton } from "@/components/ui/skeleton";

export default function SearchLoading() {
  return <PageSkeleton label="Searching the lab…" layout="panels" />;
}
