import "server-only";
import { createRouteHandler } from "uploadthing/next";
import type { RouteHandlerConfig } from "uploadthing/types";
import { uploadRouter } from "./upload-router";

/**
 * The upload route: presigns uploads for the browser and receives the service's signed
 * completion callbacks. Settings come from the UPLOADTHING_* environment unless given here.
 */
export function createUploadRouteHandler(config: RouteHandlerConfig = {}) {
  return createRouteHandler({ router: uploadRouter, config: { logLevel: "Warning", ...config } });
}
