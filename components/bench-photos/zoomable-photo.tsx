"use client";

import { useEffect, useLayoutEffect, useRef, useState, type PointerEvent } from "react";
import { describeZoom, fitZoom, maxZoom, zoomByWheel, zoomIn, zoomOut, type Zoom } from "./zoom-steps";

export type ZoomablePhotoProps = { src: string; name: string; width: number; height: number };

// The frame's padding on each side, kept clear around the photo when it fits.
const gap = 8;
// Out of range, a control stays focusable (a disabled one would drop the keyboard user's focus) and only looks spent.
const controlClass = "rounded-md border border-white/40 px-3 py-1.5 font-medium hover:bg-white/10 aria-disabled:opacity-50 aria-disabled:hover:bg-transparent";

/**
 * One photo in a scrollable frame, zoomed by steps (buttons, + − 0 keys), by the wheel around the
 * pointer, and moved by dragging, the arrow keys or the scroll bars. Touch keeps the browser's own
 * scrolling and pinch, which already work on a scrollable frame.
 */
export function ZoomablePhoto({ src, name, width, height }: ZoomablePhotoProps) {
  const frame = useRef<HTMLDivElement>(null);
  const image = useRef<HTMLImageElement>(null);
  const [frameSize, setFrameSize] = useState({ width, height });
  const [zoom, setZoom] = useState<Zoom>("fit");
  // The photo point that stays under a screen point across a zoom, and the zoom a fast wheel turn has reached before the page caught up.
  const anchor = useRef<{ clientX: number; clientY: number; x: number; y: number } | null>(null);
  const pending = useRef<number | null>(null);
  const drag = useRef<{ x: number; y: number; left: number; top: number } | null>(null);

  const fit = fitZoom({ width, height }, frameSize);
  const scale = zoom === "fit" ? fit : zoom;
  const pannable = width * scale > frameSize.width + 1 || height * scale > frameSize.height + 1;

  useLayoutEffect(() => {
    const box = frame.current!;
    const measure = () => setFrameSize({ width: box.clientWidth - 2 * gap, height: box.clientHeight - 2 * gap });
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(box);
    return () => observer.disconnect();
  }, []);

  useLayoutEffect(() => {
    const point = anchor.current;
    anchor.current = null;
    pending.current = null;
    if (!point) return;
    const rect = image.current!.getBoundingClientRect();
    frame.current!.scrollLeft += rect.left + point.x * scale - point.clientX;
    frame.current!.scrollTop += rect.top + point.y * scale - point.clientY;
  }, [scale]);

  function zoomTo(next: Zoom, at?: { clientX: number; clientY: number }) {
    const box = frame.current!.getBoundingClientRect();
    const { clientX, clientY } = at ?? { clientX: box.left + box.width / 2, clientY: box.top + box.height / 2 };
    const rect = image.current!.getBoundingClientRect();
    anchor.current = { clientX, clientY, x: (clientX - rect.left) / scale, y: (clientY - rect.top) / scale };
    pending.current = next === "fit" ? fit : next;
    setZoom(next);
  }

  // React's own wheel listener is passive, and a listener that cannot cancel lets ctrl + wheel zoom the whole page.
  useEffect(() => {
    const box = frame.current!;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const pixels = event.deltaMode === WheelEvent.DOM_DELTA_LINE ? event.deltaY * 16 : event.deltaY;
      zoomTo(zoomByWheel(pending.current ?? scale, fit, pixels), event);
    };
    box.addEventListener("wheel", onWheel, { passive: false });
    return () => box.removeEventListener("wheel", onWheel);
  });

  // The dialog is modal, so every key pressed while it is open is meant for it.
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.defaultPrevented || event.ctrlKey || event.metaKey || event.altKey) return;
      const box = frame.current!;
      const pan = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] }[event.key];
      if (event.key === "+" || event.key === "=") zoomTo(zoomIn(scale, fit));
      else if (event.key === "-") zoomTo(zoomOut(scale, fit));
      else if (event.key === "0") zoomTo("fit");
      else if (pan) box.scrollBy({ left: (pan[0]! * box.clientWidth) / 5, top: (pan[1]! * box.clientHeight) / 5 });
      else return;
      event.preventDefault();
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  });

  function startDrag(event: PointerEvent<HTMLDivElement>) {
    if (!pannable || event.target !== image.current || event.pointerType === "touch" || event.button !== 0) return;
    drag.current = { x: event.clientX, y: event.clientY, left: event.currentTarget.scrollLeft, top: event.currentTarget.scrollTop };
    event.currentTarget.setPointerCapture(event.pointerId);
  }

  function moveDrag(event: PointerEvent<HTMLDivElement>) {
    const start = drag.current;
    if (!start) return;
    event.currentTarget.scrollLeft = start.left - (event.clientX - start.x);
    event.currentTarget.scrollTop = start.top - (event.clientY - start.y);
  }

  function endDrag() {
    drag.current = null;
  }

  const readout = describeZoom(zoom, fit);
  return (
    <>
      <div
        ref={frame}
        tabIndex={0}
        role="group"
        aria-label={`${name} at ${readout}${pannable ? "; arrow keys move around the photo" : ""}`}
        onPointerDown={startDrag}
        onPointerMove={moveDrag}
        onPointerUp={endDrag}
        onPointerCancel={endDrag}
        onDoubleClick={(event) => zoomTo(scale >= maxZoom ? "fit" : zoomIn(scale, fit), event)}
        className={`min-h-0 flex-1 overflow-auto overscroll-contain outline-none focus-visible:ring-2 focus-visible:ring-white/60 focus-visible:ring-inset ${pannable ? "cursor-grab active:cursor-grabbing" : "cursor-zoom-in"}`}
      >
        <div className="grid h-max min-h-full w-max min-w-full place-items-center" style={{ padding: gap }}>
          <img
            ref={image}
            src={src}
            alt={`Bench photo ${name}`}
            width={width}
            height={height}
            draggable={false}
            style={{ width: width * scale, height: height * scale, maxWidth: "none" }}
            className="block select-none"
          />
        </div>
      </div>
      <div role="group" aria-label="Zoom" className="flex flex-wrap items-center justify-center gap-2 px-4 py-2 text-sm">
        <button type="button" onClick={() => zoomTo(zoomOut(scale, fit))} aria-disabled={zoom === "fit"} aria-keyshortcuts="-" className={controlClass}>
          <span aria-hidden="true">− </span>Zoom out
        </button>
        <output className="min-w-[10ch] text-center font-semibold tabular-nums">
          <span className="sr-only">Zoom: </span>
          {readout}
        </output>
        <button type="button" onClick={() => zoomTo(zoomIn(scale, fit))} aria-disabled={scale >= maxZoom} aria-keyshortcuts="+" className={controlClass}>
          <span aria-hidden="true">+ </span>Zoom in
        </button>
        <button type="button" onClick={() => zoomTo("fit")} aria-disabled={zoom === "fit"} aria-keyshortcuts="0" className={controlClass}>
          Fit
        </button>
      </div>
      <p className="hidden px-4 pb-2 text-center text-xs text-white/70 sm:block">
        + and − or the wheel zoom, 0 fits; drag or the arrow keys move around. Esc closes.
      </p>
    </>
  );
}
