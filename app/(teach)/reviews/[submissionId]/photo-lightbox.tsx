"use client";

import { useEffect, useRef, useState } from "react";

export type LightboxPhoto = { id: string; name: string; width: number; height: number };

const photoUrl = (id: string) => `/api/bench-photos/${id}`;

/**
 * Thumbnails that open one photo at a time over the page. The open photo fits the screen; a click
 * on it shows it at full size, to read a scope's settings and readouts.
 */
export function PhotoLightbox({ photos }: { photos: LightboxPhoto[] }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState<number | null>(null);
  const [fullSize, setFullSize] = useState(false);
  const current = open === null ? null : photos[open];

  useEffect(() => {
    if (open === null) dialog.current?.close();
    else if (!dialog.current?.open) dialog.current?.showModal();
  }, [open]);

  const show = (index: number) => {
    setFullSize(false);
    setOpen((index + photos.length) % photos.length);
  };

  if (photos.length === 0) return <p className="text-sm text-ink-faint">No photos.</p>;

  return (
    <>
      <ul className="grid grid-cols-2 gap-3" aria-label="Bench photos">
        {photos.map((photo, index) => (
          <li key={photo.id}>
            <button
              type="button"
              onClick={() => show(index)}
              className="block w-full overflow-hidden rounded-lg border border-line bg-ink/90 transition-colors hover:border-accent"
              aria-label={`Open photo ${index + 1}: ${photo.name}`}
            >
              <img src={photoUrl(photo.id)} alt="" width={photo.width} height={photo.height} className="aspect-[4/3] w-full object-contain" />
            </button>
            <p className="mt-1 truncate text-xs text-ink-faint" title={photo.name}>
              {photo.name} · {photo.width}×{photo.height}
            </p>
          </li>
        ))}
      </ul>
      <dialog
        ref={dialog}
        onClose={() => setOpen(null)}
        aria-label={current ? `Photo ${open! + 1} of ${photos.length}: ${current.name}` : "Photo"}
        className="m-0 h-dvh max-h-none w-screen max-w-none bg-ink p-0 text-white backdrop:bg-ink/80"
      >
        {current ? (
          <div className="flex h-full flex-col">
            <div className="flex items-center gap-3 px-4 py-3 text-sm">
              <p className="min-w-0 flex-1 truncate">
                {open! + 1} / {photos.length} · {current.name}
              </p>
              {photos.length > 1 ? (
                <>
                  <button type="button" onClick={() => show(open! - 1)} className="rounded-md border border-white/30 px-3 py-1.5 hover:bg-white/10">
                    ← Previous
                  </button>
                  <button type="button" onClick={() => show(open! + 1)} className="rounded-md border border-white/30 px-3 py-1.5 hover:bg-white/10">
                    Next →
                  </button>
                </>
              ) : null}
              <button type="button" onClick={() => setOpen(null)} className="rounded-md bg-white px-3 py-1.5 font-semibold text-ink hover:bg-white/90" autoFocus>
                Close
              </button>
            </div>
            <div className={`min-h-0 flex-1 ${fullSize ? "overflow-auto" : "flex items-center justify-center overflow-hidden p-4"}`}>
              <img
                src={photoUrl(current.id)}
                alt={`Bench photo ${current.name}`}
                width={current.width}
                height={current.height}
                onClick={() => setFullSize((value) => !value)}
                className={fullSize ? "max-w-none cursor-zoom-out" : "max-h-full max-w-full cursor-zoom-in object-contain"}
              />
            </div>
            <p className="px-4 py-2 text-center text-xs text-white/70">
              {fullSize ? "Full size: scroll to move around; click to fit the screen." : "Click the photo to see it at full size. Esc closes."}
            </p>
          </div>
        ) : null}
      </dialog>
    </>
  );
}
