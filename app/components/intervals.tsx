// Interval pictures, drawn as SVG on the server so they work without JavaScript. Every figure is
// also given as text beside or under the picture.
import { scaleLinear } from "d3-scale";
import { formatChance as prob, formatShare as pct } from "~/domain";

/** A small 0–100 % bar with the interval as a band and the estimate as a tick. */
export function IntervalBar({ estimate, lower, upper, muted = false }: { estimate: number; lower: number; upper: number; muted?: boolean }) {
  const x = scaleLinear().domain([0, 1]).range([2, 118]);
  return (
    <svg viewBox="0 0 120 14" width="120" height="14" aria-hidden className="inline-block align-middle">
      <rect x="2" y="6" width="116" height="2" fill="#e7e5e4" />
      <rect x={x(lower)} y="3" width={Math.max(1, x(upper) - x(lower))} height="8" rx="2" fill={muted ? "#a8a29e" : "#2f6b5f"} opacity="0.35" />
      <rect x={x(estimate) - 1} y="1" width="2" height="12" fill={muted ? "#78716c" : "#14302a"} />
    </svg>
  );
}

export interface ChartRow {
  key: string;
  label: string;
  sub?: string;
  estimate: number;
  lower: number;
  upper: number;
  n: number;
  tag?: string;
  muted?: boolean;
  /** Drawn in the top tool's colour (the top tool, and those not told apart from it). */
  highlight?: boolean;
}

/** One row per tool: its name above, point and whisker below, on a shared 0–100 % axis (narrow, so it reads on a phone). */
export function IntervalChart({ rows, title }: { rows: ChartRow[]; title: string }) {
  const rowH = 40, left = 10, right = 14, top = 22, W = 400;
  const H = top + rows.length * rowH + 6;
  const x = scaleLinear().domain([0, 1]).range([left, W - right]);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="interval-chart-title" className="h-auto w-full">
      <title id="interval-chart-title">{title}</title>
      {x.ticks(5).map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={top - 6} y2={H - 4} stroke="#e7e5e4" />
          <text x={x(t)} y={top - 10} textAnchor="middle" fontSize="11" fill="#57534e">{pct(t)}</text>
        </g>
      ))}
      {rows.map((r, i) => {
        const y = top + i * rowH;
        const colour = r.muted ? "#a8a29e" : r.highlight || i === 0 ? "#2f6b5f" : "#44403c";
        return (
          <g key={r.key}>
            <text x={left} y={y + 12} fontSize="12" fill="#1c1917">
              {r.label}
              <tspan fontSize="10" fill="#78716c">{`  n = ${r.n}${r.tag ? ` · ${r.tag}` : ""}`}</tspan>
            </text>
            <line x1={x(r.lower)} x2={x(r.upper)} y1={y + 26} y2={y + 26} stroke={colour} strokeWidth={3} strokeLinecap="round" />
            <circle cx={x(r.estimate)} cy={y + 26} r={5} fill={r.muted ? "#fff" : colour} stroke={colour} strokeWidth={2} />
          </g>
        );
      })}
    </svg>
  );
}

export function IntervalsExplained() {
  return (
    <p className="rounded-lg bg-white p-3 text-sm text-stone-700">
      Bayproof shows every success rate as a range, not as a single score or rank: a tool with 5 reports and a tool with 80 can
      show the same rate, but only the second is known well. Two tools are told apart only when the range of the difference
      between their rates leaves out zero; two ranges that overlap can still differ, so look at the mark beside each tool, not at
      whether the bars touch.
    </p>
  );
}

export const plainLine = (successes: number, n: number, lower: number, upper: number, what = "freed it") =>
  `${what[0]!.toUpperCase()}${what.slice(1)} in ${successes} of ${n} reports; between ${pct(lower)} and ${pct(upper)}.`;

export { pct, prob };
