import type { WorkbenchRun } from "./workbench-types";
import { formatDelayPerMetre, formatMetres, formatNanoseconds, formatOhms, formatPicofaradsPerMetre } from "./quantities";
import type { RunFacts } from "./run-facts";

function patternWords(run: WorkbenchRun): string {
  const { pattern } = run.scenario.signal;
  if ("bits" in pattern) return `${pattern.bits.length} bits, ${pattern.bits}`;
  const colours = pattern.colours.map((c) => `(${c.join(", ")})`).join(", ");
  return `${pattern.colours.length * 24} bits: the colour${pattern.colours.length > 1 ? "s" : ""} ${colours} as red, green, blue, sent in ${pattern.byteOrder} order`;
}

/** The learner's own variant of the run in plain words, with the values currently chosen. */
export function ScenarioWords({ run, facts }: { run: WorkbenchRun; facts: RunFacts }) {
  const { driver, cable, length, seriesResistance, supplyVoltage } = facts;
  const receiver = run.scenario.receiver;
  const high = (receiver.highThreshold ?? 0.7) * supplyVoltage;
  const low = (receiver.lowThreshold ?? 0.3) * supplyVoltage;
  const rows: [string, string][] = [
    ["Driver", `${driver.label}: ${driver.highVoltage} V high level, ${formatOhms(driver.outputResistance)} output, ${formatNanoseconds(driver.edgeTime)} edges`],
    ["Series resistor", formatOhms(seriesResistance)],
    [
      "Cable",
      `${cable.label}, ${formatMetres(length)}: Z0 ${Math.round(cable.z0)} Ω, ${formatPicofaradsPerMetre(cable.capacitancePerMetre)}, ${formatDelayPerMetre(cable.delayPerMetre)}`,
    ],
    ["First pixel", `${supplyVoltage} V supply; guaranteed to read high above ${high.toFixed(2)} V and low below ${low.toFixed(2)} V`],
    [
      "Signal",
      `${patternWords(run)}${facts.zeroHigh !== null && facts.oneHigh !== null ? `; a 0 is high for ${formatNanoseconds(facts.zeroHigh)}, a 1 for ${formatNanoseconds(facts.oneHigh)}` : ""}`,
    ],
  ];
  return (
    <dl className="grid grid-cols-[minmax(0,1fr)] gap-x-4 gap-y-1 text-sm leading-6 sm:grid-cols-[auto_minmax(0,1fr)]">
      {rows.map(([term, detail]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-ink">{term}</dt>
          <dd className="mb-1 text-ink-soft sm:mb-0">{detail}</dd>
        </div>
      ))}
    </dl>
  );
}
