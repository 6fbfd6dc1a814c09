// A drawn, not simulated, picture of one rising edge at the far end of a long data run: a
// ringing edge without series termination and a damped one with it. Decoration for the landing page.

const width = 480;
const height = 200;
const baseline = 172;
const top = 100;
const stepAt = 70;

function tracePath(response: (t: number) => number): string {
  const points: string[] = [`M 16 ${baseline}`, `L ${stepAt} ${baseline}`];
  for (let x = stepAt; x <= width - 16; x += 4) {
    const level = response((x - stepAt) / 100);
    points.push(`L ${x} ${(baseline - (baseline - top) * level).toFixed(1)}`);
  }
  return points.join(" ");
}

const ringing = tracePath((t) => 1 - Math.exp(-t * 0.8) * Math.cos(t * 11));
const damped = tracePath((t) => 1 - Math.exp(-t * 6) * (1 + t * 6));

export function EdgeSketch() {
  return (
    <figure className="rounded-card border border-line bg-ink p-4 text-paper shadow-sm">
      <svg viewBox={`0 0 ${width} ${height}`} className="h-auto w-full" role="img" aria-labelledby="edge-sketch-caption">
        {Array.from({ length: 11 }, (_, i) => (
          <line key={`v${i}`} x1={16 + i * 44.8} x2={16 + i * 44.8} y1={16} y2={height - 16} stroke="#ffffff" strokeOpacity="0.08" />
        ))}
        {Array.from({ length: 5 }, (_, i) => (
          <line key={`h${i}`} x1={16} x2={width - 16} y1={16 + i * 42} y2={16 + i * 42} stroke="#ffffff" strokeOpacity="0.08" />
        ))}
        <line x1={16} x2={width - 16} y1={(baseline + top) / 2} y2={(baseline + top) / 2} stroke="#f0a56c" strokeDasharray="4 6" strokeOpacity="0.5" />
        <path d={ringing} fill="none" stroke="#f0a56c" strokeWidth="2.5" strokeLinejoin="round" />
        <path d={damped} fill="none" stroke="#7fd1c7" strokeWidth="2.5" strokeLinejoin="round" />
      </svg>
      <figcaption id="edge-sketch-caption" className="mt-3 text-sm text-paper/80">
        One edge at the far end of a long run: <span className="font-semibold text-[#f0a56c]">ringing</span> that
        crosses the logic threshold again, and the <span className="font-semibold text-[#7fd1c7]">damped</span> edge a
        well-chosen series resistor gives.
      </figcaption>
    </figure>
  );
}
