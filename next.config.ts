import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // sqlite3, sharp and @aws-sdk/client-s3 are on Next's built-in external list; sequelize is not.
  serverExternalPackages: ["sequelize", "formidable"],
  poweredByHeader: false,
  // A second build folder lets a check run beside another build (e.g. NEXT_DIST_DIR=.next-check).
  distDir: process.env.NEXT_DIST_DIR || ".next",
  // `npm test` type-checks the whole tree (tsc --noEmit) before it builds; the build itself
  // does not repeat it, so a type error is reported once, by the typecheck step.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;
