import type { LiveRun } from "@/components/simulation";
import type { Judgement } from "@/lib/sim";
import { reasonHeading } from "@/lib/sim/verdict";
import { formatMilliamps, formatOptionalTime, formatTime, formatVolts } from "./format";

/**
 * The run in words, for screen readers and for anyone who wants the figures: the simulator's
 * verdict (both judgements, each with its switching band and margins), the measured edges, and the bits.
 */
export function ScopeSummary({ run, onShowReason }: { run: LiveRun; onShowReason: (index: number) => void }) {
  const { metrics, verdict, bits } = run;
  const wrong = bits.flatMap((bit, i) => (bit.received === String(bit.sent) ? [] : [i + 1]));
  const sent = bits.map((bit) => bit.sent).join("");
  return (
    <div className="space-y-3 text-sm">
      <p className="font-semibold" data-testid="scope-verdict">
        Simulator verdict: {verdict.summary}
        {verdict.reasons.some((r) => r.severity === "warning") ? ", with warnings" : ""}.
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 print:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <JudgementRow judgement={verdict.guaranteed} />
        <JudgementRow judgement={verdict.typical} />
        <dt className="text-ink-soft">Rise time at the pixel</dt>
        <dd>{formatOptionalTime(metrics.riseTime)}</dd>
        <dt className="text-ink-soft">Overshoot</dt>
        <dd>{formatVolts(metrics.overshoot)}</dd>
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
                <span className={`font-semibold ${reason.severity === "fail" ? "text-danger" : "text-copper"}`}>{reasonHeading(reason)}: </span>
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

/** One judgement: which pixels it speaks for, whether the run meets it, and its margins. */
function JudgementRow({ judgement }: { judgement: Judgement }) {
  const { band } = judgement;
  const who =
    judgement.name === "guaranteed"
      ? `Every pixel that meets its datasheet (switching anywhere from ${formatVolts(band.lowest)} to ${formatVolts(band.highest)})`
      : `Typical pixels (switching from ${formatVolts(band.lowest)} to ${formatVolts(band.highest)}, ${formatVolts(band.hysteresis)} hysteresis; assumed figures)`;
  return (
    <>
      <dt className="text-ink-soft">{who}</dt>
      <dd>
        {judgement.pass ? "works" : "misread"}: timing margin {formatOptionalTime(judgement.timingMargin)}, voltage margin {formatVolts(judgement.voltageMargin)}
      </dd>
    </>
  );
}
