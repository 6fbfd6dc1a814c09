import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  serverExternalPackages: ["@node-rs/argon2", "pg"],
  // forbidden() renders app/forbidden.tsx with a 403 instead of throwing.
  experimental: { authInterrupts: true },
};

export default nextConfig;
