import "server-only";
import { findCertificateByCode, takeVerificationToken } from "@/db/queries/certificates";
import { parseCertificateCode } from "./code";

// A school's office may check a handful of certificates in a row, so the bucket allows a burst;
// past it, one look-up every ten seconds per client address. Codes carry 80 random bits, so the
// limit protects the database, not the codes.
export const verificationLimits = { burst: 30, refillPerSecond: 0.1 } as const;

/** What the public page may say: the certificate's own words, nothing else about the learner. */
export type Verification =
  | { status: "valid"; code: string; learnerName: string; courseTitle: string; schoolName: string; issuedAt: Date }
  | { status: "revoked"; code: string; courseTitle: string; schoolName: string; revokedAt: Date }
  | { status: "not-found" }
  | { status: "rate-limited" };

/** A malformed code is answered as not found before the database is asked anything. */
export async function verifyCertificate(params: { code: string; clientAddress: string }): Promise<Verification> {
  const code = parseCertificateCode(params.code);
  if (!code) return { status: "not-found" };
  const allowed = await takeVerificationToken({
    clientAddress: params.clientAddress,
    capacity: verificationLimits.burst,
    refillPerSecond: verificationLimits.refillPerSecond,
  });
  if (!allowed) return { status: "rate-limited" };
  const certificate = await findCertificateByCode({ code });
  if (!certificate) return { status: "not-found" };
  if (certificate.revokedAt) {
    return {
      status: "revoked",
      code,
      courseTitle: certificate.courseTitle,
      schoolName: certificate.schoolName,
      revokedAt: certificate.revokedAt,
    };
  }
  return {
    status: "valid",
    code,
    learnerName: certificate.learnerName,
    courseTitle: certificate.courseTitle,
    schoolName: certificate.schoolName,
    issuedAt: certificate.issuedAt,
  };
}
