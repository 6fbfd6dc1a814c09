import type { Metadata } from "next";
import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { Card } from "@/components/ui/card";
import { PageHeading } from "@/components/ui/page-heading";
import type { Certificate } from "@/db/schema";
import { getCourse } from "@/lessons";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { formatCertificateCode } from "@/lib/certificates/code";
import { evaluateCompletion } from "@/lib/certificates/completion";
import { formatCertificateDate } from "@/lib/certificates/dates";
import { issueCertificateIfComplete } from "@/lib/certificates/issue";
import { certificatePdfPath, verificationPath } from "@/lib/certificates/urls";
import { RequirementsList } from "./requirements-list";

export const metadata: Metadata = { title: "Your certificate" };

function IssuedCertificate({ certificate }: { certificate: Certificate }) {
  const summary = certificate.scoreSummary;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <Card>
        <h2 className="text-lg font-semibold">{certificate.courseTitle}</h2>
        <dl className="mt-3 grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[9rem_minmax(0,1fr)]">
          <dt className="text-ink-faint">Awarded to</dt>
          <dd className="font-medium">{certificate.learnerName}</dd>
          <dt className="text-ink-faint">School</dt>
          <dd>{certificate.schoolName}</dd>
          {certificate.cohortName ? (
            <>
              <dt className="text-ink-faint">Cohort</dt>
              <dd>{certificate.cohortName}</dd>
            </>
          ) : null}
          <dt className="text-ink-faint">Issued</dt>
          <dd>{formatCertificateDate(certificate.issuedAt)}</dd>
          <dt className="text-ink-faint">Verification code</dt>
          <dd className="font-mono">{formatCertificateCode(certificate.code)}</dd>
        </dl>
        <div className="mt-6 flex flex-wrap gap-3">
          <a href={certificatePdfPath(certificate.id)} className={buttonClass("primary")} download>
            Download the certificate (PDF)
          </a>
          {/* Not prefetched: each load of a check page counts against the address's look-up limit. */}
          <Link href={verificationPath(certificate.code)} prefetch={false} className={buttonClass("secondary")}>
            Open its public check page
          </Link>
        </div>
        <p className="mt-4 text-sm text-ink-soft">
          Anyone you show it to can scan its QR code or type the code at /verify to see that it is genuine. That page
          shows your name, the course, the school and the date, nothing else.
        </p>
      </Card>
      <Card>
        <h2 className="text-lg font-semibold">Results on the certificate</h2>
        <table className="mt-3 w-full text-left text-sm">
          <caption className="sr-only">Best passing score in each lab, and accepted bench work</caption>
          <tbody className="divide-y divide-line">
            {summary.labs.map((lab) => (
              <tr key={lab.slug}>
                <th scope="row" className="py-1.5 pr-3 font-normal">{lab.title}</th>
                <td className="py-1.5 text-right tabular-nums">{lab.bestScore}</td>
              </tr>
            ))}
            {summary.benchExercises.map((exercise) => (
              <tr key={exercise.slug}>
                <th scope="row" className="py-1.5 pr-3 font-normal">Bench: {exercise.title}</th>
                <td className="py-1.5 text-right tabular-nums">
                  {exercise.points}/{exercise.maxPoints}
                </td>
              </tr>
            ))}
            <tr>
              <th scope="row" className="py-2 pr-3 font-semibold">Average lab score</th>
              <td className="py-2 text-right font-semibold tabular-nums">{summary.averageScore}</td>
            </tr>
          </tbody>
        </table>
      </Card>
    </div>
  );
}

function RevokedCertificate({ certificate }: { certificate: Certificate }) {
  return (
    <Card className="border-danger/40">
      <h2 className="text-lg font-semibold text-danger">Revoked on {formatCertificateDate(certificate.revokedAt!)}</h2>
      <p className="mt-2 text-ink-soft">
        Your school revoked the certificate for {certificate.courseTitle}, so it can no longer be downloaded, and its
        public check page says that it was revoked.
      </p>
      <p className="mt-3">
        <span className="text-sm text-ink-faint">Reason given: </span>
        {certificate.revokeReason}
      </p>
      <p className="mt-3 text-sm text-ink-soft">If you think this is a mistake, talk to your school&apos;s Edgewise admin.</p>
    </Card>
  );
}

/**
 * The learner's certificate, issued here too if they have met the rule since it was last checked,
 * so a missed check after a lab or a review never leaves a graduate without one.
 */
export default async function CertificatePage() {
  const user = await requireRouteAccess("/certificate");
  const result = await issueCertificateIfComplete({ userId: user.id });

  if (result.status === "not-met") {
    const status = result.facts ? evaluateCompletion(getCourse(), result.facts) : null;
    const met = status ? [...status.labs.map((l) => l.met), ...status.benchExercises.map((b) => b.accepted)] : [];
    return (
      <AppFrame user={user}>
        <PageHeading
          eyebrow="Your certificate"
          title="Not earned yet"
          lead={`Complete ${getCourse().title} to earn your certificate: ${met.filter(Boolean).length} of ${met.length} requirements met so far. It is issued the moment you meet the last one.`}
        />
        {status ? (
          <Card>
            <RequirementsList status={status} />
          </Card>
        ) : null}
      </AppFrame>
    );
  }

  const { certificate } = result;
  return (
    <AppFrame user={user}>
      <PageHeading
        eyebrow="Your certificate"
        title={certificate.revokedAt ? "Certificate revoked" : "You have earned your certificate"}
        lead={certificate.revokedAt ? undefined : "Download it as a PDF to print or share. Its code lets anyone check it."}
      />
      {certificate.revokedAt ? <RevokedCertificate certificate={certificate} /> : <IssuedCertificate certificate={certificate} />}
    </AppFrame>
  );
}
