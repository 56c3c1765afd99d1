import type { NextConfig } from "next";
import { API_CSP, FIXED_SECURITY_HEADERS } from "./lib/web/security-headers";

const nextConfig: NextConfig = {
  // sqlite3, pg, sharp and @aws-sdk/client-s3 are on Next's built-in external list; sequelize,
  // formidable, pg-boss (which loads pg at run time) and exceljs (XLSX tables) are not.
  serverExternalPackages: ["sequelize", "formidable", "pg-boss", "exceljs"],
  poweredByHeader: false,
  // A second build folder lets a check run beside another build (e.g. NEXT_DIST_DIR=.next-check).
  distDir: process.env.NEXT_DIST_DIR || ".next",
  // `npm test` type-checks the whole tree (tsc --noEmit) before it builds; the build itself
  // does not repeat it, so a type error is reported once, by the typecheck step.
  typescript: { ignoreBuildErrors: true },
  experimental: {
    // proxy.ts sees pages and /api/auth only (never uploads or /api/v1); Next buffers a body it
    // passes through the proxy up to this size, so a large body cannot fill memory there.
    proxyClientMaxBodySize: 1024 * 1024,
    // forbidden() and app/forbidden.tsx: a lab page one's role may not use answers 403 in words.
    authInterrupts: true,
  },
  // Security headers on every response; the pages' CSP (with its nonce) comes from proxy.ts.
  async headers() {
    return [
      { source: "/:path*", headers: [...FIXED_SECURITY_HEADERS] },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: API_CSP }] },
    ];
  },
};

export default nextConfig;
