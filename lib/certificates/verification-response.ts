import "server-only";
import { NextResponse } from "next/server";
import { formatCertificateCode } from "./code";
import { verifyCertificate } from "./verification";

/** The first X-Forwarded-For hop behind a load balancer, as for sign-in throttling. */
function clientAddressOf(request: Request): string {
  const forwarded = request.headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || request.headers.get("x-real-ip")?.trim() || "unknown";
}

/**
 * The public check for programs: the same answer as the page, with the status a program expects
 * (200 valid or revoked, 404 unknown or malformed, 429 over the limit).
 */
export async function answerVerificationRequest(params: { request: Request; code: string }): Promise<Response> {
  const result = await verifyCertificate({ code: params.code, clientAddress: clientAddressOf(params.request) });
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
    case "rate-limited":
      return NextResponse.json(
        { error: { code: "rate-limited", message: "Too many checks from your network. Wait a minute, then try again." } },
        { status: 429, headers: { ...headers, "retry-after": "60" } },
      );
    case "not-found":
      return NextResponse.json({ error: { code: "not-found", message: "No certificate has this code." } }, { status: 404, headers });
  }
}
