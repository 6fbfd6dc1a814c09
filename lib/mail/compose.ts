// Builds the plain-text and HTML bodies of our e-mails. Every value that came from a person is
// escaped before it goes into HTML.

export type ComposedMail = { subject: string; text: string; html: string };

export function escapeHtml(value: string): string {
  return value
    .replaceAll("&", "&amp;")
    .replaceAll("<", "&lt;")
    .replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;")
    .replaceAll("'", "&#39;");
}

export function layoutHtml(paragraphs: string[], link: { href: string; label: string }, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${p}</p>`).join("\n");
  return `<!doctype html>
<html lang="en">
<body style="margin:0;padding:24px;background:#f4f2ec;font-family:system-ui,sans-serif;color:#1f2a30;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9d4c7;border-radius:8px;padding:28px">
<p style="margin:0 0 20px;font-weight:700;color:#1d5c63;letter-spacing:0.02em">Edgewise</p>
${body}
<p style="margin:24px 0"><a href="${escapeHtml(link.href)}" style="display:inline-block;background:#1d5c63;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:6px;font-weight:600">${escapeHtml(link.label)}</a></p>
<p style="margin:0 0 8px;font-size:14px;color:#56606a">If the button does not work, copy this address into your browser:<br>${escapeHtml(link.href)}</p>
<p style="margin:16px 0 0;font-size:13px;color:#56606a">${footer}</p>
</div>
</body>
</html>`;
}

export function composeInvitationMail(params: {
  schoolName: string;
  cohortName: string | null;
  inviterName: string | null;
  acceptUrl: string;
  expiresAt: Date;
}): ComposedMail {
  const where = params.cohortName ? `the ${params.cohortName} cohort at ${params.schoolName}` : params.schoolName;
  const who = params.inviterName ? `${params.inviterName} has invited you` : "You have been invited";
  const expires = formatExpiry(params.expiresAt);
  const text = [
    `${who} to join ${where} on Edgewise, the course on addressable-LED data lines.`,
    "",
    "Open this link to choose your password and sign in:",
    params.acceptUrl,
    "",
    `The link works once and expires ${expires}.`,
    "If you were not expecting this invitation, you can ignore this message.",
  ].join("\n");
  const html = layoutHtml(
    [
      `${escapeHtml(who)} to join <strong>${escapeHtml(where)}</strong> on Edgewise, the course on addressable-LED data lines.`,
      "Choose your password to set up your account.",
    ],
    { href: params.acceptUrl, label: "Set up my account" },
    `The link works once and expires ${escapeHtml(expires)}. If you were not expecting this invitation, you can ignore this message.`,
  );
  return { subject: `Your invitation to ${params.schoolName} on Edgewise`, text, html };
}

export function composePasswordResetMail(params: { name: string; resetUrl: string; expiresAt: Date }): ComposedMail {
  const expires = formatExpiry(params.expiresAt);
  const text = [
    `Hello ${params.name},`,
    "",
    "Someone asked to reset the password of your Edgewise account. To choose a new one, open:",
    params.resetUrl,
    "",
    `The link works once and expires ${expires}. Choosing a new password signs you out everywhere else.`,
    "If you did not ask for this, ignore this message: your password stays as it is.",
  ].join("\n");
  const html = layoutHtml(
    [
      `Hello ${escapeHtml(params.name)},`,
      "Someone asked to reset the password of your Edgewise account. To choose a new one, use the button below.",
    ],
    { href: params.resetUrl, label: "Choose a new password" },
    `The link works once and expires ${escapeHtml(expires)}. Choosing a new password signs you out everywhere else. If you did not ask for this, ignore this message: your password stays as it is.`,
  );
  return { subject: "Reset your Edgewise password", text, html };
}

function formatExpiry(date: Date): string {
  return `on ${date.toISOString().slice(0, 16).replace("T", " at ")} UTC`;
}
