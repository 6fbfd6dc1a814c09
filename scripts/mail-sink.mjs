// Local SMTP sink for development and tests: accepts every message on 127.0.0.1 and keeps it in
// memory, and lists what it caught over a small JSON API so the dev mail page and the tests can
// read invitation and reset links. Never used in production.
import http from "node:http";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

const smtpPort = Number(process.env.SMTP_PORT ?? 54025);
const apiPort = Number(process.env.MAIL_SINK_API_PORT ?? 54026);
const messages = [];
let nextId = 1;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, _session, callback) {
    simpleParser(stream)
      .then((mail) => {
        messages.push({
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
console.log(`Mail sink: SMTP on 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${apiPort}/messages`);
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => process.exit(0));
