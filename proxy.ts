import { NextResponse, type NextRequest } from "next/server";
import { findActionBodyProblem } from "@/lib/http/action-body";
import { formBodyLimitFor } from "@/lib/http/body-limits";
import { readBodyWithin } from "@/lib/http/bounded-body";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { refuseCertificateLookupOverLimit } from "@/lib/certificates/page-lookup-limit";
import { isDatabaseReachable } from "@/lib/outage/database-probe";
import { unavailablePageResponse } from "@/lib/outage/unavailable-page";

// Sets the per-request Content-Security-Policy (and HSTS) on every page, refuses form posts from
// other sites, and reads every body posted to a page within that page's limit. The headers that
// never change per request (referrer, nosniff, framing, permissions) are in next.config.ts so that
// static files carry them too.

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

function isPrefetch(request: NextRequest): boolean {
  return request.headers.has("next-router-prefetch") || request.headers.get("purpose") === "prefetch";
}

/**
 * A POST to a page is read here, within the page's limit, and checked the way Next will read it:
 * Next answers a server action whose body is too large or malformed with a 500, and reads a body
 * of any length when no length is declared. Refusals are the app's JSON errors (lib/http).
 */
async function refuseUnreadableBody(request: NextRequest): Promise<NextResponse | null> {
  try {
    const body = await readBodyWithin(request, formBodyLimitFor(request.nextUrl.pathname));
    // Next reads only a POST as a server action.
    const problem = request.method === "POST" ? await findActionBodyProblem(request.headers, body) : null;
    return problem ? refusal(new AppError("bad-request", problem)) : null;
  } catch (error) {
    return refusal(error);
  }
}

function refusal(error: unknown): NextResponse {
  const response = errorResponse(error);
  response.headers.set("cache-control", "no-store");
  return withTransportSecurity(response);
}

function withTransportSecurity<T extends Response>(response: T): T {
  if (isProduction && servedOverHttps) {
    response.headers.set("strict-transport-security", "max-age=63072000; includeSubDomains");
  }
  return response;
}

export async function proxy(request: NextRequest) {
  const readsNoBody = request.method === "GET" || request.method === "HEAD";
  if (isCrossSitePost(request)) {
    return refusal(new AppError("forbidden", "This form was sent from another site, so it was not accepted. Open the page on this site and send it again."));
  }
  if (!readsNoBody) {
    const refused = await refuseUnreadableBody(request);
    if (refused) return refused;
  }
  // Pages read the session and their records from the database, and a page cannot set its status
  // once it has failed, so an outage is answered here. Server actions go on: their forms keep what
  // was typed and say why.
  if (!request.headers.has("next-action") && !(await isDatabaseReachable())) return withTransportSecurity(unavailablePageResponse());
  // A prefetch of a certificate's page looks the certificate up too, so it is counted like a visit.
  if (readsNoBody) {
    const overLimit = await refuseCertificateLookupOverLimit(request);
    if (overLimit) return withTransportSecurity(overLimit);
  }
  // Prefetches only ask for what a link leads to; the page they fetch gets its policy when it is opened.
  if (readsNoBody && isPrefetch(request)) return NextResponse.next();

  const policy = contentSecurityPolicy(createNonce());
  // Next takes the nonce for its own inline scripts from the policy on the request.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);

  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return withTransportSecurity(response);
}

export const config = {
  // Pages only: route handlers answer JSON and files, and build assets never render scripts.
  // Prefetches are let through inside, not left out here: a header must not take a POST past the
  // body checks.
  matcher: ["/((?!api/|_next/static|_next/image|icon.svg|favicon.ico).*)"],
};
