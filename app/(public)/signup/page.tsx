import type { Metadata } from "next";
import { SignupForm } from "./signup-form";

export const metadata: Metadata = { title: "Create an account" };

export default function SignupPage() {
  return (
    <div className="mx-auto max-w-md py-6">
      <h1 className="mb-2 text-2xl font-semibold">Create an account</h1>
      <p className="mb-6 text-sm text-ink-soft">
        This also creates your lab&apos;s workspace, with you as its lab manager. We e-mail you a link to confirm the
        address first; then you can invite people.
      </p>
      <SignupForm />
    </div>
  );
}
