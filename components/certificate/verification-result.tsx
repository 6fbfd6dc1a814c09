import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { formatStudyHours } from "@/lib/certificates/certification";
import { formatCertificateCode } from "@/lib/certificates/code";
import { formatCertificateDate } from "@/lib/certificates/dates";
import type { Verification } from "@/lib/certificates/verification";
import { describeWait } from "@/lib/http/errors";

const tones = {
  valid: "border-ok/40 bg-ok-soft text-ok",
  revoked: "border-danger/40 bg-danger-soft text-danger",
  "rate-limited": "border-copper/40 bg-copper-soft text-copper",
} as const;

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="py-3 sm:grid sm:grid-cols-[10rem_minmax(0,1fr)] sm:gap-4">
      <dt className="text-sm text-ink-faint">{label}</dt>
      <dd className="font-medium text-ink">{children}</dd>
    </div>
  );
}

/** The public answer for one code: what the certificate says when valid, only its state otherwise. */
export function VerificationResult({ result }: { result: Exclude<Verification, { status: "not-found" }> }) {
  const checkAnother = (
    <Link href="/verify" className={buttonClass("secondary")}>
      Check another code
    </Link>
  );
  return (
    <section className="mx-auto max-w-2xl" aria-labelledby="verification-title">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper">Certificate check</p>
      {result.status === "valid" ? (
        <>
          <h1 id="verification-title" className="mt-1 text-3xl font-semibold tracking-tight sm:text-4xl">
            This certificate is valid
          </h1>
          <p className={`mt-5 rounded-lg border px-4 py-3 font-medium ${tones.valid}`}>
            Issued by {result.schoolName} through Edgewise and not revoked.
          </p>
          <dl className="mt-6 divide-y divide-line rounded-card border border-line bg-surface px-5">
            <Fact label="Awarded to">{result.learnerName}</Fact>
            <Fact label="Course">{result.courseTitle}</Fact>
            <Fact label="School">{result.schoolName}</Fact>
            <Fact label="Issued">{formatCertificateDate(result.issuedAt)}</Fact>
            <Fact label="Study">{formatStudyHours(result.studyHours)}</Fact>
            <Fact label="Signed for the school">
              {result.signatory ? (
                <>
                  <span className="block">{result.signatory.name}</span>
                  <span className="block text-sm font-normal text-ink-soft">{result.signatory.role}</span>
                </>
              ) : (
                <span className="font-normal text-ink-soft">No signatory was named when it was issued.</span>
              )}
            </Fact>
            <Fact label="Code">
              <span className="font-mono">{formatCertificateCode(result.code)}</span>
            </Fact>
          </dl>
          <section aria-labelledby="competences-title" className="mt-6 rounded-card border border-line bg-surface px-5 py-4">
            <h2 id="competences-title" className="font-semibold text-ink">
              What the holder can do
            </h2>
            <p className="mt-1 text-sm text-ink-soft">What the course certifies, shown in its labs on the workbench and its bench exercises.</p>
            <ul className="mt-3 list-disc space-y-1.5 pl-5 text-ink marker:text-copper">
              {result.competences.map((competence) => (
                <li key={competence}>{competence}</li>
              ))}
            </ul>
          </section>
        </>
      ) : result.status === "revoked" ? (
        <>
          <h1 id="verification-title" className="mt-1 text-3xl font-semibold tracking-tight sm:text-4xl">
            This certificate was revoked
          </h1>
          <p className={`mt-5 rounded-lg border px-4 py-3 font-medium ${tones.revoked}`}>
            {result.schoolName} revoked it on {formatCertificateDate(result.revokedAt)}. It no longer certifies completion of{" "}
            {result.courseTitle}.
          </p>
          <dl className="mt-6 divide-y divide-line rounded-card border border-line bg-surface px-5">
            <Fact label="Code">
              <span className="font-mono">{formatCertificateCode(result.code)}</span>
            </Fact>
            <Fact label="Revoked">{formatCertificateDate(result.revokedAt)}</Fact>
          </dl>
          <p className="mt-4 text-sm text-ink-soft">For the reason, ask the school that issued it.</p>
        </>
      ) : (
        <>
          <p className="mt-1 font-mono text-sm font-semibold text-copper">429</p>
          <h1 id="verification-title" className="mt-1 text-3xl font-semibold tracking-tight sm:text-4xl">
            Too many checks from your network
          </h1>
          <p className={`mt-5 rounded-lg border px-4 py-3 font-medium ${tones["rate-limited"]}`}>
            Wait {describeWait(result.retryAfterSeconds)}, then load this page again. Checks are limited per network
            address to keep the service fair for everyone.
          </p>
        </>
      )}
      <div className="mt-8 flex flex-wrap gap-3">{checkAnother}</div>
    </section>
  );
}

/** The answer for a code no certificate has, malformed or unknown alike: served with a 404. */
export function UnknownCertificateCode() {
  return (
    <section className="mx-auto max-w-2xl" aria-labelledby="verification-title">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper">Certificate check</p>
      <h1 id="verification-title" className="mt-1 text-3xl font-semibold tracking-tight sm:text-4xl">
        No certificate has this code
      </h1>
      <p className="mt-5 rounded-lg border border-line-strong bg-sunken px-4 py-3 font-medium text-ink-soft">
        Check the code against the certificate: it has sixteen letters and digits in four groups, such as
        7K2M-QX9P-4TDW-8HBN.
      </p>
      <div className="mt-8 flex flex-wrap gap-3">
        <Link href="/verify" className={buttonClass("secondary")}>
          Check another code
        </Link>
      </div>
    </section>
  );
}
