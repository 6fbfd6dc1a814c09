"use client";

import { useState } from "react";
import { benchPhotoUrl, PhotoDialog, type ViewerPhoto } from "@/components/bench-photos/photo-dialog";

/** Thumbnails of the learner's photos, each opening the zoomable viewer to read a scope's settings and readouts. */
export function PhotoLightbox({ photos }: { photos: ViewerPhoto[] }) {
  const [open, setOpen] = useState<number | null>(null);
  if (photos.length === 0) return <p className="text-sm text-ink-faint">No photos.</p>;

  return (
    <>
      <ul className="grid grid-cols-2 gap-3" aria-label="Bench photos">
        {photos.map((photo, index) => (
          <li key={photo.id}>
            <button
              type="button"
              onClick={() => setOpen(index)}
              className="block w-full overflow-hidden rounded-lg border border-line bg-ink/90 transition-colors hover:border-accent"
              aria-label={`Open photo ${index + 1}: ${photo.name}`}
            >
              <img src={benchPhotoUrl(photo.id)} alt="" width={photo.width} height={photo.height} className="aspect-[4/3] w-full object-contain" />
            </button>
            <p className="mt-1 truncate text-xs text-ink-faint" title={photo.name}>
              {photo.name} · {photo.width}×{photo.height}
            </p>
          </li>
        ))}
      </ul>
      <PhotoDialog photos={photos} open={open} onOpen={setOpen} />
    </>
  );
}
