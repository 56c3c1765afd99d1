import { PageSkeleton } from "@/components/ui/skeleton";

export default function AccountLoading() {
  return <PageSkeleton label="Loading your account…" layout="panels" />;
}
