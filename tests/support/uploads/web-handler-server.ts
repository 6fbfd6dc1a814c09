// Serves a fetch-style handler (Request → Response) on 127.0.0.1, standing in for the Next.js
// route the app will mount, so the real uploadthing route handler runs behind real HTTP.
import http from "node:http";
import type { AddressInfo } from "node:net";

export type WebHandler = (request: Request) => Promise<Response>;

export async function serveWebHandler(handler: WebHandler) {
  const server = http.createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const origin = `http://${req.headers.host}`;
    const headers = new Headers();
    for (const [name, value] of Object.entries(req.headers)) if (typeof value === "string") headers.set(name, value);
    const hasBody = req.method !== "GET" && req.method !== "HEAD";
    const response = await handler(
      new Request(new URL(req.url ?? "/", origin), { method: req.method, headers, body: hasBody ? Buffer.concat(chunks) : undefined }),
    );
    res.writeHead(response.status, Object.fromEntries(response.headers));
    res.end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return {
    origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
