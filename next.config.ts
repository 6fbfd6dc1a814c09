import type { NextConfig } from "next";

// Pages for the local stand-ins (the caught-mail page) are named *.dev.tsx and exist only in builds
// made by the project's scripts (npm start, npm run dev, npm test), which run those stand-ins; a
// deployment's `npm run build` leaves them out.
export const localServicePages = process.env.EDGEWISE_LOCAL_PAGES === "1";

const nextConfig: NextConfig = {
  pageExtensions: localServicePages ? ["tsx", "ts", "dev.tsx"] : ["tsx", "ts"],
  serverExternalPackages: ["@node-rs/argon2", "pg"],
  // forbidden() renders app/forbidden.tsx with a 403 instead of throwing.
  experimental: { authInterrupts: true },
  // Headers that are the same on every response, static files included; the per-request
  // Content-Security-Policy and HSTS are set in proxy.ts.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
        ],
      },
    ];
  },
};

export default nextConfig;
