import { traceStyle } from "@/components/scope-view/trace-style";
import { formatDelayPerMetre, formatMetres, formatOhms, formatPicofaradsPerMetre } from "./quantities";
import type { RunFacts } from "./run-facts";

const ink = "#1c2529";
const soft = "#4a555c";
const line = "#bfb8a8";
const paper = "#ffffff";

/** How the cable's two conductors are drawn: far apart, side by side, twisted, shielded, or three cores. */
function cableConductors(kind: string, x1: number, x2: number, y: number) {
  const length = x2 - x1;
  if (kind === "lone-lead") {
    return (
      <>
        <line x1={x1} y1={y} x2={x2} y2={y} stroke={ink} strokeWidth={3} />
        <line x1={x1} y1={y + 46} x2={x2} y2={y + 46} stroke={soft} strokeWidth={2} strokeDasharray="10 5" />
      </>
    );
  }
  if (kind === "twisted-pair") {
    const turns = 14;
    const path = (phase: number) =>
      Array.from({ length: turns * 8 + 1 }, (_, i) => {
        const x = x1 + (i / (turns * 8)) * length;
        const v = y + 6 + 6 * Math.sin((i / 8) * Math.PI * 2 + phase);
        return `${i === 0 ? "M" : "L"}${x.toFixed(1)},${v.toFixed(1)}`;
      }).join(" ");
    return (
      <>
        <path d={path(0)} fill="none" stroke={ink} strokeWidth={2.5} />
        <path d={path(Math.PI)} fill="none" stroke={soft} strokeWidth={2} />
      </>
    );
  }
  if (kind === "coax-75") {
    return (
      <>
        <rect x={x1} y={y - 9} width={length} height={30} rx={6} fill="#eeebe2" stroke={soft} strokeWidth={2} strokeDasharray="3 2" />
        <line x1={x1} y1={y + 6} x2={x2} y2={y + 6} stroke={ink} strokeWidth={3} />
      </>
    );
  }
  const gap = 10;
  return (
    <>
      <rect x={x1} y={y - 10} width={length} height={kind === "three-core" ? 44 : 32} rx={14} fill="#eeebe2" stroke={line} />
      <line x1={x1} y1={y} x2={x2} y2={y} stroke={ink} strokeWidth={3} />
      <line x1={x1} y1={y + gap} x2={x2} y2={y + gap} stroke={soft} strokeWidth={2} />
      {kind === "three-core" ? <line x1={x1} y1={y + 2 * gap} x2={x2} y2={y + 2 * gap} stroke="#b05f26" strokeWidth={2} /> : null}
    </>
  );
}

function returnNote(kind: string): string {
  if (kind === "lone-lead") return "return wire well away (dashed)";
  if (kind === "twisted-pair") return "data twisted with its ground partner";
  if (kind === "coax-75") return "shield is the return";
  if (kind === "three-core") return "ground and supply cores both beside the data";
  return "ground core beside the data";
}

function NodeMark({ x, y, trace }: { x: number; y: number; trace: keyof typeof traceStyle }) {
  const style = traceStyle[trace];
  return (
    <g>
      <circle cx={x} cy={y} r={5} fill={paper} stroke={style.stroke} strokeWidth={2.5} />
      <line x1={x - 16} y1={y - 26} x2={x + 16} y2={y - 26} stroke={style.stroke} strokeWidth={style.width + 0.4} strokeDasharray={style.dash} />
      <text x={x} y={y - 34} textAnchor="middle" fontSize={13} fill={style.stroke} fontWeight={600}>
        {style.label.toLowerCase()}
      </text>
    </g>
  );
}

function Resistor({ x, y, width }: { x: number; y: number; width: number }) {
  const step = width / 8;
  const d = Array.from({ length: 9 }, (_, i) => `${i === 0 ? "M" : "L"}${x + i * step},${i === 0 || i === 8 ? y : y + (i % 2 ? -8 : 8)}`).join(" ");
  return <path d={d} fill="none" stroke={ink} strokeWidth={2.5} strokeLinejoin="round" />;
}

function describeRun(facts: RunFacts, title: string): string {
  const { driver, cable, length, seriesResistance, supplyVoltage } = facts;
  return `${title}: a ${driver.highVoltage} V driver with ${formatOhms(driver.outputResistance)} output resistance, then a ${formatOhms(seriesResistance)} series resistor, then ${formatMetres(length)} of ${cable.label.toLowerCase()} (Z0 ${Math.round(cable.z0)} Ω), then the first pixel on a ${supplyVoltage} V supply.`;
}

function WideDrawing({ facts, title }: { facts: RunFacts; title: string }) {
  const { driver, cable, length, seriesResistance, supplyVoltage } = facts;
  const y = 92;
  return (
    <svg viewBox="0 0 760 190" className="hidden h-auto w-full sm:block" role="img" aria-label={describeRun(facts, title)}>
      <rect x={8} y={y - 38} width={128} height={76} rx={10} fill="#e2eeed" stroke="#1d5c63" strokeWidth={2} />
      <text x={72} y={y - 12} textAnchor="middle" fontSize={15} fontWeight={600} fill={ink}>
        {driver.highVoltage} V driver
      </text>
      <text x={72} y={y + 8} textAnchor="middle" fontSize={13} fill={soft}>
        {formatOhms(driver.outputResistance)} output
      </text>
      <text x={72} y={y + 26} textAnchor="middle" fontSize={13} fill={soft}>
        {Math.round(driver.edgeTime * 1e9)} ns edges
      </text>

      <line x1={136} y1={y} x2={160} y2={y} stroke={ink} strokeWidth={3} />
      <Resistor x={160} y={y} width={64} />
      <text x={192} y={y - 20} textAnchor="middle" fontSize={15} fontWeight={700} fill={ink}>
        {formatOhms(seriesResistance)}
      </text>
      <text x={192} y={y + 30} textAnchor="middle" fontSize={12} fill={soft}>
        series resistor
      </text>
      <line x1={224} y1={y} x2={262} y2={y} stroke={ink} strokeWidth={3} />
      <NodeMark x={262} y={y} trace="near" />

      {cableConductors(cable.kind, 268, 560, y)}
      <text x={414} y={y - 40} textAnchor="middle" fontSize={15} fontWeight={600} fill={ink}>
        {formatMetres(length)} · {cable.label}
      </text>
      <text x={414} y={y + 72} textAnchor="middle" fontSize={13} fill={soft}>
        Z0 {Math.round(cable.z0)} Ω · {formatPicofaradsPerMetre(cable.capacitancePerMetre)} · {formatDelayPerMetre(cable.delayPerMetre)}
      </text>
      <text x={414} y={y + 90} textAnchor="middle" fontSize={12} fill={soft}>
        {returnNote(cable.kind)}
      </text>

      <NodeMark x={566} y={y} trace="far" />
      <line x1={560} y1={y} x2={612} y2={y} stroke={ink} strokeWidth={3} />
      <rect x={612} y={y - 38} width={140} height={76} rx={10} fill="#f7eadf" stroke="#b05f26" strokeWidth={2} />
      <text x={682} y={y - 12} textAnchor="middle" fontSize={15} fontWeight={600} fill={ink}>
        First pixel
      </text>
      <text x={682} y={y + 8} textAnchor="middle" fontSize={13} fill={soft}>
        {supplyVoltage} V supply
      </text>
      <text x={682} y={y + 26} textAnchor="middle" fontSize={13} fill={soft}>
        input pin
      </text>
    </svg>
  );
}

function SideLabel({ x, y, trace }: { x: number; y: number; trace: keyof typeof traceStyle }) {
  const style = traceStyle[trace];
  return (
    <g>
      <line x1={x} y1={y - 4} x2={x + 26} y2={y - 4} stroke={style.stroke} strokeWidth={style.width + 0.4} strokeDasharray={style.dash} />
      <text x={x + 32} y={y} fontSize={14} fill={style.stroke} fontWeight={600}>
        {style.label.toLowerCase()}
      </text>
    </g>
  );
}

/** The same sketch stood on end for a phone: parts top to bottom, labels to the right. */
function NarrowDrawing({ facts, title }: { facts: RunFacts; title: string }) {
  const { driver, cable, length, seriesResistance, supplyVoltage } = facts;
  const x = 96;
  return (
    <svg viewBox="0 0 340 486" className="h-auto w-full sm:hidden" role="img" aria-label={describeRun(facts, title)}>
      <rect x={16} y={8} width={160} height={64} rx={10} fill="#e2eeed" stroke="#1d5c63" strokeWidth={2} />
      <text x={x} y={34} textAnchor="middle" fontSize={16} fontWeight={600} fill={ink}>
        {driver.highVoltage} V driver
      </text>
      <text x={x} y={56} textAnchor="middle" fontSize={14} fill={soft}>
        {formatOhms(driver.outputResistance)} · {Math.round(driver.edgeTime * 1e9)} ns edges
      </text>
      <line x1={x} y1={72} x2={x} y2={92} stroke={ink} strokeWidth={3} />
      <g transform={`translate(${x} 92) rotate(90)`}>
        <Resistor x={0} y={0} width={56} />
      </g>
      <text x={x + 24} y={118} fontSize={17} fontWeight={700} fill={ink}>
        {formatOhms(seriesResistance)}
      </text>
      <text x={x + 24} y={136} fontSize={13} fill={soft}>
        series resistor
      </text>
      <line x1={x} y1={148} x2={x} y2={166} stroke={ink} strokeWidth={3} />
      <circle cx={x} cy={170} r={5} fill={paper} stroke={traceStyle.near.stroke} strokeWidth={2.5} />
      <SideLabel x={x + 24} y={175} trace="near" />
      <g transform={`translate(${x} 176) rotate(90)`}>{cableConductors(cable.kind, 0, 184, 0)}</g>
      <text x={x + 46} y={216} fontSize={15} fontWeight={600} fill={ink}>
        {formatMetres(length)}
      </text>
      <text x={x + 46} y={236} fontSize={14} fill={ink}>
        {cable.label}
      </text>
      <text x={x + 46} y={258} fontSize={13} fill={soft}>
        Z0 {Math.round(cable.z0)} Ω
      </text>
      <text x={x + 46} y={276} fontSize={13} fill={soft}>
        {formatPicofaradsPerMetre(cable.capacitancePerMetre)} · {formatDelayPerMetre(cable.delayPerMetre)}
      </text>
      <text x={x + 46} y={294} fontSize={12} fill={soft}>
        {returnNote(cable.kind)}
      </text>
      <circle cx={x} cy={366} r={5} fill={paper} stroke={traceStyle.far.stroke} strokeWidth={2.5} />
      <SideLabel x={x + 24} y={371} trace="far" />
      <line x1={x} y1={360} x2={x} y2={400} stroke={ink} strokeWidth={3} />
      <rect x={16} y={400} width={160} height={76} rx={10} fill="#f7eadf" stroke="#b05f26" strokeWidth={2} />
      <text x={x} y={428} textAnchor="middle" fontSize={16} fontWeight={600} fill={ink}>
        First pixel
      </text>
      <text x={x} y={450} textAnchor="middle" fontSize={14} fill={soft}>
        {supplyVoltage} V supply, input pin
      </text>
    </svg>
  );
}

/**
 * The run as a schematic sketch: driver, series resistor, cable and first pixel, each labelled
 * with the values in force, and the near and far ends marked as the scope view draws them.
 */
export function RunDrawing({ facts, title }: { facts: RunFacts; title: string }) {
  return (
    <>
      <WideDrawing facts={facts} title={title} />
      <NarrowDrawing facts={facts} title={title} />
    </>
  );
}
