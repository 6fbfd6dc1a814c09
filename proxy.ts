import { NextResponse, type NextRequest } from "next/server";
import { isDatabaseReachable } from "@/lib/outage/database-probe";
import { unavailablePageResponse } from "@/lib/outage/unavailable-page";

// Sets the per-request Content-Security-Policy (and HSTS) on every page, and refuses form posts
// from other sites. The headers that never change per request (referrer, nosniff, framing,
// permissions) are in next.config.ts so that static files carry them too.

const isProduction = process.env.NODE_ENV === "production";
const servedOverHttps = process.env.APP_URL?.startsWith("https://") ?? false;
const hostedIngestDomain = "ingest.uploadthing.com";

/**
 * Where the browser sends bench photos: the uploader PUTs straight to the upload service's ingest
 * host, which is UPLOADTHING_INGEST_URL when set (the local fake) and otherwise
 * https://<region>.<ingestHost> for the regions named in UPLOADTHING_TOKEN.
 */
function uploadIngestSources(): string[] {
  const configured = process.env.UPLOADTHING_INGEST_URL;
  if (configured && URL.canParse(configured)) return [new URL(configured).origin];
  try {
    const token = JSON.parse(atob(process.env.UPLOADTHING_TOKEN ?? "")) as { regions?: unknown; ingestHost?: unknown };
    const host = typeof token.ingestHost === "string" ? token.ingestHost : hostedIngestDomain;
    const regions = Array.isArray(token.regions) ? token.regions.filter((region) => /^[a-z0-9-]+$/i.test(String(region))) : [];
    if (regions.length > 0) return regions.map((region) => `https://${region}.${host}`);
  } catch {
    // An unreadable token fails the upload route with its own message; the policy falls back below.
  }
  return [`https://*.${hostedIngestDomain}`];
}

const connectSources = ["'self'", ...uploadIngestSources()].join(" ");

function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'self'",
    // React in development rebuilds server error stacks with eval; production needs no eval.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${isProduction ? "" : " 'unsafe-eval'"}`,
    // Style sheets: the built CSS files, and the <style> elements Next writes, which carry the
    // nonce. In development Next's dev overlay and hot reload insert <style> elements of their own,
    // without it (and a nonce in the list would make browsers ignore 'unsafe-inline').
    `style-src 'self' ${isProduction ? `'nonce-${nonce}'` : "'unsafe-inline'"}`,
    // Style attributes (style={…} in React, the chart library's sizes) cannot carry a nonce, and
    // their values are computed, so no hash fits either; they cannot load or select anything.
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src ${connectSources}`,
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

function createNonce(): string {
  return btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
}

/**
 * A POST to a page is a server action. Next aborts one whose Origin names another host, but answers
 * 500 with an error; it is refused here first with 403. The comparison is Next's own: the Origin's
 * host against X-Forwarded-Host (first entry) or else Host. A request without Origin is let through
 * as Next lets it through: browsers send Origin on every POST, so only hand-made requests lack it,
 * and those carry no one's session unwillingly. next.config.ts lists no serverActions.allowedOrigins;
 * one listed there would have to be let through here too.
 */
function isCrossSitePost(request: NextRequest): boolean {
  if (request.method === "GET" || request.method === "HEAD") return false;
  const origin = request.headers.get("origin");
  if (origin === null) return false;
  const host = request.headers.get("x-forwarded-host")?.split(",")[0]?.trim() || request.headers.get("host");
  return !URL.canParse(origin) || new URL(origin).host !== host;
}

// Next's default limit on a server action's body (serverActions.bodySizeLimit, "1 MB" = 1024² bytes).
const actionBodyLimitBytes = 1024 * 1024;

/** Next refuses a larger action body with a 500; it is answered here with 413 before Next reads it. */
function isOversizedPost(request: NextRequest): boolean {
  if (request.method === "GET" || request.method === "HEAD") return false;
  return Number(request.headers.get("content-length") ?? 0) > actionBodyLimitBytes;
}

function refusal(status: number, message: string): NextResponse {
  return new NextResponse(message, { status, headers: { "content-type": "text/plain; charset=utf-8", "cache-control": "no-store" } });
}

function withTransportSecurity<T extends Response>(response: T): T {
  if (isProduction && servedOverHttps) {
    response.headers.set("strict-transport-security", "max-age=63072000; includeSubDomains");
  }
  return response;
}

export async function proxy(request: NextRequest) {
  if (isCrossSitePost(request)) {
    return refusal(403, "This form was sent from another site, so it was not accepted. Open the page on this site and send it again.");
  }
  if (isOversizedPost(request)) {
    return refusal(413, "This form is larger than 1 MB, so it was not accepted. Shorten what you typed or attach a smaller file.");
  }
  // Pages read the session and their records from the database, and a page cannot set its status
  // once it has failed, so an outage is answered here. Server actions go on: their forms keep what
  // was typed and say why.
  if (!request.headers.has("next-action") && !(await isDatabaseReachable())) return withTransportSecurity(unavailablePageResponse());

  const policy = contentSecurityPolicy(createNonce());
  // Next takes the nonce for its own inline scripts from the policy on the request.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);

  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return withTransportSecurity(response);
}

export const config = {
  matcher: [
    {
      // Pages only: route handlers answer JSON and files, and build assets never render scripts.
      source: "/((?!api/|_next/static|_next/image|icon.svg|favicon.ico).*)",
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
