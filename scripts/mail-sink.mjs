// Local SMTP sink for development and tests: accepts every message on 127.0.0.1 and keeps it
// (in MAIL_SINK_FILE, one JSON message a line, so a restart of `npm start` loses none; in memory
// when unset), and lists what it caught over a small JSON API so the dev mail page and the tests
// can read invitation and reset links. Never used in production.
import { appendFileSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

const smtpPort = Number(process.env.SMTP_PORT ?? 54025);
const apiPort = Number(process.env.MAIL_SINK_API_PORT ?? 54026);
const keptIn = process.env.MAIL_SINK_FILE || null;

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
        keep({
          id: nextId++,
          from: mail.from?.text ?? "",
          to: mail.to ? [mail.to].flat().map((a) => a.text).join(", ") : "",
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
  if (req.method === "DELETE") {
    messages.length = 0;
    if (keptIn) writeFileSync(keptIn, "");
    res.writeHead(204).end();
    return;
  }
  const to = url.searchParams.get("to")?.toLowerCase();
  const list = to ? messages.filter((m) => m.to.toLowerCase().includes(to)) : messages;
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
