import { createRequire } from "node:module";
import { fetchFrom } from "../../support/loopback-client";
import { baseUrl } from "./browser";

// Calls server actions over HTTP the way the app's own browser code does: a POST to a page with
// the action's id in the Next-Action header and the arguments encoded by React's encodeReply
// (multipart form data once a FormData is among them, JSON text otherwise). The encoder is the
// copy of React that Next bundles, so the wire format is the one the server decodes.

const require = createRequire(import.meta.url);
const { encodeReply } = require("next/dist/compiled/react-server-dom-webpack/client.node.js") as {
  encodeReply: (value: unknown[]) => Promise<string | FormData>;
};

export type ActionCall = {
  /** The app's address; defaults to the suite's app. */
  baseUrl?: string;
  /** The page the form lives on, as a concrete path. */
  path: string;
  actionId: string;
  args: unknown[];
  cookie?: string;
  /** Defaults to the app's own origin, as a browser sends on a same-origin POST. */
  origin?: string;
  headers?: Record<string, string>;
  /** The loopback address to connect from (uniqueLoopbackAddress), so the call has a client address of its own. */
  from?: string;
};

export type ActionReply = {
  status: number;
  body: string;
  /** Where the action sent the browser (redirect() inside the action), or null. */
  redirect: string | null;
  /** The action's return value; undefined when it threw or was refused before running. */
  result: unknown;
  /** The action threw (or was refused by the framework), so no return value came back. */
  threw: boolean;
  /** The cookies the answer set, as `name=value`. */
  cookies: string[];
  headers: Headers;
};

export async function callAction(call: ActionCall): Promise<ActionReply> {
  const body = await encodeReply(call.args);
  const appUrl = call.baseUrl ?? baseUrl;
  const send = call.from ? fetchFrom.bind(null, call.from) : fetch;
  const response = await send(`${appUrl}${call.path}`, {
    method: "POST",
    redirect: "manual",
    headers: {
      accept: "text/x-component",
      "next-action": call.actionId,
      origin: call.origin ?? appUrl,
      ...(typeof body === "string" ? { "content-type": "text/plain;charset=UTF-8" } : {}),
      ...(call.cookie ? { cookie: call.cookie } : {}),
      ...call.headers,
    },
    body,
  });
  const text = await response.text();
  const redirectHeader = response.headers.get("x-action-redirect");
  const reply = readActionResult(text);
  const cookies = response.headers.getSetCookie().map((cookie) => cookie.split(";")[0]!);
  return { status: response.status, body: text, redirect: redirectHeader ? redirectHeader.split(";")[0]! : null, ...reply, cookies, headers: response.headers };
}

/**
 * The app's actions answer a refusal with a state the form shows: `{ status: "error" }` (form
 * states), `{ status: "problem" }` (the roster import) or `{ ok: false }` (the bench uploader's).
 */
export function isRefusalState(result: unknown): result is { message?: unknown } {
  const state = result as { status?: unknown; ok?: unknown } | null | undefined;
  return state?.status === "error" || state?.status === "problem" || state?.ok === false;
}

/**
 * The return value out of a React Flight response: row 0 is `{"a": "$@<row>", …}` and that row
 * holds the value, or `E{…}` when the action threw. Long strings arrive as separate text rows
 * (`<row>:T<hex length>,<text>`) referenced as "$<row>"; those are resolved, nothing else is.
 */
export function readActionResult(flight: string): { result: unknown; threw: boolean } {
  const rows = splitRows(flight);
  const root = rows.get("0");
  if (!root || !root.startsWith("{")) return { result: undefined, threw: true };
  const reference = (JSON.parse(root) as { a?: unknown }).a;
  if (typeof reference !== "string" || !reference.startsWith("$@")) return { result: undefined, threw: true };
  const row = rows.get(reference.slice(2)) ?? "";
  if (row.startsWith("E")) return { result: undefined, threw: true };
  return { result: resolve(JSON.parse(row), rows), threw: false };
}

function splitRows(flight: string): Map<string, string> {
  const bytes = Buffer.from(flight, "utf8");
  const rows = new Map<string, string>();
  let at = 0;
  while (at < bytes.length) {
    const colon = bytes.indexOf(":", at);
    if (colon < 0) break;
    const id = bytes.subarray(at, colon).toString("utf8");
    const textRow = /^T([0-9a-f]+),/.exec(bytes.subarray(colon + 1, colon + 20).toString("latin1"));
    if (textRow) {
      const start = colon + 2 + textRow[1]!.length + 1;
      const end = start + parseInt(textRow[1]!, 16);
      rows.set(id, `T${bytes.subarray(start, end).toString("utf8")}`);
      at = end;
      continue;
    }
    const newline = bytes.indexOf("\n", colon);
    const end = newline < 0 ? bytes.length : newline;
    rows.set(id, bytes.subarray(colon + 1, end).toString("utf8"));
    at = end + 1;
  }
  return rows;
}

function resolve(value: unknown, rows: Map<string, string>): unknown {
  if (typeof value === "string") {
    if (value.startsWith("$$")) return value.slice(1);
    const reference = /^\$([0-9a-f]+)$/.exec(value);
    const row = reference ? rows.get(reference[1]!) : undefined;
    if (row === undefined) return value;
    return row.startsWith("T") ? row.slice(1) : resolve(JSON.parse(row), rows);
  }
  if (Array.isArray(value)) return value.map((item) => resolve(item, rows));
  if (value && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([key, item]) => [key, resolve(item, rows)]));
  }
  return value;
}
