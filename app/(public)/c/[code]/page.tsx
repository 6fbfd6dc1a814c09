import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { VerificationResult } from "@/components/certificate/verification-result";
import { AppFrame } from "@/components/shell/app-frame";
import { getCurrentUser } from "@/lib/auth/current-user";
import { verifyCountedCertificate } from "@/lib/certificates/verification";

export const metadata: Metadata = { title: "Certificate check", robots: { index: false, follow: false } };

export default async function CertificateCheckPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  // proxy.ts has counted this look-up against the address's limit, and answered 429 over it.
  const result = await verifyCountedCertificate({ code });
  // Unknown and malformed codes get a real 404; the page for it is not-found.tsx beside this one.
  if (result.status === "not-found") notFound();
  return (
    <AppFrame user={await getCurrentUser()}>
      <VerificationResult result={result} />
    </AppFrame>
  );
}
