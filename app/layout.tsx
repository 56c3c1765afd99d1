import type { Metadata } from "next";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Morphokin", template: "%s · Morphokin" },
  description: "Measure the spacing of periodic tissue patterns and test which reaction–diffusion kinetics explain it.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <body className="min-h-screen font-sans antialiased">{children}</body>
    </html>
  );
}
