import "server-only";
import type { NextRequest } from "next/server";
import { clientAddressOf } from "@/lib/client-address/client-address";
import { describeWait } from "@/lib/http/errors";
import { plainPageResponse } from "@/lib/http/plain-page";
import { parseCertificateCode } from "./code";
import { spendCertificateLookup } from "./verification";

const certificatePage = /^\/c\/([^/]+)\/?$/;

function codeOfPath(pathname: string): string | null {
  const match = certificatePage.exec(pathname);
  if (!match) return null;
  try {
    return decodeURIComponent(match[1]!);
  } catch {
    return null;
  }
}

/**
 * Counts a request for a certificate's public page (/c/CODE) against the address's
 * certificate-lookup limit, here rather than in the page so that a request over it is answered
 * 429 with Retry-After, which a page that has started rendering cannot. Malformed codes are not
 * counted: the page answers them 404 without asking the database. Null when the request may go on.
 */
export async function refuseCertificateLookupOverLimit(request: NextRequest): Promise<Response | null> {
  const code = codeOfPath(request.nextUrl.pathname);
  if (code === null || !parseCertificateCode(code)) return null;
  const limit = await spendCertificateLookup(clientAddressOf(request.headers));
  if (limit.allowed) return null;
  return plainPageResponse({
    status: 429,
    title: "Too many certificate checks",
    paragraphs: [
      "Checks are limited per network address to keep the service fair for everyone.",
      `Wait ${describeWait(limit.retryAfterSeconds)}; this page then loads again by itself.`,
    ],
    retryAfterSeconds: limit.retryAfterSeconds,
    offerRetry: false,
  });
}
