// Pages the proxy answers itself, before the app renders anything: a status the app's pages
// cannot set (a page that has started rendering is a 200), a Retry-After, and a plain sentence for
// the person. They carry their own styles and no script, and reload themselves when it is time.

export type PlainPage = {
  status: number;
  title: string;
  paragraphs: string[];
  retryAfterSeconds: number;
  /** A "Try again now" button: for a wait that may end early (an outage), not for a limit's fixed one. */
  offerRetry: boolean;
};

const escapes: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => escapes[c]!);

const retryButton = `<a href="" style="display:inline-block;margin-top:20px;padding:10px 18px;border-radius:8px;background:#1d5c63;color:#fff;font-weight:600;text-decoration:none">Try again now</a>`;

function renderPlainPage(page: PlainPage): string {
  const paragraphs = page.paragraphs
    .map((text, i) => `<p style="line-height:1.55;color:#4a555c;margin:0${i < page.paragraphs.length - 1 ? " 0 10px" : ""}">${escapeHtml(text)}</p>`)
    .join("\n");
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${page.retryAfterSeconds}">
<title>${escapeHtml(page.title)}</title>
</head>
<body style="margin:0;font-family:system-ui,sans-serif;background:#f6f4ee;color:#1c2529">
<header style="border-bottom:1px solid #ddd8cc;background:#fff;padding:14px 20px;font-weight:700;font-size:18px">Edgewise</header>
<main style="max-width:560px;margin:0 auto;padding:56px 20px">
<h1 style="font-size:28px;margin:0 0 12px">${escapeHtml(page.title)}</h1>
${paragraphs}
${page.offerRetry ? retryButton : ""}
</main>
</body>
</html>
`;
}

export function plainPageResponse(page: PlainPage): Response {
  return new Response(renderPlainPage(page), {
    status: page.status,
    headers: {
      "content-type": "text/html; charset=utf-8",
      "cache-control": "no-store",
      "retry-after": String(page.retryAfterSeconds),
      "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'",
    },
  });
}
