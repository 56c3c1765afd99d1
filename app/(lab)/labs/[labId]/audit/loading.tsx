import { PageSkeleton } from "@/components/ui/skeleton";

export default function AuditLoading() {
  return <PageSkeleton label="Loading the audit trail…" layout="table" />;
}
