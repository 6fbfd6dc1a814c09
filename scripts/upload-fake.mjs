// Local stand-in for the hosted upload service, for development and tests only. It speaks the
// wire protocol of the uploadthing v7 SDK: route-metadata registration (and the dev-mode callback
// stream), HEAD + multipart PUT on HMAC-signed URLs with resumption, the signed upload-complete
// callback to the app and the callback-result hand-back, and the /v6 file API. Files are kept in
// UPLOAD_FAKE_DIR and are never served anonymously: GET /f/{key} needs the API key, so users only
// ever reach a file through the app's own access check.
import http from "node:http";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { once } from "node:events";

const apiKey = readApiKey(process.env.UPLOADTHING_TOKEN);
const dir = path.resolve(process.env.UPLOAD_FAKE_DIR ?? ".data/uploads-dev");
const ports = [...new Set([process.env.UPLOAD_FAKE_PORT ?? "54030", process.env.UPLOAD_FAKE_API_PORT].filter(Boolean))];
const validKey = /^[A-Za-z0-9_-]{1,128}$/;
const registrationWaitMs = 10_000; // in dev mode the SDK registers the keys concurrently with the client's PUT
const serverDataWaitMs = 30_000;
const devStreamTtlMs = 60 * 60_000;
const registrations = new Map(); // file key → deferred route metadata sent by the app's handler
const results = new Map(); // file key → deferred onUploadComplete result sent back by the app
const uploading = new Set();

class HttpError extends Error {
  constructor(status, message) { super(message); this.status = status; }
}

function readApiKey(token) {
  try {
    const parsed = JSON.parse(Buffer.from(token ?? "", "base64").toString("utf8"));
    if (typeof parsed.apiKey === "string" && parsed.apiKey.startsWith("sk_")) return parsed.apiKey;
  } catch {}
  console.error('Upload fake: UPLOADTHING_TOKEN must be base64 of JSON {"apiKey":"sk_…","appId":"…","regions":["…"]}.');
  process.exit(1);
}

const sign = (payload) => `hmac-sha256=${crypto.createHmac("sha256", apiKey).update(payload).digest("hex")}`;
const sameSecret = (a, b) => typeof a === "string" && a.length === b.length && crypto.timingSafeEqual(Buffer.from(a), Buffer.from(b));
const requireApiKey = (req) => { if (!sameSecret(req.headers["x-uploadthing-api-key"], apiKey)) throw new HttpError(401, "missing or wrong x-uploadthing-api-key"); };
const filePath = (key, suffix = "") => path.join(dir, key + suffix);
const readSidecar = (key) => JSON.parse(fs.readFileSync(filePath(key, ".json"), "utf8"));
const storedFiles = () => fs.readdirSync(dir).filter((n) => n.endsWith(".json")).map((n) => readSidecar(n.slice(0, -5)));
const sizeOf = (file) => (fs.existsSync(file) ? fs.statSync(file).size : 0);

function deferred(map, key) {
  if (!map.has(key)) {
    let resolve;
    const promise = new Promise((r) => (resolve = r));
    map.set(key, { promise, resolve });
  }
  return map.get(key);
}
const within = (promise, ms, message) =>
  Promise.race([promise, new Promise((_, reject) => setTimeout(() => reject(new HttpError(504, message)), ms).unref())]);

async function readJson(req) {
  let body = "";
  for await (const chunk of req) if ((body += chunk).length > 1_000_000) throw new HttpError(413, "JSON body too large");
  try { return JSON.parse(body || "{}"); } catch { throw new HttpError(400, "body is not JSON"); }
}

function send(res, status, body, headers = {}) {
  res.writeHead(status, { "content-type": "application/json", ...headers }).end(JSON.stringify(body));
}

// The SDK signs the whole URL (origin, key, expires, x-ut-* parameters) and appends the signature last.
function checkPresigned(req, url) {
  const cut = req.url.lastIndexOf("&signature=");
  if (cut < 0 || !sameSecret(url.searchParams.get("signature"), sign(`http://${req.headers.host}${req.url.slice(0, cut)}`))) {
    throw new HttpError(403, "invalid signature");
  }
  if (!(Number(url.searchParams.get("expires")) > Date.now())) throw new HttpError(403, "presigned URL has expired");
  const param = (name) => (url.searchParams.has(name) ? decodeURIComponent(url.searchParams.get(name)) : null);
  const size = Number(param("x-ut-file-size"));
  if (!Number.isSafeInteger(size)) throw new HttpError(400, "presigned URL carries no file size");
  return { name: param("x-ut-file-name"), size, type: param("x-ut-file-type"), slug: param("x-ut-slug"), customId: param("x-ut-custom-id") };
}

// Streams the `file` field of a multipart body to disk, holding back enough bytes to strip the
// closing boundary. Bytes written before an aborted request stay, so the client can resume.
async function receiveFile(req, partPath, start, limit) {
  const match = /boundary=(?:"([^"]+)"|([^;\s]+))/i.exec(req.headers["content-type"] ?? "");
  if (!match) throw new HttpError(400, "expected a multipart/form-data body");
  const closing = Buffer.from(`\r\n--${match[1] ?? match[2]}`);
  const hold = closing.length + 8;
  const out = fs.createWriteStream(partPath, { flags: start > 0 ? "a" : "w" });
  let head = Buffer.alloc(0), tail = null, written = start;
  const write = async (bytes) => {
    if ((written += bytes.length) > limit) throw new HttpError(413, "file is larger than the size it was signed for");
    if (!out.write(bytes)) await once(out, "drain");
  };
  try {
    for await (const chunk of req.iterator({ destroyOnReturn: false })) {
      if (tail === null) {
        head = Buffer.concat([head, chunk]);
        const end = head.indexOf("\r\n\r\n");
        if (end < 0) continue;
        if (!/name="file"/.test(head.subarray(0, end).toString())) throw new HttpError(400, "expected a form field named file");
        tail = head.subarray(end + 4);
      } else tail = Buffer.concat([tail, chunk]);
      if (tail.length > hold) { await write(tail.subarray(0, tail.length - hold)); tail = tail.subarray(tail.length - hold); }
    }
    const end = tail?.indexOf(closing) ?? -1;
    if (end < 0) throw new HttpError(400, "multipart body has no file part or no closing boundary");
    await write(tail.subarray(0, end));
  } finally {
    await new Promise((resolve) => out.end(resolve));
  }
  return written;
}

function registerRoute(res, body) {
  const pending = new Set(body.fileKeys ?? []);
  const route = { metadata: body.metadata ?? {}, callbackUrl: body.callbackUrl, slug: body.callbackSlug, awaitServerData: body.awaitServerData ?? true };
  if (body.isDev) {
    res.writeHead(200, { "content-type": "application/x-ndjson" }).flushHeaders();
    route.stream = res;
    route.delivered = (key) => { pending.delete(key); if (pending.size === 0) res.end(); };
    setTimeout(() => res.end(), devStreamTtlMs).unref();
  } else send(res, 200, { ok: true });
  for (const key of pending) {
    deferred(registrations, key).resolve(route);
    setTimeout(() => registrations.delete(key), devStreamTtlMs).unref();
  }
}

// Dev mode: a line on the handler's metadata stream, which it forwards to itself; otherwise a
// direct POST to the app, as the hosted service does.
async function deliverCallback(route, key, payload) {
  const line = { payload, signature: sign(payload), hook: "callback" };
  if (route.stream?.writable) {
    route.stream.write(`${JSON.stringify(line)}\n`);
    route.delivered(key);
    return;
  }
  const url = new URL(route.callbackUrl);
  url.searchParams.set("slug", route.slug);
  const reply = await fetch(url, { method: "POST", body: payload, headers: { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": line.signature } });
  if (!reply.ok) results.get(key)?.resolve({ error: `the app refused the upload callback (${reply.status})` });
}

async function upload(req, res, url, key) {
  const signed = checkPresigned(req, url);
  const stored = filePath(key), part = filePath(key, ".part");
  if (req.method === "HEAD") return res.writeHead(200, { "x-ut-range-start": String(sizeOf(part)) }).end();
  if (fs.existsSync(stored)) throw new HttpError(409, "this key has already been uploaded");
  if (uploading.has(key)) throw new HttpError(409, "an upload for this key is already in progress");
  const start = Number(/^bytes=(\d+)-/.exec(req.headers.range ?? "")?.[1] ?? 0);
  if (start !== 0 && start !== sizeOf(part)) return send(res, 416, { error: "range does not continue the stored part" }, { "x-ut-range-start": String(sizeOf(part)) });
  uploading.add(key);
  try {
    const size = await receiveFile(req, part, start, signed.size);
    if (size !== signed.size) throw new HttpError(400, `received ${size} bytes, signed for ${signed.size}`);
  } catch (error) {
    if (!error.status && req.destroyed) throw new HttpError(499, `client went away; ${sizeOf(part)} bytes kept for resumption`);
    fs.rmSync(part, { force: true });
    throw error;
  } finally {
    uploading.delete(key);
  }
  const fileHash = crypto.createHash("md5").update(fs.readFileSync(part)).digest("hex");
  fs.renameSync(part, stored);
  const fileUrl = `http://${req.headers.host}/f/${key}`;
  const file = { name: signed.name, size: signed.size, type: signed.type, customId: signed.customId, key, url: fileUrl, appUrl: fileUrl, ufsUrl: fileUrl, fileHash };
  fs.writeFileSync(filePath(key, ".json"), JSON.stringify({ ...file, uploadedAt: Date.now() }));
  let serverData = null;
  if (signed.slug) {
    const route = await within(deferred(registrations, key).promise, registrationWaitMs, "the app never registered this upload");
    registrations.delete(key);
    const payload = JSON.stringify({ status: "uploaded", metadata: route.metadata, file, origin: `http://${req.headers.host}` });
    const result = route.awaitServerData && deferred(results, key).promise;
    await deliverCallback(route, key, payload);
    if (result) {
      const outcome = await within(result, serverDataWaitMs, "the app did not report onUploadComplete's result").finally(() => results.delete(key));
      if (outcome.error) throw new HttpError(502, outcome.error);
      serverData = outcome.serverData;
    }
  }
  send(res, 200, { url: fileUrl, appUrl: fileUrl, ufsUrl: fileUrl, fileHash, serverData });
}

function matching(body) {
  const keys = new Set(body.fileKeys ?? []), ids = new Set(body.customIds ?? []);
  return storedFiles().filter((f) => keys.has(f.key) || (f.customId !== null && ids.has(f.customId)));
}

const fileApi = {
  deleteFiles(body) {
    const found = matching(body);
    for (const f of found) for (const suffix of ["", ".json"]) fs.rmSync(filePath(f.key, suffix), { force: true });
    return { success: true, deletedCount: found.length };
  },
  listFiles({ limit = 500, offset = 0 }) {
    const all = storedFiles().sort((a, b) => a.uploadedAt - b.uploadedAt);
    const files = all.slice(offset, offset + limit).map((f) => ({ id: f.key, customId: f.customId, key: f.key, name: f.name, size: f.size, status: "Uploaded", uploadedAt: f.uploadedAt }));
    return { hasMore: offset + limit < all.length, files };
  },
  getFileUrl: (body) => ({ data: matching(body).map((f) => ({ key: f.key, url: f.ufsUrl })) }),
  renameFiles({ updates = [] }) {
    for (const u of updates) for (const f of matching({ fileKeys: [u.fileKey], customIds: [u.customId] })) {
      fs.writeFileSync(filePath(f.key, ".json"), JSON.stringify({ ...f, name: u.newName }));
    }
    return { success: true };
  },
};

async function route(req, res) {
  const url = new URL(req.url, "http://local");
  const [, first, second] = url.pathname.split("/");
  if (req.method === "OPTIONS") return res.writeHead(204).end();
  if (req.method === "POST" && url.pathname === "/route-metadata") {
    requireApiKey(req);
    return registerRoute(res, await readJson(req));
  }
  if (req.method === "POST" && url.pathname === "/callback-result") {
    requireApiKey(req);
    const body = await readJson(req);
    results.get(body.fileKey)?.resolve(body.error ? { error: body.error } : { serverData: body.callbackData ?? null });
    return send(res, 200, { ok: true });
  }
  if (req.method === "POST" && first === "v6" && Object.hasOwn(fileApi, second)) {
    requireApiKey(req);
    return send(res, 200, fileApi[second](await readJson(req)));
  }
  if (req.method === "GET" && first === "f" && validKey.test(second ?? "")) {
    requireApiKey(req);
    if (!fs.existsSync(filePath(second, ".json"))) throw new HttpError(404, "no such file");
    const meta = readSidecar(second);
    res.writeHead(200, { "content-type": meta.type || "application/octet-stream", "content-length": meta.size, "x-content-type-options": "nosniff" });
    return fs.createReadStream(filePath(second)).pipe(res);
  }
  if ((req.method === "PUT" || req.method === "HEAD") && validKey.test(first) && !second) return upload(req, res, url, first);
  throw new HttpError(404, `${req.method} ${url.pathname} is not offered by the local upload fake`);
}

function handle(req, res) {
  const started = Date.now();
  res.setHeader("access-control-allow-origin", "*");
  res.setHeader("access-control-allow-methods", "GET, HEAD, PUT, POST, OPTIONS");
  res.setHeader("access-control-allow-headers", req.headers["access-control-request-headers"] ?? "*");
  res.setHeader("access-control-expose-headers", "x-ut-range-start");
  const log = (status, note) => console.log(`${req.method} ${req.url.split("?")[0]} ${status} ${Date.now() - started}ms${note}`);
  route(req, res).then(
    () => log(res.statusCode, ""),
    async (error) => {
      const status = error.status ?? 500;
      const message = error.status ? error.message : "internal error in the upload fake";
      if (!error.status) console.error(`Upload fake: ${error.stack ?? error}`);
      log(status, ` (${message})`);
      if (res.headersSent || res.destroyed) return res.destroy();
      // Clients only read the reply once their body is sent, so swallow the rest of it first.
      if (!req.complete && !req.destroyed) await once(req.resume(), "end").catch(() => {});
      send(res, status, { error: message });
    },
  );
}

fs.mkdirSync(dir, { recursive: true });
for (const port of ports) {
  const server = http.createServer(handle);
  server.on("error", (error) => {
    const reason = error.code === "EADDRINUSE" ? `port ${port} is already taken` : error.message;
    console.error(`Upload fake: cannot listen on 127.0.0.1:${port}: ${reason}.`);
    process.exit(1);
  });
  server.listen(Number(port), "127.0.0.1", () => {
    console.log(`Upload fake: listening on http://127.0.0.1:${server.address().port}, files in ${dir}`);
  });
}
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => process.exit(0));
