// The page every page route answers while the database is out of reach: status 503 with a
// Retry-After, so browsers, crawlers and load balancers know it is temporary, and a plain
// sentence for the person. It carries its own styles and no script, and reloads itself.

const retryAfterSeconds = 15;

const html = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${retryAfterSeconds}">
<title>Edgewise is briefly unavailable</title>
</head>
<body style="margin:0;font-family:system-ui,sans-serif;background:#f6f4ee;color:#1c2529">
<header style="border-bottom:1px solid #ddd8cc;background:#fff;padding:14px 20px;font-weight:700;font-size:18px">Edgewise</header>
<main style="max-width:560px;margin:0 auto;padding:56px 20px">
<h1 style="font-size:28px;margin:0 0 12px">Edgewise is briefly unavailable</h1>
<p style="line-height:1.55;color:#4a555c;margin:0 0 10px">We cannot reach our records at the moment, so this page cannot be shown. Work you saved before is safe.</p>
<p style="line-height:1.55;color:#4a555c;margin:0">This page tries again by itself every ${retryAfterSeconds} seconds.</p>
<a href="" style="display:inline-block;margin-top:20px;padding:10px 18px;border-radius:8px;background:#1d5c63;color:#fff;font-weight:600;text-decoration:none">Try again now</a>
</main>
</body>
</html>
`;

export function unavailablePageResponse(): Response {
  return new Response(html, {
    status: 503,
    headers: {
      "content-type": "text/html; charset=utf-8",
      "cache-control": "no-store",
      "retry-after": String(retryAfterSeconds),
      "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'",
    },
  });
}
