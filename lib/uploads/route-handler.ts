import "server-only";
import { NextRequest } from "next/server";
import { createRouteHandler } from "uploadthing/next";
import type { RouteHandlerConfig } from "uploadthing/types";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { limitRequest } from "@/lib/rate-limit/limit-request";
import { findViewerOfRequest } from "./request-viewer";
import { uploadRouter } from "./upload-router";

// Far deeper than anything the upload client or the service sends; deeper bodies are refused
// before the upload library parses them, since its parser fails on them without a message.
const maxJsonDepth = 64;

/**
 * The upload route: presigns uploads for the browser and receives the service's signed
 * completion callbacks. Settings come from the UPLOADTHING_* environment unless given here.
 */
export function createUploadRouteHandler(config: RouteHandlerConfig = {}) {
  const handlers = createRouteHandler({ router: uploadRouter, config: { logLevel: "Warning", ...config } });
  return {
    GET: handlers.GET,
    POST: async (request: NextRequest) => {
      const refusal = await refuseUploadOverLimit(request);
      if (refusal) return refusal;
      const body = await request.text();
      const problem = describeBodyProblem(body);
      if (problem) return errorResponse(new AppError("bad-request", problem));
      return handlers.POST(new NextRequest(request, { body }));
    },
  };
}

/**
 * Counts a browser's upload request against the upload limits of its user and address, before its
 * body is read. The upload service's completion callbacks are not counted: they come from the
 * service's few addresses on behalf of every user, and carry a signature the library checks.
 */
async function refuseUploadOverLimit(request: NextRequest): Promise<Response | null> {
  if (request.headers.has("uploadthing-hook")) return null;
  try {
    await limitRequest(request, "upload", (await findViewerOfRequest(request))?.id);
    return null;
  } catch (error) {
    return errorResponse(error);
  }
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
