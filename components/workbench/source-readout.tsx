import { formatOhms } from "./quantities";
import type { RunFacts } from "./run-facts";

/** The comparison series termination is about: the driver's resistance plus the resistor, against the line's Z0. */
export function SourceReadout({ facts }: { facts: RunFacts }) {
  const source = facts.driver.outputResistance + facts.seriesResistance;
  const z0 = facts.cable.z0;
  return (
    <dl className="mt-6 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 rounded-lg bg-sunken px-3 py-2.5 text-sm tabular-nums">
      <dt className="text-ink-soft">Source, R_src</dt>
      <dd className="whitespace-nowrap">
        {formatOhms(facts.driver.outputResistance)} + {formatOhms(facts.seriesResistance)} = <strong>{formatOhms(source)}</strong>
      </dd>
      <dt className="text-ink-soft">Line, Z0</dt>
      <dd>{formatOhms(z0)}</dd>
      <dt className="text-ink-soft">R_src ÷ Z0</dt>
      <dd>{(source / z0).toFixed(2)}</dd>
    </dl>
  );
}
