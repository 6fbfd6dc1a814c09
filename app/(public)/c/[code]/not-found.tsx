import { UnknownCertificateCode } from "@/components/certificate/verification-result";
import { AppFrame } from "@/components/shell/app-frame";
import { getCurrentUser } from "@/lib/auth/current-user";

export default async function UnknownCertificateCodePage() {
  return (
    <AppFrame user={await getCurrentUser()}>
      <UnknownCertificateCode />
    </AppFrame>
  );
}
