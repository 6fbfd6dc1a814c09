// Local SMTP sink for development and tests: accepts every message on 127.0.0.1 and keeps it
// (in MAIL_SINK_FILE, one JSON message a line, so a restart of `npm start` loses none; in memory
// when unset), and lists what it caught over a small JSON API so the dev mail page and the tests
// can read invitation and reset links. The messages hold sign-in links, so the API answers only
// requests bearing MAIL_SINK_TOKEN (the scripts keep it in .data/mail-<profile>.token). Never
// used in production.
import { timingSafeEqual } from "node:crypto";
import { appendFileSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

const smtpPort = Number(process.env.SMTP_PORT ?? 54025);
const apiPort = Number(process.env.MAIL_SINK_API_PORT ?? 54026);
const keptIn = process.env.MAIL_SINK_FILE || null;
const token = process.env.MAIL_SINK_TOKEN ?? "";
if (token.length < 16) {
  console.error("Mail sink: MAIL_SINK_TOKEN must be set (16 characters or more); the scripts keep one in .data/mail-<profile>.token.");
  process.exit(1);
}
const expectedAuthorization = Buffer.from(`Bearer ${token}`);

function isAuthorized(req) {
  const given = Buffer.from(req.headers.authorization ?? "");
  return given.length === expectedAuthorization.length && timingSafeEqual(given, expectedAuthorization);
}

function keptMessages() {
  if (!keptIn || !existsSync(keptIn)) return [];
  // A line cut short by a crash mid-write is dropped; every whole line is a message.
  return readFileSync(keptIn, "utf8")
    .split("\n")
    .flatMap((line) => {
      try {
        return line ? [JSON.parse(line)] : [];
      } catch {
        return [];
      }
    });
}

const messages = keptMessages();
let nextId = messages.reduce((max, m) => Math.max(max, m.id), 0) + 1;

function keep(message) {
  messages.push(message);
  if (keptIn) appendFileSync(keptIn, `${JSON.stringify(message)}\n`);
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, _session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const to = mail.to ? [mail.to].flat() : [];
        keep({
          id: nextId++,
          from: mail.from?.text ?? "",
          to: to.map((a) => a.text).join(", "),
          recipients: to.flatMap((a) => a.value.map((v) => v.address?.toLowerCase() ?? "")).filter(Boolean),
          // The school the app sent the message for (lib/mail/transport.ts), which the caught-mail page filters on.
          school: String(mail.headers.get("x-edgewise-school") ?? ""),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : "",
          date: (mail.date ?? new Date()).toISOString(),
        });
        callback();
      })
      .catch(callback);
  },
});

const api = http.createServer((req, res) => {
  const url = new URL(req.url ?? "/", `http://127.0.0.1:${apiPort}`);
  if (url.pathname !== "/messages") {
    res.writeHead(404).end();
    return;
  }
  if (!isAuthorized(req)) {
    res.writeHead(401, { "www-authenticate": "Bearer", "content-type": "text/plain" }).end("This mail sink's API needs its token: Authorization: Bearer <MAIL_SINK_TOKEN>.\n");
    return;
  }
  if (req.method === "DELETE") {
    messages.length = 0;
    if (keptIn) writeFileSync(keptIn, "");
    res.writeHead(204).end();
    return;
  }
  const to = url.searchParams.get("to")?.toLowerCase();
  const school = url.searchParams.get("school");
  const list = messages.filter((m) => (!to || m.to.toLowerCase().includes(to)) && (school === null || m.school === school));
  res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify([...list].reverse()));
});

function listenOrExplain(server, port, what) {
  server.on("error", (error) => {
    const reason = error.code === "EADDRINUSE" ? `port ${port} is already taken` : error.message;
    console.error(`Mail sink: cannot open the ${what} on 127.0.0.1:${port}: ${reason}.`);
    process.exit(1);
  });
  server.listen(port, "127.0.0.1");
}

listenOrExplain(smtp, smtpPort, "SMTP port");
listenOrExplain(api, apiPort, "message list");
console.log(`Mail sink: SMTP on 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${apiPort}/messages, ${keptIn ? `kept in ${keptIn} (${messages.length} so far)` : "kept in memory"}`);
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => process.exit(0));
