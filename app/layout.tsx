import type { Metadata } from "next";
import { connection } from "next/server";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Morphokin", template: "%s · Morphokin" },
  description: "Measure the spacing of periodic tissue patterns and test which reaction–diffusion kinetics explain it.",
};

/** Every page renders per request: its scripts carry that request's CSP nonce (see proxy.ts). */
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en">
      <body className="min-h-screen font-sans antialiased">{children}</body>
    </html>
  );
}
