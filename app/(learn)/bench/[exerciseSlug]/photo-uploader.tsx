"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { buttonClass } from "@/components/ui/button-class";
import { benchPhotoLimits, formatFileSize, refuseDeclaredPhotos } from "@/lib/bench/photo-limits";
import { useUploadThing } from "@/lib/uploads/client-helpers";
import { redrawnPhoto } from "@/lib/uploads/redraw-photo";
import { startBenchDraft } from "./actions";

type Notice = { tone: "error" | "success"; text: string };

const unreachableMessage = "Edgewise is not answering right now, so no photo was added. Try again in a moment.";
const serviceDownMessage = "The photo service is not answering, so no photo was added. Try again in a moment.";

// What the upload library reports when the service, or the app's side of it, failed rather than
// refused the file; its own text for these names internals, not what the learner can do.
const serviceFailureCodes = new Set<string>(["INTERNAL_SERVER_ERROR", "INTERNAL_CLIENT_ERROR", "UPLOAD_FAILED", "URL_GENERATION_FAILED"]);

/**
 * The sentence of a refusal the app's upload route answered itself (a signed-out learner, a body
 * too large): the library keeps the reply as the error's cause, under a code it guesses from the
 * status (401 has none of its own, so it would read as a service failure). The route's reply is
 * the app's JSON error with its sentence repeated at the top; other causes (a failed fetch) are not.
 */
function appRefusalOf(error: { cause?: unknown }): string | null {
  const reply = error.cause as { message?: unknown; error?: { code?: unknown; message?: unknown } } | null | undefined;
  const sentence = reply?.error?.message;
  return typeof sentence === "string" && typeof reply?.error?.code === "string" && reply.message === sentence ? sentence : null;
}

/**
 * Picks or takes photos and sends them through the upload route. Files are checked here first for
 * an instant answer, and redrawn from their pixels so that no location or camera details travel
 * with them; the server checks them again, and checks what arrived by its content.
 */
export function PhotoUploader({ exerciseSlug, storedCount }: { exerciseSlug: string; storedCount: number }) {
  const router = useRouter();
  const inputId = useId();
  const [notices, setNotices] = useState<Notice[]>([]);
  const [progress, setProgress] = useState<number | null>(null);
  const [dragging, setDragging] = useState(false);
  const { startUpload, isUploading } = useUploadThing("benchPhoto", {
    onUploadProgress: setProgress,
    onUploadError: (error) =>
      setNotices([{ tone: "error", text: appRefusalOf(error) ?? (serviceFailureCodes.has(error.code) ? serviceDownMessage : error.message) }]),
  });
  const room = benchPhotoLimits.maxPhotos - storedCount;
  const busy = isUploading || progress !== null;

  async function upload(files: File[]) {
    setNotices([]);
    const refusal = refuseDeclaredPhotos(files, storedCount);
    if (refusal) return setNotices([{ tone: "error", text: refusal }]);
    setProgress(0);
    try {
      const draft = await startBenchDraft(exerciseSlug);
      if (!draft.ok) return setNotices([{ tone: "error", text: draft.message }]);
      const results = await startUpload(await Promise.all(files.map(redrawnPhoto)), { submissionId: draft.submissionId });
      if (!results) return;
      setNotices(
        results.map((result) =>
          "rejected" in result.serverData
            ? { tone: "error", text: result.serverData.rejected }
            : { tone: "success", text: `“${result.name}” added.` },
        ),
      );
      router.refresh();
    } catch {
      // The server action itself could not be reached or answered (Edgewise is restarting, or its
      // database is down); the upload never started.
      setNotices([{ tone: "error", text: unreachableMessage }]);
    } finally {
      setProgress(null);
    }
  }

  function chosen(list: FileList | null) {
    const files = [...(list ?? [])];
    if (files.length > 0) void upload(files);
  }

  return (
    <div className="space-y-3">
      <div
        onDragOver={(event) => {
          event.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(event) => {
          event.preventDefault();
          setDragging(false);
          if (!busy) chosen(event.dataTransfer.files);
        }}
        className={`flex flex-col items-center gap-3 rounded-lg border-2 border-dashed px-4 py-6 text-center transition-colors ${
          dragging ? "border-accent bg-accent-soft" : "border-line-strong bg-sunken/60"
        }`}
      >
        <p className="text-sm text-ink-soft">
          {room > 0 ? "Drop photos of the scope screen and your set-up here, or" : "This submission holds the most photos it can."}
        </p>
        {room > 0 ? (
          <label htmlFor={inputId} className={buttonClass("secondary", `cursor-pointer focus-within:ring-2 focus-within:ring-accent/40 ${busy ? "pointer-events-none opacity-60" : ""}`)}>
            {busy ? `Uploading… ${progress ?? 0} %` : "Choose photos"}
            <input
              id={inputId}
              type="file"
              name="photos"
              accept={benchPhotoLimits.contentTypes.join(",")}
              multiple
              disabled={busy}
              className="sr-only"
              onChange={(event) => {
                chosen(event.currentTarget.files);
                event.currentTarget.value = "";
              }}
            />
          </label>
        ) : null}
        <p className="text-xs text-ink-faint">
          PNG, JPEG or WebP · up to {formatFileSize(benchPhotoLimits.maxBytes)} each · {Math.max(room, 0)} of {benchPhotoLimits.maxPhotos}{" "}
          places left
        </p>
        <p className="text-xs text-ink-faint">Where and when a photo was taken, and with which camera, is left out: only the picture is sent.</p>
      </div>
      <div aria-live="polite" role="status" className="space-y-2">
        {notices.map((notice, index) => (
          <p
            key={index}
            className={`rounded-lg border px-3 py-2 text-sm font-medium ${
              notice.tone === "error" ? "border-danger/30 bg-danger-soft text-danger" : "border-ok/30 bg-ok-soft text-ok"
            }`}
          >
            {notice.text}
          </p>
        ))}
      </div>
    </div>
  );
}
