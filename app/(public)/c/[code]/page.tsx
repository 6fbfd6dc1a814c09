import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { VerificationResult } from "@/components/certificate/verification-result";
import { AppFrame } from "@/components/shell/app-frame";
import { readClientAddress } from "@/lib/client-address/client-address";
import { getCurrentUser } from "@/lib/auth/current-user";
import { verifyCertificate } from "@/lib/certificates/verification";

export const metadata: Metadata = { title: "Certificate check", robots: { index: false, follow: false } };

export default async function CertificateCheckPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const result = await verifyCertificate({ code, clientAddress: await readClientAddress() });
  // Unknown and malformed codes get a real 404; the page for it is not-found.tsx beside this one.
  if (result.status === "not-found") notFound();
  return (
    <AppFrame user={await getCurrentUser()}>
      <VerificationResult result={result} />
    </AppFrame>
  );
}
