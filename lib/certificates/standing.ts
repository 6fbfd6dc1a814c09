import "server-only";
import { getCourse } from "@/lessons";
import type { Certificate } from "@/db/schema";
import { evaluateCompletion, type CompletionStatus } from "./completion";
import { issueCertificateIfComplete } from "./issue";

/**
 * Where a learner stands with the certificate: issued (here too, if they met the rule since the
 * last check), or not yet, with the requirements and what each still needs.
 */
export type CertificateStanding = { certificate: Certificate; requirements: null } | { certificate: null; requirements: CompletionStatus | null };

export async function getCertificateStanding(params: { userId: string }): Promise<CertificateStanding> {
  const result = await issueCertificateIfComplete(params);
  if (result.status !== "not-met") return { certificate: result.certificate, requirements: null };
  return { certificate: null, requirements: result.facts ? evaluateCompletion(getCourse(), result.facts) : null };
}
