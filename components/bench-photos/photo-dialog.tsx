"use client";

import { useEffect, useRef } from "react";
import { ZoomablePhoto } from "./zoomable-photo";

export type ViewerPhoto = { id: string; name: string; width: number; height: number };

export const benchPhotoUrl = (id: string) => `/api/bench-photos/${id}`;

const barButton = "rounded-md border border-white/40 px-3 py-1.5 hover:bg-white/10";

/** One bench photo at a time over the page, zoomable, with the others a step away. */
export function PhotoDialog({ photos, open, onOpen }: { photos: ViewerPhoto[]; open: number | null; onOpen: (index: number | null) => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const current = open === null ? undefined : photos[open];

  useEffect(() => {
    if (!current) dialog.current?.close();
    else if (!dialog.current?.open) dialog.current?.showModal();
  }, [current]);

  const step = (by: number) => onOpen((open! + by + photos.length) % photos.length);

  return (
    <dialog
      ref={dialog}
      onClose={() => onOpen(null)}
      aria-label={current ? `Photo ${open! + 1} of ${photos.length}: ${current.name}` : "Photo"}
      className="m-0 h-dvh max-h-none w-screen max-w-none bg-ink p-0 text-white backdrop:bg-ink/80"
    >
      {current ? (
        <div className="flex h-full flex-col">
          <div className="flex flex-wrap items-center gap-2 px-4 py-3 text-sm">
            <p className="min-w-0 flex-1 basis-40 truncate">
              {open! + 1} / {photos.length} · {current.name}
            </p>
            {photos.length > 1 ? (
              <>
                <button type="button" onClick={() => step(-1)} className={barButton}>
                  ← Previous
                </button>
                <button type="button" onClick={() => step(1)} className={barButton}>
                  Next →
                </button>
              </>
            ) : null}
            <button type="button" onClick={() => onOpen(null)} className="rounded-md bg-white px-3 py-1.5 font-semibold text-ink hover:bg-white/90" autoFocus>
              Close
            </button>
          </div>
          <ZoomablePhoto key={current.id} src={benchPhotoUrl(current.id)} name={current.name} width={current.width} height={current.height} />
        </div>
      ) : null}
    </dialog>
  );
}
