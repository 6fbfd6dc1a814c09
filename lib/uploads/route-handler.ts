import "server-only";
import { NextRequest, NextResponse } from "next/server";
import { createRouteHandler } from "uploadthing/next";
import type { RouteHandlerConfig } from "uploadthing/types";
import { decideRoleAccess } from "@/lib/auth/access";
import { bodyLimits, type BodyLimit } from "@/lib/http/body-limits";
import { readBodyWithin } from "@/lib/http/bounded-body";
import { AppError, describeError } from "@/lib/http/errors";
import { limitRequest } from "@/lib/rate-limit/limit-request";
import { uploadRouter } from "./upload-router";
import { findViewerOfRequest } from "./request-viewer";

// Far deeper than anything the upload client or the service sends; deeper bodies are refused
// before the upload library parses them, since its parser fails on them without a message.
const maxJsonDepth = 64;

/**
 * What a POST to the upload route is, from its query and headers alone: the browser asking to
 * upload (`?actionType=upload`), or the service reporting on an upload (`uploadthing-hook`,
 * signed). Anything else is no request the upload library answers.
 */
function uploadRequestKind(request: NextRequest): "upload" | "report" | null {
  const actionType = new URL(request.url).searchParams.get("actionType");
  const hook = request.headers.get("uploadthing-hook");
  if (actionType === "upload" && hook === null) return "upload";
  if (actionType === null && (hook === "callback" || hook === "error")) return "report";
  return null;
}

/**
 * The upload route: presigns uploads for the browser and receives the service's signed
 * completion callbacks. Settings come from the UPLOADTHING_* environment unless given here.
 *
 * The upload library reads and parses whatever body it is given, so every request passes a guard
 * first: the browser's is counted against the upload rate limits and must come from a signed-in
 * learner, both checked before a byte of the body is read; the service's must carry a signature
 * (the library verifies it); and each body is read within its limit and must be JSON of sane
 * depth before the library sees it.
 */
export function createUploadRouteHandler(config: RouteHandlerConfig = {}) {
  const handlers = createRouteHandler({ router: uploadRouter, config: { logLevel: "Warning", ...config } });
  return {
    GET: handlers.GET,
    POST: async (request: NextRequest): Promise<Response> => {
      let body: string;
      try {
        body = await guardUploadRequest(request);
      } catch (error) {
        return uploadRefusal(error);
      }
      // The library answers its own failures (the upload service down, say) in its own words.
      return handlers.POST(new NextRequest(request, { body }));
    },
  };
}

/** The request's body once the request may be read at all; throws the refusal otherwise. */
async function guardUploadRequest(request: NextRequest): Promise<string> {
  const kind = uploadRequestKind(request);
  if (kind === null) throw new AppError("bad-request", "This is not an upload request or an upload service report.");
  if (kind === "upload") await requireUploader(request);
  // The service's reports carry a signature the library checks; they are not rate-limited, as
  // they come from the service's few addresses on behalf of every user.
  if (kind === "report" && !request.headers.get("x-uploadthing-signature")) {
    throw new AppError("unauthenticated", "Upload service reports must be signed.");
  }
  return readJsonText(request, kind === "upload" ? bodyLimits.uploadRequest : bodyLimits.uploadCallback);
}

/**
 * Counts the request against the upload limits of its user and address, then lets only learners
 * on: whose submission it is, and whether it is open, the upload router checks.
 */
async function requireUploader(request: NextRequest): Promise<void> {
  const viewer = await findViewerOfRequest(request);
  await limitRequest(request, "upload", viewer?.id);
  const decision = decideRoleAccess(viewer, ["learner"]);
  if (decision === "sign-in") throw new AppError("unauthenticated", "Sign in again to upload photos.");
  if (decision === "forbidden") throw new AppError("forbidden", "Only learners upload bench photos.");
}

async function readJsonText(request: NextRequest, limit: BodyLimit): Promise<string> {
  let body: string;
  try {
    body = new TextDecoder("utf-8", { fatal: true }).decode(await readBodyWithin(request, limit));
  } catch (error) {
    if (error instanceof AppError) throw error;
    throw new AppError("bad-request", "The upload request was not UTF-8 text.");
  }
  const problem = describeBodyProblem(body);
  if (problem) throw new AppError("bad-request", problem);
  return body;
}

/**
 * The app's JSON error, with its sentence also at the top level, where the upload library's
 * browser client looks for the message it shows (the photo uploader shows it to the learner).
 */
function uploadRefusal(error: unknown): NextResponse {
  const { status, body, headers } = describeError(error);
  return NextResponse.json({ ...body, message: body.error.message }, { status, headers });
}

function describeBodyProblem(body: string): string | null {
  if (body.trim() === "") return "The upload request was empty.";
  let depth = 0;
  let inString = false;
  for (let i = 0; i < body.length; i += 1) {
    const c = body[i];
    if (inString) {
      if (c === "\\") i += 1;
      else if (c === '"') inString = false;
    } else if (c === '"') inString = true;
    else if (c === "{" || c === "[") {
      depth += 1;
      if (depth > maxJsonDepth) return "The upload request is nested too deeply.";
    } else if (c === "}" || c === "]") depth -= 1;
  }
  try {
    JSON.parse(body);
  } catch {
    return "The upload request was not valid JSON.";
  }
  return null;
}
