import type { Metadata } from "next";
import { Suspense } from "react";
import { LoginForms } from "./login-forms";

export const metadata: Metadata = { title: "Sign in" };

export default function LoginPage() {
  return (
    <div className="mx-auto max-w-md py-6">
      <h1 className="mb-6 text-2xl font-semibold">Sign in to Morphokin</h1>
      <Suspense>
        <LoginForms />
      </Suspense>
    </div>
  );
}
