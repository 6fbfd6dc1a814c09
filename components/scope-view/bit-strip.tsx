"use client";

import type { SimBit } from "@/lib/sim";

/**
 * The decoded bits under the chart: what the driver sent over what the pixel read. A wrong bit is
 * marked by a cross and a heavy border as well as by colour; each bit zooms the chart to itself.
 * Screen readers hear the same digits in a sentence ("Bit 3: sent 1, pixel read 0, wrong"): the
 * words around them are only hidden from sight, so the name spoken holds the text shown.
 */
export function BitStrip({ bits, selected, onSelect }: { bits: SimBit[]; selected: number | null; onSelect: (index: number) => void }) {
  return (
    <div className="mt-2 print:hidden">
      <div className="flex items-start gap-2">
        <div className="shrink-0 pt-5 text-right text-xs leading-6 text-ink-faint" aria-hidden="true">
          <div>sent</div>
          <div>read</div>
        </div>
        <ol className="flex flex-wrap gap-1" aria-label="Decoded bits, sent and read">
          {bits.map((bit, index) => {
            const wrong = bit.received !== String(bit.sent);
            return (
              <li key={index}>
                <button
                  type="button"
                  onClick={() => onSelect(index)}
                  aria-pressed={selected === index}
                  className={`flex w-7 flex-col items-center rounded-md border font-mono text-sm leading-6 ${
                    wrong ? "border-2 border-danger bg-danger-soft text-danger" : "border-line bg-surface text-ink"
                  } ${selected === index ? "ring-2 ring-accent ring-offset-1" : ""}`}
                >
                  <span className="text-[10px] leading-4 text-ink-faint">
                    <span className="sr-only">Bit </span>
                    {index + 1}
                    <span className="sr-only">:</span>
                  </span>
                  <span>
                    <span className="sr-only">sent </span>
                    {bit.sent}
                  </span>
                  <span className="font-semibold">
                    <span className="sr-only">, pixel read </span>
                    {wrong ? (bit.received === "x" ? "✗" : `${bit.received}✗`) : bit.received}
                    <span className="sr-only">
                      {bit.received === "x" ? " (unreadable: no single clean pulse)" : ""}
                      {wrong ? ", wrong" : ", correct"}
                    </span>
                  </span>
                </button>
              </li>
            );
          })}
        </ol>
      </div>
    </div>
  );
}
