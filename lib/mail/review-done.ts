import { escapeHtml, type ComposedMail } from "./compose";
import { getTransport, mailSender } from "./transport";

export type ReviewDoneMail = {
  learnerName: string;
  exerciseTitle: string;
  reviewerName: string;
  decision: "accept" | "return";
  total: number;
  maxTotal: number;
  exerciseUrl: string;
};

export function composeReviewDoneMail(params: ReviewDoneMail): ComposedMail {
  const accepted = params.decision === "accept";
  const points = `${params.total} of ${params.maxTotal} points`;
  const outcome = accepted ? `accepted it with ${points}` : `returned it for another look (${points} so far)`;
  const next = accepted
    ? "The exercise page shows the points for each part of the rubric and the written feedback."
    : "The exercise page shows what to change. Fix it, then hand it in again for review.";
  const firstName = params.learnerName.split(/\s+/)[0] ?? params.learnerName;
  const text = [
    `Hello ${firstName},`,
    "",
    `${params.reviewerName} has reviewed your bench work on "${params.exerciseTitle}" and ${outcome}.`,
    next,
    "",
    "Open the exercise:",
    params.exerciseUrl,
  ].join("\n");
  const html = `<!doctype html>
<html lang="en">
<body style="margin:0;padding:24px;background:#f4f2ec;font-family:system-ui,sans-serif;color:#1f2a30;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9d4c7;border-radius:8px;padding:28px">
<p style="margin:0 0 20px;font-weight:700;color:#1d5c63;letter-spacing:0.02em">Edgewise</p>
<p style="margin:0 0 16px">Hello ${escapeHtml(firstName)},</p>
<p style="margin:0 0 16px">${escapeHtml(params.reviewerName)} has reviewed your bench work on <strong>${escapeHtml(params.exerciseTitle)}</strong> and ${escapeHtml(outcome)}.</p>
<p style="margin:0 0 16px">${escapeHtml(next)}</p>
<p style="margin:24px 0"><a href="${escapeHtml(params.exerciseUrl)}" style="display:inline-block;background:#1d5c63;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:6px;font-weight:600">Open the exercise</a></p>
<p style="margin:0;font-size:14px;color:#56606a">If the button does not work, copy this address into your browser:<br>${escapeHtml(params.exerciseUrl)}</p>
</div>
</body>
</html>`;
  const subject = accepted ? `Bench work accepted: ${params.exerciseTitle}` : `Bench work returned: ${params.exerciseTitle}`;
  return { subject, text, html };
}

export async function sendReviewDoneEmail(params: ReviewDoneMail & { to: string }): Promise<void> {
  const { to, ...content } = params;
  await getTransport().sendMail({ from: mailSender(), to, ...composeReviewDoneMail(content) });
}
