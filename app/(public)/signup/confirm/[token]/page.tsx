import type { Metadata } from "next";
import { Notice } from "@/components/ui/notice";
import { describeSignupRequest } from "@/lib/server/accounts/accounts";
import { AppError } from "@/lib/server/errors";
import { ConfirmForm } from "./confirm-form";

export const metadata: Metadata = { title: "Confirm your account" };
export const dynamic = "force-dynamic";

/** Opening the link changes nothing (mail scanners open links); the form does, with the password. */
export default async function ConfirmSignupPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let request;
  try {
    request = await describeSignupRequest(token);
  } catch (err) {
    if (err instanceof AppError && (err.code === "not_found" || err.code === "conflict")) {
      const text = err.message.charAt(0).toUpperCase() + err.message.slice(1) + ".";
      return (
        <div className="mx-auto max-w-md py-10">
          <Notice tone="error" testId="confirm-error">
            {text}
          </Notice>
        </div>
      );
    }
    throw err;
  }
  return (
    <div className="mx-auto max-w-md space-y-5 py-6">
      <h1 className="text-2xl font-semibold">Finish creating your account</h1>
      <p className="text-sm text-ink-soft">
        Your account <span className="num">{request.email}</span> and the lab{" "}
        <strong className="text-ink">{request.labName}</strong>, with you as its lab manager.
      </p>
      <ConfirmForm token={token} email={request.email} />
    </div>
  );
}
