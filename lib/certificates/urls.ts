import { formatCertificateCode } from "./code";

/** The short public address of a certificate's verification page. */
export function verificationPath(code: string): string {
  return `/c/${formatCertificateCode(code)}`;
}

export function verificationUrl(appUrl: string, code: string): string {
  return `${appUrl}${verificationPath(code)}`;
}

export function certificatePdfPath(certificateId: string): string {
  return `/api/certificates/${certificateId}/pdf`;
}

/** The learner's own certificate page. */
export const learnerCertificatePath = "/certificate";
