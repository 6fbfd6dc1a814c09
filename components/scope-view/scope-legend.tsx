import { bandStyle, traceStyle } from "./trace-style";

function Sample({ stroke, dash, width }: { stroke: string; dash?: string; width: number }) {
  return (
    <svg width="28" height="10" aria-hidden="true" className="shrink-0">
      <line x1="1" y1="5" x2="27" y2="5" stroke={stroke} strokeWidth={width} strokeDasharray={dash} />
    </svg>
  );
}

export function ScopeLegend() {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-soft">
      {[traceStyle.far, traceStyle.near].map((trace) => (
        <li key={trace.label} className="flex items-center gap-1.5">
          <Sample stroke={trace.stroke} dash={trace.dash} width={trace.width} />
          <span>
            <span className="font-semibold text-ink">{trace.label}</span> ({trace.dash ? "dashed" : "solid"}): {trace.detail}
          </span>
        </li>
      ))}
      <li className="flex items-center gap-1.5">
        <span className="inline-block h-3 w-5 rounded-sm border border-line" style={{ background: `${bandStyle.high}22` }} aria-hidden="true" />
        <span>shaded bands: where every pixel that meets its datasheet reads high (top) or low (bottom)</span>
      </li>
      <li className="flex items-center gap-1.5">
        <span className="inline-block h-3 w-5 rounded-sm border border-dashed border-line" style={{ background: `${bandStyle.slot}1f` }} aria-hidden="true" />
        <span>dotted band in the middle: where typical pixels switch (an assumed range)</span>
      </li>
      <li className="flex items-center gap-1.5">
        <span className="font-semibold text-danger" aria-hidden="true">
          ✗
        </span>
        <span>a bit slot the pixel misread; (1), (2): where the verdict&apos;s reasons point</span>
      </li>
    </ul>
  );
}
