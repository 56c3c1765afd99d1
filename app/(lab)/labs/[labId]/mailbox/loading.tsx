import { PageSkeleton } from "@/components/ui/skeleton";

export default function MailboxLoading() {
  return <PageSkeleton label="Loading the mailbox…" layout="table" />;
}
