import type { NextConfig } from "next";
import { largestFormBytes } from "./lib/http/body-limits";

// Pages for the local stand-ins (the caught-mail page) are named *.dev.tsx and exist only in builds
// made by the project's scripts (npm start, npm run dev, npm test), which run those stand-ins; a
// deployment's `npm run build` leaves them out.
export const localServicePages = process.env.EDGEWISE_LOCAL_PAGES === "1";

const nextConfig: NextConfig = {
  pageExtensions: localServicePages ? ["tsx", "ts", "dev.tsx"] : ["tsx", "ts"],
  serverExternalPackages: ["@node-rs/argon2", "pg"],
  poweredByHeader: false,
  experimental: {
    // forbidden() renders app/forbidden.tsx with a 403 instead of throwing.
    authInterrupts: true,
    // proxy.ts reads every form within its page's limit (lib/http/body-limits.ts) and answers 413
    // itself: Next's own refusal of a larger action body is a 500.
    serverActions: { bodySizeLimit: largestFormBytes },
    // Next copies a body for the proxy up to this size and silently cuts it there. The margin over
    // the largest form is wider than the chunks a socket delivers (64 kB), so the proxy always
    // counts past a page's limit before a body is cut, and never mistakes a cut body for a whole one.
    proxyClientMaxBodySize: largestFormBytes + 256 * 1024,
  },
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
