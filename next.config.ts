import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // sqlite3, sharp and @aws-sdk/client-s3 are on Next's built-in external list; sequelize is not.
  serverExternalPackages: ["sequelize", "formidable"],
  poweredByHeader: false,
};

export default nextConfig;
