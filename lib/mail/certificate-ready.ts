import { escapeHtml, type ComposedMail } from "./compose";
import { deliverMail } from "./transport";

export type CertificateReadyMail = {
  learnerName: string;
  courseTitle: string;
  schoolName: string;
  certificateUrl: string;
  verificationUrl: string;
};

export function composeCertificateReadyMail(params: CertificateReadyMail): ComposedMail {
  const firstName = params.learnerName.split(/\s+/)[0] || params.learnerName;
  const text = [
    `Hello ${firstName},`,
    "",
    `You have completed "${params.courseTitle}" at ${params.schoolName}. Your certificate is ready.`,
    "",
    "Download it (PDF) from your certificate page:",
    params.certificateUrl,
    "",
    "Anyone can check that it is genuine at this address, which the QR code on the certificate also opens:",
    params.verificationUrl,
  ].join("\n");
  const html = `<!doctype html>
<html lang="en">
<body style="margin:0;padding:24px;background:#f4f2ec;font-family:system-ui,sans-serif;color:#1f2a30;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9d4c7;border-radius:8px;padding:28px">
<p style="margin:0 0 20px;font-weight:700;color:#1d5c63;letter-spacing:0.02em">Edgewise</p>
<p style="margin:0 0 16px">Hello ${escapeHtml(firstName)},</p>
<p style="margin:0 0 16px">You have completed <strong>${escapeHtml(params.courseTitle)}</strong> at ${escapeHtml(params.schoolName)}. Your certificate is ready.</p>
<p style="margin:24px 0"><a href="${escapeHtml(params.certificateUrl)}" style="display:inline-block;background:#1d5c63;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:6px;font-weight:600">Get my certificate</a></p>
<p style="margin:0 0 16px;font-size:14px;color:#56606a">If the button does not work, copy this address into your browser:<br>${escapeHtml(params.certificateUrl)}</p>
<p style="margin:0;font-size:14px;color:#56606a">Anyone can check that it is genuine at ${escapeHtml(params.verificationUrl)} (the QR code on the certificate opens the same page).</p>
</div>
</body>
</html>`;
  return { subject: `Your certificate for ${params.courseTitle}`, text, html };
}

export async function sendCertificateReadyEmail(params: CertificateReadyMail & { schoolId: string; to: string }): Promise<void> {
  const { schoolId, to, ...content } = params;
  await deliverMail({ schoolId, to, mail: composeCertificateReadyMail(content) });
}
