import type { Metadata } from "next";
import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCertificatesBySchool } from "@/db/queries/certificates";
import { findSchoolById } from "@/db/queries/schools";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { formatCertificateCode } from "@/lib/certificates/code";
import { formatCertificateDate } from "@/lib/certificates/dates";
import { signatoryOf } from "@/lib/certificates/signatory";
import { certificatePdfPath, verificationPath } from "@/lib/certificates/urls";
import { RevokeForm } from "./revoke-form";
import { SignatoryForm } from "./signatory-form";

export const metadata: Metadata = { title: "Certificates" };

export default async function SchoolCertificatesPage() {
  const admin = await requireRouteAccess("/certificates");
  const [certificates, school] = await Promise.all([
    listCertificatesBySchool({ schoolId: admin.schoolId }),
    findSchoolById({ schoolId: admin.schoolId }),
  ]);
  const signatory = school ? signatoryOf(school) : null;
  const revokedCount = certificates.filter((certificate) => certificate.revokedAt).length;

  return (
    <AppFrame user={admin}>
      <PageHeading
        eyebrow="School admin"
        title="Certificates"
        lead="Every certificate your school has issued. Revoke one when it should no longer stand: its public check page then says it was revoked, and it can no longer be downloaded."
      />
      <Card className="mb-6">
        <h2 className="text-lg font-semibold">Signed for the school</h2>
        <p className="mb-4 mt-1 max-w-3xl text-sm text-ink-soft">
          {signatory
            ? `Certificates are signed by ${signatory.name}, ${signatory.role}.`
            : "Nobody is named yet, so certificates carry no signatory."}{" "}
          The name and role are printed on each certificate issued from now on and on its public check page. Certificates
          already issued keep the signatory they were issued with.
        </p>
        <SignatoryForm current={signatory} />
      </Card>
      <Card>
        <h2 className="text-lg font-semibold">
          Issued ({certificates.length}
          {revokedCount > 0 ? `, ${revokedCount} revoked` : ""})
        </h2>
        {certificates.length === 0 ? (
          <p className="mt-2 text-ink-soft">No certificates yet. A learner gets one the moment they meet the course&apos;s completion rule.</p>
        ) : (
          <ul className="mt-3 divide-y divide-line">
            {certificates.map((certificate) => (
              <li key={certificate.id} className="grid gap-3 py-4 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
                <div>
                  <p className="font-medium">
                    {certificate.learnerName}
                    {certificate.revokedAt ? (
                      <span className="ml-2 rounded-full bg-danger-soft px-2 py-0.5 text-xs font-semibold text-danger">revoked</span>
                    ) : null}
                  </p>
                  <p className="text-sm text-ink-soft">
                    {certificate.courseTitle}
                    {certificate.cohortName ? ` · ${certificate.cohortName}` : ""} · issued {formatCertificateDate(certificate.issuedAt)}
                  </p>
                  <p className="mt-1 text-sm">
                    <span className="font-mono">{formatCertificateCode(certificate.code)}</span>
                    {" · "}
                    {/* Not prefetched: each load of a check page counts against the address's look-up limit. */}
                    <Link href={verificationPath(certificate.code)} prefetch={false}>
                      check page
                    </Link>
                    {certificate.revokedAt ? null : (
                      <>
                        {" · "}
                        <a href={certificatePdfPath(certificate.id)}>PDF</a>
                      </>
                    )}
                  </p>
                </div>
                <div>
                  {certificate.revokedAt ? (
                    <p className="text-sm text-ink-soft">
                      Revoked {formatMoment(certificate.revokedAt)}
                      {certificate.revokedByName ? ` by ${certificate.revokedByName}` : ""}: {certificate.revokeReason}
                    </p>
                  ) : (
                    <RevokeForm certificateId={certificate.id} learnerName={certificate.learnerName} />
                  )}
                </div>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </AppFrame>
  );
}
