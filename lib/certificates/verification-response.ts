import "server-only";
import { NextResponse } from "next/server";
import { clientAddressOf } from "@/lib/client-address/client-address";
import { describeWait, RateLimitedError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { formatCertificateCode } from "./code";
import { verifyCertificate } from "./verification";

/**
 * The public check for programs: the same answer as the page, with the status a program expects
 * (200 valid or revoked, 404 unknown or malformed, 429 over the limit).
 */
export async function answerVerificationRequest(params: { request: Request; code: string }): Promise<Response> {
  const result = await verifyCertificate({ code: params.code, clientAddress: clientAddressOf(params.request.headers) });
  const headers = { "cache-control": "no-store" };
  switch (result.status) {
    case "valid":
      return NextResponse.json(
        {
          status: "valid",
          code: formatCertificateCode(result.code),
          learnerName: result.learnerName,
          courseTitle: result.courseTitle,
          schoolName: result.schoolName,
          issuedAt: result.issuedAt.toISOString(),
          competences: result.competences,
          studyHours: result.studyHours,
          signatory: result.signatory,
        },
        { headers },
      );
    case "revoked":
      return NextResponse.json(
        {
          status: "revoked",
          code: formatCertificateCode(result.code),
          courseTitle: result.courseTitle,
          schoolName: result.schoolName,
          revokedAt: result.revokedAt.toISOString(),
        },
        { headers },
      );
    case "rate-limited": {
      const wait = describeWait(result.retryAfterSeconds);
      const refusal = errorResponse(new RateLimitedError(result.retryAfterSeconds, `Too many checks from your network. Wait ${wait}, then try again.`));
      refusal.headers.set("cache-control", "no-store");
      return refusal;
    }
    case "not-found":
      return NextResponse.json({ error: { code: "not-found", message: "No certificate has this code." } }, { status: 404, headers });
  }
}
