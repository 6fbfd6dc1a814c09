import "server-only";
import { countBenchPhotos, editableBenchStatuses, findBenchSubmissionOfLearner, storeBenchPhoto } from "@/db/queries/bench";
import type { SessionUser } from "@/lib/auth/session-store";
import { displayNameOf } from "@/lib/uploads/file-names";
import { readImageContent } from "@/lib/uploads/image-content";
import { deleteStoredFiles, fetchStoredFile } from "@/lib/uploads/stored-files";
import { isBenchExerciseOpen } from "./exercise-lock";
import { benchPhotoLimits, formatFileSize, refuseDeclaredPhotos, type DeclaredFile } from "./photo-limits";

// The two halves of a bench photo upload. Before anything is sent, the upload route asks whether
// this learner may add these files to this submission. Once the service holds the bytes, they are
// read back and checked; only a real image, and nothing else, becomes a row (under the service's
// own key and a cleaned display name); anything else is deleted again.

export type UploadRefusal = { code: "FORBIDDEN" | "NOT_FOUND" | "BAD_REQUEST"; message: string };

export async function refuseBenchPhotoUpload(params: {
  viewer: SessionUser | null;
  submissionId: string;
  files: readonly DeclaredFile[];
}): Promise<UploadRefusal | null> {
  const { viewer } = params;
  if (!viewer) return { code: "FORBIDDEN", message: "Sign in again to upload photos." };
  if (viewer.role !== "learner") return { code: "FORBIDDEN", message: "Only learners upload bench photos." };
  const submission = await findBenchSubmissionOfLearner({ submissionId: params.submissionId, learnerId: viewer.id });
  if (!submission) return { code: "NOT_FOUND", message: "That bench submission was not found." };
  if (!(await isBenchExerciseOpen({ userId: viewer.id, exerciseSlug: submission.exerciseSlug }))) {
    return { code: "FORBIDDEN", message: "This bench exercise opens with its lesson. Finish the lessons before it first." };
  }
  if (!(editableBenchStatuses as readonly string[]).includes(submission.status)) {
    return { code: "BAD_REQUEST", message: "This work is with your instructor, so its photos cannot change now." };
  }
  const refusal = refuseDeclaredPhotos(params.files, await countBenchPhotos({ submissionId: submission.id }));
  return refusal ? { code: "BAD_REQUEST", message: refusal } : null;
}

export type UploadOutcome = { photoId: string } | { rejected: string };

type UploadedFile = { key: string; name: string; size: number };

const refusals = {
  missing: "That bench submission was not found.",
  locked: "This work went to your instructor while the photo was uploading, so it was not added.",
  full: `The submission already holds ${benchPhotoLimits.maxPhotos} photos, so this one was not added.`,
} as const;

async function readStoredBytes(key: string): Promise<Uint8Array | null> {
  const response = await fetchStoredFile(key);
  if (!response.ok) return null;
  return new Uint8Array(await response.arrayBuffer());
}

/**
 * Checks an upload the service has finished and records it. Never throws: the upload SDK would
 * swallow the error and leave the browser waiting, so every failure becomes a reason to show.
 */
export async function acceptUploadedBenchPhoto(params: {
  learnerId: string;
  submissionId: string;
  file: UploadedFile;
}): Promise<UploadOutcome> {
  const { file } = params;
  const name = displayNameOf(file.name);
  const reject = async (reason: string): Promise<UploadOutcome> => {
    await deleteStoredFiles([file.key]).catch((error: unknown) => console.error(`Could not delete refused upload ${file.key}`, error));
    return { rejected: reason };
  };
  try {
    const bytes = await readStoredBytes(file.key);
    if (!bytes) return await reject(`“${name}” could not be read back from storage. Try again.`);
    if (bytes.length > benchPhotoLimits.maxBytes) return await reject(`“${name}” is larger than ${formatFileSize(benchPhotoLimits.maxBytes)}, so it was not kept.`);
    const reading = readImageContent(bytes);
    if (!reading) return await reject(`“${name}” is not a PNG, JPEG or WebP image, whatever its name says, so it was not kept.`);
    const { end, ...image } = reading;
    if (end < bytes.length) {
      // Phones' motion photos append a video this way, and so do files built to pass as an image.
      return await reject(
        `“${name}” carries other data after the end of the picture, so it was not kept. Save or export it as a plain still photo and upload that.`,
      );
    }
    const stored = await storeBenchPhoto({
      submissionId: params.submissionId,
      learnerId: params.learnerId,
      maxPhotos: benchPhotoLimits.maxPhotos,
      photo: { fileKey: file.key, name, size: bytes.length, ...image },
    });
    if (stored.status !== "stored") return await reject(refusals[stored.status]);
    return { photoId: stored.photo.id };
  } catch (error) {
    console.error(`Could not record uploaded bench photo ${file.key}`, error);
    return reject(`“${name}” could not be stored. Try again in a moment.`);
  }
}
