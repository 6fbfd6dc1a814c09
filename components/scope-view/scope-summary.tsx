import type { LiveRun } from "@/components/simulation";
import { formatMilliamps, formatOptionalTime, formatTime, formatVolts } from "./format";

/**
 * The run in words, for screen readers and for anyone who wants the figures: the simulator's own
 * verdict against the pixel's guaranteed thresholds, the measured edges and margins, and the bits.
 */
export function ScopeSummary({ run, onShowReason }: { run: LiveRun; onShowReason: (index: number) => void }) {
  const { metrics, verdict, bits } = run;
  const wrong = bits.flatMap((bit, i) => (bit.received === String(bit.sent) ? [] : [i + 1]));
  const sent = bits.map((bit) => bit.sent).join("");
  return (
    <div className="space-y-3 text-sm">
      <p className="font-semibold">
        Simulator verdict: {verdict.pass ? "every bit decodes" : `${wrong.length} of ${bits.length} bits do not decode`}
        {verdict.reasons.some((r) => r.severity === "warning") ? ", with warnings" : ""}.
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        <dt className="text-ink-soft">Rise time at the pixel</dt>
        <dd>{formatOptionalTime(metrics.riseTime)}</dd>
        <dt className="text-ink-soft">Overshoot</dt>
        <dd>{formatVolts(metrics.overshoot)}</dd>
        <dt className="text-ink-soft">Timing margin</dt>
        <dd>{formatOptionalTime(metrics.timingMargin)}</dd>
        <dt className="text-ink-soft">Voltage margin</dt>
        <dd>
          {formatVolts(metrics.voltageMargin)} (against a mid-supply switch point: {formatVolts(metrics.midSupplyVoltageMargin)})
        </dd>
        <dt className="text-ink-soft">Clamp current peak</dt>
        <dd>{formatMilliamps(metrics.clampCurrentPeak)}</dd>
        <dt className="text-ink-soft">Line delay</dt>
        <dd>
          {formatTime(run.line.delay)} (Z0 {Math.round(run.line.z0)} Ω)
        </dd>
      </dl>
      <p>
        <span className="text-ink-soft">Bits sent: </span>
        <span className="font-mono break-all">{sent}</span>
        <br />
        <span className="text-ink-soft">Bits read: </span>
        <span className="font-mono break-all">{run.decoded}</span>
        {wrong.length > 0 ? <span className="block text-danger">Wrong or unreadable: bit {wrong.join(", ")}.</span> : null}
      </p>
      {verdict.reasons.length > 0 ? (
        <ol className="space-y-2">
          {verdict.reasons.map((reason, index) => (
            <li key={`${reason.code}-${index}`} className="flex gap-2">
              <span className="font-semibold" aria-hidden="true">
                ({index + 1})
              </span>
              <span>
                <span className={`font-semibold ${reason.severity === "fail" ? "text-danger" : "text-copper"}`}>
                  {reason.severity === "fail" ? "Fails: " : "Warning: "}
                </span>
                {reason.message}{" "}
                {reason.at ? (
                  <button type="button" className="font-medium text-accent underline underline-offset-2" onClick={() => onShowReason(index)}>
                    Show on the scope
                  </button>
                ) : null}
              </span>
            </li>
          ))}
        </ol>
      ) : null}
    </div>
  );
}
