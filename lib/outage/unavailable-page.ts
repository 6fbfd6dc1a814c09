import { plainPageResponse } from "@/lib/http/plain-page";

// The page every page route answers while the database is out of reach: status 503 with a
// Retry-After, so browsers, crawlers and load balancers know it is temporary.

const retryAfterSeconds = 15;

export function unavailablePageResponse(): Response {
  return plainPageResponse({
    status: 503,
    title: "Edgewise is briefly unavailable",
    paragraphs: [
      "We cannot reach our records at the moment, so this page cannot be shown. Work you saved before is safe.",
      `This page tries again by itself every ${retryAfterSeconds} seconds.`,
    ],
    retryAfterSeconds,
    offerRetry: true,
  });
}
