import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The test run builds into its own folder so it never clobbers the build a running demo serves.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  serverExternalPackages: ["@node-rs/argon2", "pg"],
  // forbidden() renders app/forbidden.tsx with a 403 instead of throwing.
  experimental: { authInterrupts: true },
};

export default nextConfig;
