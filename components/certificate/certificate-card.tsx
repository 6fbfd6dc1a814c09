import Link from "next/link";
import { Card } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button-class";
import { getCourse } from "@/lessons";
import { formatCertificateCode } from "@/lib/certificates/code";
import { evaluateCompletion } from "@/lib/certificates/completion";
import { issueCertificateIfComplete } from "@/lib/certificates/issue";
import { learnerCertificatePath } from "@/lib/certificates/urls";

/**
 * For the learner's home: where they stand with the certificate, linking to its page. It checks the
 * completion rule as it renders, so a graduate's certificate appears here even if no earlier check ran.
 */
export async function CertificateCard({ userId }: { userId: string }) {
  const result = await issueCertificateIfComplete({ userId });
  if (result.status === "not-met") {
    const status = result.facts ? evaluateCompletion(getCourse(), result.facts) : null;
    const met = status ? [...status.labs.map((lab) => lab.met), ...status.benchExercises.map((exercise) => exercise.accepted)] : [];
    return (
      <Card>
        <h2 className="text-lg font-semibold">Certificate</h2>
        <p className="mt-2 text-sm text-ink-soft">
          {met.filter(Boolean).length} of {met.length} requirements met. It is issued the moment you meet the last one.
        </p>
        <Link href={learnerCertificatePath} className="mt-3 inline-block text-sm font-semibold">
          See what is left →
        </Link>
      </Card>
    );
  }
  const { certificate } = result;
  return (
    <Card>
      <h2 className="text-lg font-semibold">{certificate.revokedAt ? "Certificate revoked" : "Your certificate is ready"}</h2>
      <p className="mt-2 text-sm text-ink-soft">
        {certificate.revokedAt
          ? "Your school revoked it. Its page says why."
          : `Code ${formatCertificateCode(certificate.code)}. Download it as a PDF from its page.`}
      </p>
      <Link href={learnerCertificatePath} className={buttonClass(certificate.revokedAt ? "secondary" : "primary", "mt-3")}>
        {certificate.revokedAt ? "Open the certificate page" : "Get my certificate"}
      </Link>
    </Card>
  );
}
