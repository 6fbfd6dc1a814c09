import { generateReactHelpers } from "@uploadthing/react";
import type { UploadRouter } from "./upload-router";

/** Typed upload hooks for the browser, bound to the app's upload route at /api/uploadthing. */
export const { useUploadThing } = generateReactHelpers<UploadRouter>();
