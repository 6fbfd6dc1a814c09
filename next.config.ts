import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The test run builds into its own folder so it never clobbers the build a running demo serves.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  serverExternalPackages: ["@node-rs/argon2", "pg"],
};

export default nextConfig;
