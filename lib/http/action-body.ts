import { Readable } from "node:stream";
import busboy from "busboy";
import { findReplyProblem, type ReplyPart } from "./action-reply";

// Whether Next can read a POST to a page as a server action. Next decides from the headers as
// below (next/dist/server/lib/server-action-request-meta) and parses the body as it does here:
// busboy for a script's multipart call, the platform's form-data parser for a no-script form, UTF-8
// text otherwise. Where Next's parse or React's decoding would throw, Next answers 500; this check
// runs first, on the body already read within its limit, so the proxy can answer 400 instead.

const unreadable = "This form could not be read, so it was not accepted. Reload the page and send it again.";

/** The problem with a POST to a page, as a sentence for the sender, or null when Next can read it. */
export async function findActionBodyProblem(headers: Headers, body: Uint8Array<ArrayBuffer>): Promise<string | null> {
  const contentType = headers.get("content-type");
  const multipart = contentType?.startsWith("multipart/form-data") ?? false;
  if (headers.has("next-action")) {
    if (contentType === "application/x-www-form-urlencoded") return unreadable;
    const problem = multipart
      ? findReplyProblemIn(await readMultipartParts(contentType!, body))
      : findReplyProblem((id) => (id === 0 ? Buffer.from(body).toString("utf8") : undefined), "arguments");
    return problem && `${unreadable} ${problem}`;
  }
  if (!multipart) return null;
  const form = await readForm(contentType!, body);
  const problem = form === null ? "Its multipart body is malformed." : findNoScriptActionProblem(form);
  return problem && `${unreadable} ${problem}`;
}

type Parts = { fields: Map<string, string[]>; problem: string | null };

/** The text fields of a multipart body as busboy reads them, with Next's settings; files are checked, not kept. */
function readMultipartParts(contentType: string, body: Uint8Array): Promise<Parts> {
  return new Promise((resolve) => {
    const fields = new Map<string, string[]>();
    const settle = (problem: string | null) => resolve({ fields, problem });
    let parser: busboy.Busboy;
    try {
      parser = busboy({ headers: { "content-type": contentType }, defParamCharset: "utf8", limits: { fieldSize: body.byteLength + 1 } });
    } catch {
      return settle("Its multipart content type names no boundary it can be read with.");
    }
    parser.on("field", (name, value) => fields.set(name, [...(fields.get(name) ?? []), value]));
    parser.on("file", (_name, stream, info) => {
      // React refuses base64-encoded file parts.
      if (info.encoding.toLowerCase() === "base64") settle("It holds a base64-encoded file.");
      stream.resume();
    });
    parser.on("error", () => settle("Its multipart body is malformed."));
    parser.on("close", () => settle(null));
    Readable.from([Buffer.from(body)]).pipe(parser);
  });
}

/** The reply's numbered parts are fields named by their number; React reads a part given twice differently by parser. */
function findReplyProblemIn({ fields, problem }: Parts): string | null {
  if (problem) return problem;
  for (const [name, values] of fields) if (/^[0-9]+$/.test(name) && values.length > 1) return `Part ${name} is given twice.`;
  const part: ReplyPart = (id) => fields.get(String(id))?.[0];
  return findReplyProblem(part, "arguments");
}

async function readForm(contentType: string, body: Uint8Array<ArrayBuffer>): Promise<FormData | null> {
  try {
    return await new Response(body, { headers: { "content-type": contentType } }).formData();
  } catch {
    return null;
  }
}

/**
 * A form posted without scripts names its action in a field: `$ACTION_ID_<id>`, or
 * `$ACTION_REF_<n>` with the action and its bound arguments in reply parts `$ACTION_<n>:<part>`.
 * Next checks the ids; the parts are React's to decode, and checked here.
 */
function findNoScriptActionProblem(form: FormData): string | null {
  const keys = [...form.keys()];
  if (!keys.some((key) => key.startsWith("$ACTION_ID_") || key.startsWith("$ACTION_REF_"))) return "It names no action.";
  for (const key of keys) {
    const ref = /^\$ACTION_REF_(.*)$/.exec(key);
    if (!ref) continue;
    const prefix = `$ACTION_${ref[1]}:`;
    const part: ReplyPart = (id) => {
      const values = form.getAll(`${prefix}${id}`);
      return values.length === 1 && typeof values[0] === "string" ? values[0] : undefined;
    };
    const problem = findReplyProblem(part, "descriptor");
    if (problem) return problem;
  }
  return null;
}
