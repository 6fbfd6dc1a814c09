import type { Metadata } from "next";
import { VerificationResult } from "@/components/certificate/verification-result";
import { AppFrame } from "@/components/shell/app-frame";
import { readClientAddress } from "@/lib/auth/client-address";
import { getCurrentUser } from "@/lib/auth/current-user";
import { verifyCertificate } from "@/lib/certificates/verification";

export const metadata: Metadata = { title: "Certificate check", robots: { index: false, follow: false } };

export default async function CertificateCheckPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const [user, result] = await Promise.all([
    getCurrentUser(),
    readClientAddress().then((clientAddress) => verifyCertificate({ code, clientAddress })),
  ]);
  return (
    <AppFrame user={user}>
      <VerificationResult result={result} />
    </AppFrame>
  );
}
