import Link from "next/link";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-md py-24 text-center">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-ink-soft" data-testid="not-found">
        This page does not exist, or it belongs to a lab you are not a member of.
      </p>
      <Link href="/labs" className="mt-4 inline-block text-moss hover:underline">
        Back to your labs
      </Link>
    </div>
  );
}
