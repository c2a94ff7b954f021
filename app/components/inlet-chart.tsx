import { scaleLinear } from "~/components/linear-scale";
import { line } from "d3-shape";
import { inletAlongLengths } from "~/air/analysis";
import type { ToolAir } from "~/air/line";
import type { ShopLine } from "~/air/shop-line";
import { ftToM, HOSE_BORES, inToMm, kpaTo, mToFt, type PressureUnit } from "~/domain";

const COLOURS = ["#b45309", "#2f6b5f", "#1d4ed8", "#7c3aed"];
const LABELS = HOSE_BORES.map((b) => `${b.inText} in`);

interface Props {
  supplyKpa: number;
  tool: ToolAir;
  line: ShopLine;
  ratingKpa: number;
  current: { hoseLengthM: number; inletKpa: number };
  pressureUnit: PressureUnit;
  metric: boolean;
}

/** Inlet pressure against hose length for the four common hose bores, with the rating line, at the tool's running air use. */
export function InletChart({ supplyKpa, tool, line: shopLine, ratingKpa, current, pressureUnit, metric }: Props) {
  const W = 560,
    H = 300,
    m = { l: 48, r: 16, t: 12, b: 40 };
  const maxLength = Math.max(metric ? 30 : ftToM(100), current.hoseLengthM);
  const lengths = Array.from({ length: 41 }, (_, i) => (maxLength * i) / 40);
  const series = HOSE_BORES.map((b) =>
    inletAlongLengths(supplyKpa, tool, { ...shopLine, hoseIdMm: inToMm(b.in) }, lengths),
  );
  const x = scaleLinear()
    .domain([0, metric ? maxLength : mToFt(maxLength)])
    .range([m.l, W - m.r]);
  // Zoom on the band that matters: from a little under the lowest curve (or the rating) to the supply.
  const lowest = Math.min(ratingKpa, ...series.flat().map((p) => p.inletKpa));
  const y = scaleLinear()
    .domain([
      kpaTo(Math.max(0, lowest - 0.1 * supplyKpa), pressureUnit),
      kpaTo(Math.max(supplyKpa, ratingKpa) * 1.02, pressureUnit),
    ])
    .nice()
    .range([H - m.b, m.t]);
  const toX = (lengthM: number) => x(metric ? lengthM : mToFt(lengthM));
  const toY = (kpa: number) => y(kpaTo(kpa, pressureUnit));
  const path = line<{ hoseLengthM: number; inletKpa: number }>()
    .x((p) => toX(p.hoseLengthM))
    .y((p) => toY(p.inletKpa));

  return (
    <figure className="rounded-lg border border-stone-200 bg-white p-3">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="inlet-chart-title" className="h-auto w-full">
        <title id="inlet-chart-title">Inlet pressure against hose length for 1/4, 5/16, 3/8 and 1/2 in hose</title>
        {y.ticks(5).map((t) => (
          <g key={t}>
            <line x1={m.l} x2={W - m.r} y1={y(t)} y2={y(t)} stroke="#e7e5e4" />
            <text x={m.l - 6} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="11" fill="#57534e">
              {t}
            </text>
          </g>
        ))}
        {x.ticks(6).map((t) => (
          <text key={t} x={x(t)} y={H - m.b + 16} textAnchor="middle" fontSize="11" fill="#57534e">
            {t}
          </text>
        ))}
        <text x={(m.l + W - m.r) / 2} y={H - 6} textAnchor="middle" fontSize="12" fill="#44403c">
          hose length ({metric ? "m" : "ft"})
        </text>
        <text
          x={12}
          y={(m.t + H - m.b) / 2}
          transform={`rotate(-90 12 ${(m.t + H - m.b) / 2})`}
          textAnchor="middle"
          fontSize="12"
          fill="#44403c"
        >
          inlet ({pressureUnit})
        </text>
        <line x1={m.l} x2={W - m.r} y1={toY(ratingKpa)} y2={toY(ratingKpa)} stroke="#dc2626" strokeDasharray="6 4" />
        <text x={W - m.r} y={toY(ratingKpa) - 5} textAnchor="end" fontSize="11" fill="#b91c1c">
          tool rating
        </text>
        {series.map((points, i) => (
          <path key={LABELS[i]} d={path(points) ?? ""} fill="none" stroke={COLOURS[i]} strokeWidth={2.5} />
        ))}
        <circle
          cx={toX(current.hoseLengthM)}
          cy={toY(current.inletKpa)}
          r={6}
          fill="#111"
          stroke="#fff"
          strokeWidth={2}
        >
          <title>Your hose</title>
        </circle>
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-stone-700">
        {LABELS.map((label, i) => (
          <span key={label} className="flex items-center gap-1">
            <span className="inline-block h-1 w-5 rounded" style={{ background: COLOURS[i] }} aria-hidden /> {label}{" "}
            bore
          </span>
        ))}
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-3 rounded-full bg-stone-900" aria-hidden /> your hose
        </span>
      </figcaption>
    </figure>
  );
}
