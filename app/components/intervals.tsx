// Interval pictures, drawn as SVG on the server so they work without JavaScript. Every figure is
// also given as text beside or under the picture.
import { formatChance as prob, formatShare as pct } from "~/domain";

/** 0–1 onto [from, to]: all these pictures need of a scale, without shipping one to the browser. */
const shareAxis = (from: number, to: number) => (p: number) => from + p * (to - from);

/** A small 0–100 % bar with the interval as a band and the estimate as a tick. */
export function IntervalBar({
  estimate,
  lower,
  upper,
  muted = false,
}: {
  estimate: number;
  lower: number;
  upper: number;
  muted?: boolean;
}) {
  const x = shareAxis(2, 118);
  return (
    <svg viewBox="0 0 120 14" width="120" height="14" aria-hidden className="inline-block align-middle">
      <rect x="2" y="6" width="116" height="2" fill="#e7e5e4" />
      <rect
        x={x(lower)}
        y="3"
        width={Math.max(1, x(upper) - x(lower))}
        height="8"
        rx="2"
        fill={muted ? "#a8a29e" : "#2f6b5f"}
        opacity="0.35"
      />
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

const TOP = "#2f6b5f",
  OTHER = "#44403c",
  FEW = "#78716c";

/**
 * One row per tool: its name and count above, point and whisker below, on a shared 0–100 % axis.
 * Drawn 320 units wide so a phone shows it at full size or larger (text stays at least 12 px);
 * capped in width on wide screens so it does not grow into a poster.
 */
export function IntervalChart({ rows, title }: { rows: ChartRow[]; title: string }) {
  const rowH = 50,
    left = 8,
    right = 12,
    top = 24,
    W = 320;
  const H = top + rows.length * rowH + 6;
  const x = shareAxis(left, W - right);
  return (
    <figure className="max-w-xl">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="interval-chart-title" className="h-auto w-full">
        <title id="interval-chart-title">{title}</title>
        {[0, 0.25, 0.5, 0.75, 1].map((t) => (
          <line key={t} x1={x(t)} x2={x(t)} y1={top - 6} y2={H - 4} stroke="#e7e5e4" />
        ))}
        {/* Three labels, not five smaller ones. */}
        {[0, 0.5, 1].map((t) => (
          <text
            key={t}
            x={x(t)}
            y={top - 10}
            textAnchor={t === 0 ? "start" : t === 1 ? "end" : "middle"}
            fontSize="13"
            fill="#57534e"
          >
            {pct(t)}
          </text>
        ))}
        {rows.map((r, i) => {
          const y = top + i * rowH;
          const colour = r.muted ? FEW : r.highlight || i === 0 ? TOP : OTHER;
          return (
            <g key={r.key}>
              <text x={left} y={y + 13} fontSize="14" fill="#1c1917">
                {r.label}
              </text>
              <text x={W - right} y={y + 13} textAnchor="end" fontSize="13" fill="#57534e">{`${r.n} reports`}</text>
              <line
                x1={x(r.lower)}
                x2={x(r.upper)}
                y1={y + 32}
                y2={y + 32}
                stroke={colour}
                strokeWidth={3}
                strokeLinecap="round"
              />
              <circle
                cx={x(r.estimate)}
                cy={y + 32}
                r={6}
                fill={r.muted ? "#fff" : colour}
                stroke={colour}
                strokeWidth={2}
              />
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-2">
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-stone-700" aria-label="Key">
          <li className="flex items-center gap-1">
            <Swatch colour={TOP} />
            the top tool, and those not told apart from it
          </li>
          <li className="flex items-center gap-1">
            <Swatch colour={OTHER} />
            frees it less often than the top tool
          </li>
          <li className="flex items-center gap-1">
            <Swatch colour={FEW} hollow />
            too few reports to compare
          </li>
          <li>Dot: share freed; line: the range it likely lies in.</li>
        </ul>
      </figcaption>
    </figure>
  );
}

function Swatch({ colour, hollow = false }: { colour: string; hollow?: boolean }) {
  return (
    <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden className="shrink-0">
      <circle cx="7" cy="7" r="5" fill={hollow ? "#fff" : colour} stroke={colour} strokeWidth="2" />
    </svg>
  );
}

export function IntervalsExplained() {
  return (
    <p className="rounded-lg bg-white p-3 text-sm text-stone-700">
      Bayproof shows every success rate as a range, not as a single score or rank: a tool with 5 reports and a tool with
      80 can show the same rate, but only the second is known well. Two tools are told apart only when the range of the
      difference between their rates leaves out zero; two ranges that overlap can still differ, so look at the mark
      beside each tool, not at whether the bars touch.
    </p>
  );
}

export const plainLine = (successes: number, n: number, lower: number, upper: number, what = "freed it") =>
  `${what[0]!.toUpperCase()}${what.slice(1)} in ${successes} of ${n} reports; between ${pct(lower)} and ${pct(upper)}.`;

export { pct, prob };
