"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { benchPhotoUrl, PhotoDialog } from "@/components/bench-photos/photo-dialog";
import { formatFileSize } from "@/lib/bench/photo-limits";
import { deleteBenchPhoto } from "./actions";

export type ThumbnailPhoto = { id: string; name: string; size: number; width: number; height: number };

/** The stored photos, each opening the zoomable viewer; removable while the work can still change. */
export function PhotoThumbnails({ exerciseSlug, photos, removable }: { exerciseSlug: string; photos: ThumbnailPhoto[]; removable: boolean }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [message, setMessage] = useState<string | null>(null);
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) return <p className="text-sm text-ink-faint">No photos yet.</p>;

  function remove(photo: ThumbnailPhoto) {
    startTransition(async () => {
      const result = await deleteBenchPhoto(exerciseSlug, photo.id);
      setMessage(result.ok ? `“${photo.name}” removed.` : result.message);
      router.refresh();
    });
  }

  return (
    <div className="space-y-2">
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="Stored photos">
        {photos.map((photo, index) => (
          <li key={photo.id} className="overflow-hidden rounded-lg border border-line bg-surface">
            <button type="button" onClick={() => setOpen(index)} className="block w-full bg-ink/90" aria-label={`Open photo ${index + 1}: ${photo.name}`}>
              <img src={benchPhotoUrl(photo.id)} alt="" width={photo.width} height={photo.height} className="aspect-[4/3] w-full object-contain" />
            </button>
            <div className="flex items-center justify-between gap-2 px-2 py-1.5">
              <p className="min-w-0 truncate text-xs text-ink-soft" title={photo.name}>
                {photo.name} · {formatFileSize(photo.size)}
              </p>
              {removable ? (
                <button
                  type="button"
                  disabled={pending}
                  onClick={() => remove(photo)}
                  className="shrink-0 rounded px-1.5 py-0.5 text-xs font-medium text-danger hover:bg-danger-soft disabled:opacity-60"
                  aria-label={`Remove ${photo.name}`}
                >
                  Remove
                </button>
              ) : null}
            </div>
          </li>
        ))}
      </ul>
      <p aria-live="polite" className="text-sm text-ink-soft">
        {message}
      </p>
      <PhotoDialog photos={photos} open={open} onOpen={setOpen} />
    </div>
  );
}
