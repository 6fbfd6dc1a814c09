import Link from "next/link";
import { Card } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button-class";
import { formatCertificateCode } from "@/lib/certificates/code";
import type { CertificateStanding } from "@/lib/certificates/standing";
import { certificatePdfPath, learnerCertificatePath } from "@/lib/certificates/urls";

/**
 * For the learner's home: where they stand with the certificate, and once it is issued its PDF to
 * download, beside a link to its page. The standing is read with the completion rule checked, so a
 * graduate's certificate appears here even if no earlier check ran.
 */
export function CertificateCard({ standing }: { standing: CertificateStanding }) {
  if (!standing.certificate) {
    const status = standing.requirements;
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
  const { certificate } = standing;
  if (certificate.revokedAt) {
    return (
      <Card>
        <h2 className="text-lg font-semibold">Certificate revoked</h2>
        <p className="mt-2 text-sm text-ink-soft">Your school revoked it. Its page says why.</p>
        <Link href={learnerCertificatePath} className={buttonClass("secondary", "mt-3")}>
          Open the certificate page
        </Link>
      </Card>
    );
  }
  return (
    <Card>
      <h2 className="text-lg font-semibold">Your certificate is ready</h2>
      <p className="mt-2 text-sm text-ink-soft">Code {formatCertificateCode(certificate.code)}. Anyone can check it by this code.</p>
      <div className="mt-3 flex flex-wrap gap-3">
        <a href={certificatePdfPath(certificate.id)} className={buttonClass("primary")} download>
          Download the certificate (PDF)
        </a>
        <Link href={learnerCertificatePath} className={buttonClass("secondary")}>
          Open its page
        </Link>
      </div>
    </Card>
  );
}
