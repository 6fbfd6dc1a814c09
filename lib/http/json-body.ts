import type { BodyLimit } from "./body-limits";
import { readBodyWithin } from "./bounded-body";
import { AppError } from "./errors";

/**
 * A route handler's JSON body, read within its limit. Only application/json is read, so a
 * cross-site form post (which cannot send that type) is refused before its body is touched.
 */
export async function readJsonBody(request: Request, limit: BodyLimit): Promise<unknown> {
  const type = request.headers.get("content-type")?.toLowerCase() ?? "";
  if (!/^application\/json\s*(;|$)/.test(type)) {
    throw new AppError("bad-request", `${limit.what} must be sent as application/json.`);
  }
  const bytes = await readBodyWithin(request, limit);
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError("bad-request", "The body is not UTF-8 text, so it cannot be JSON.");
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad-request", text.trim() === "" ? "The body is empty; it must be JSON." : "The body must be JSON.");
  }
}
