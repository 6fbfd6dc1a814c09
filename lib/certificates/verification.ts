import "server-only";
import { findCertificateByCode } from "@/db/queries/certificates";
import { getCourse } from "@/lessons";
import { spendRateLimits, type LimitDecision } from "@/lib/rate-limit/rate-limiter";
import { certificationOf } from "./certification";
import { parseCertificateCode } from "./code";
import { signatoryOf, type Signatory } from "./signatory";

/** What the public page may say: the certificate's own words, nothing else about the learner. */
export type Verification =
  | {
      status: "valid";
      code: string;
      learnerName: string;
      courseTitle: string;
      schoolName: string;
      issuedAt: Date;
      competences: string[];
      studyHours: number;
      signatory: Signatory | null;
    }
  | { status: "revoked"; code: string; courseTitle: string; schoolName: string; revokedAt: Date }
  | { status: "not-found" }
  | { status: "rate-limited"; retryAfterSeconds: number };

/**
 * A malformed code is answered as not found before the database is asked anything; every other
 * look-up counts against the client address's certificate-lookup limit (lib/rate-limit).
 */
export async function verifyCertificate(params: { code: string; clientAddress: string }): Promise<Verification> {
  const code = parseCertificateCode(params.code);
  if (!code) return { status: "not-found" };
  const limit = await spendCertificateLookup(params.clientAddress);
  if (!limit.allowed) return { status: "rate-limited", retryAfterSeconds: limit.retryAfterSeconds };
  return lookUpCertificate(code);
}

/** One look-up from the address, against its certificate-lookup limit. */
export function spendCertificateLookup(clientAddress: string): Promise<LimitDecision> {
  return spendRateLimits("certificate-lookup", { address: clientAddress });
}

/**
 * The answer for a look-up already counted: the public page's, which proxy.ts counts so that it
 * can answer 429 before the page renders.
 */
export async function verifyCountedCertificate(params: { code: string }): Promise<Exclude<Verification, { status: "rate-limited" }>> {
  const code = parseCertificateCode(params.code);
  return code ? lookUpCertificate(code) : { status: "not-found" };
}

async function lookUpCertificate(code: string): Promise<Exclude<Verification, { status: "rate-limited" }>> {
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
    ...certificationOf(certificate, getCourse()),
    signatory: signatoryOf(certificate),
  };
}
