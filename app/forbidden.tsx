import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { describePageRefusal } from "@/lib/server/web/page-refusal";

export const metadata: Metadata = { title: "Not allowed" };

/** 403: a page of the visitor's own lab that their role may not use, said in words. */
export default async function Forbidden() {
  const { message, labId } = await describePageRefusal((await headers()).get("x-morphokin-path"));
  return (
    <div className="mx-auto max-w-md py-24 text-center">
      <h1 className="text-2xl font-semibold">Not allowed for your role</h1>
      <p className="mt-2 text-ink-soft" data-testid="role-refusal">
        {message}
      </p>
      <Link href={labId ? `/labs/${labId}` : "/labs"} className="mt-4 inline-block text-moss hover:underline">
        {labId ? "Back to the lab" : "Back to your labs"}
      </Link>
    </div>
  );
}
