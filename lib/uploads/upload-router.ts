import "server-only";
import { createUploadthing, type FileRouter } from "uploadthing/next";
import { UploadThingError } from "uploadthing/server";
import { z } from "zod";
import { acceptUploadedBenchPhoto, refuseBenchPhotoUpload } from "@/lib/bench/photo-uploads";
import { benchPhotoLimits } from "@/lib/bench/photo-limits";
import { findViewerOfRequest } from "./request-viewer";

const f = createUploadthing();

// Declared types are checked here and by the service; the content is checked once the bytes exist.
const imageRoute = { maxFileSize: benchPhotoLimits.maxFileSize, maxFileCount: benchPhotoLimits.maxPhotos } as const;

export const uploadRouter = {
  benchPhoto: f({ "image/png": imageRoute, "image/jpeg": imageRoute, "image/webp": imageRoute })
    .input(z.object({ submissionId: z.uuid() }))
    .middleware(async ({ req, input, files }) => {
      const viewer = await findViewerOfRequest(req);
      const refusal = await refuseBenchPhotoUpload({ viewer, submissionId: input.submissionId, files });
      if (refusal || !viewer) throw new UploadThingError(refusal ?? { code: "FORBIDDEN", message: "Sign in again to upload photos." });
      // The service's completion callback carries no session: who uploaded to what travels here.
      return { learnerId: viewer.id, submissionId: input.submissionId };
    })
    .onUploadComplete(({ metadata, file }) =>
      acceptUploadedBenchPhoto({
        learnerId: metadata.learnerId,
        submissionId: metadata.submissionId,
        file: { key: file.key, name: file.name, size: file.size },
      }),
    ),
} satisfies FileRouter;

export type UploadRouter = typeof uploadRouter;
