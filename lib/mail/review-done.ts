import { escapeHtml, layoutHtml, type ComposedMail } from "./compose";
import { deliverMail } from "./transport";

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
  const html = layoutHtml(
    [
      `Hello ${escapeHtml(firstName)},`,
      `${escapeHtml(params.reviewerName)} has reviewed your bench work on <strong>${escapeHtml(params.exerciseTitle)}</strong> and ${escapeHtml(outcome)}.`,
      escapeHtml(next),
    ],
    { href: params.exerciseUrl, label: "Open the exercise" },
    "You receive this because you handed in bench work on Edgewise.",
  );
  const subject = accepted ? `Bench work accepted: ${params.exerciseTitle}` : `Bench work returned: ${params.exerciseTitle}`;
  return { subject, text, html };
}

export async function sendReviewDoneEmail(params: ReviewDoneMail & { schoolId: string; to: string }): Promise<void> {
  const { schoolId, to, ...content } = params;
  await deliverMail({ schoolId, to, mail: composeReviewDoneMail(content) });
}
