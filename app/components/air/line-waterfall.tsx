// The pressure along the line while the tool runs, as a waterfall: the regulator setting, what each
// segment takes (couplers and hoses in the order the air meets them), and what is left at the tool
// inlet. Drawn on the server like the bore chart; every figure is written out beside its bar.
import { scaleLinear } from "~/components/linear-scale";
import type { SegmentPressure } from "~/air/line";
import { formatPressure, kpaTo, type PressureUnit } from "~/domain";

const W = 330;
const ROW = 46;
const TOP = 8;
const AXIS = 42;
const FILL = { entered: "#57534e", hose: "#d97706", coupler: "#dc2626", inlet: "#2f6b5f" } as const;

/** A white outline under row text, so the rating line behind it never cuts a figure. */
const HALO = { stroke: "white", strokeWidth: 4, paintOrder: "stroke", strokeLinejoin: "round" } as const;

interface Row {
  label: string;
  from: number;
  to: number;
  text: string;
  fill: string;
  estimate: boolean;
}

export function LineWaterfall({
  supplyKpa,
  segments,
  inletKpa,
  ratingKpa,
  pressureUnit,
}: {
  supplyKpa: number;
  segments: SegmentPressure[];
  inletKpa: number;
  ratingKpa: number;
  pressureUnit: PressureUnit;
}) {
  const p = (kpa: number) => formatPressure(kpa, pressureUnit);
  const rows: Row[] = [
    { label: "Regulator setting", from: 0, to: supplyKpa, text: p(supplyKpa), fill: FILL.entered, estimate: false },
    ...segments
      .filter((s) => s.kind !== "regulator")
      .map((s) => ({
        label: s.label,
        from: s.outletKpa,
        to: s.inletKpa,
        text: `−${p(s.dropKpa)} → ${p(s.outletKpa)}`,
        fill: s.kind === "coupler" ? FILL.coupler : FILL.hose,
        estimate: true,
      })),
    { label: "At the tool inlet", from: 0, to: inletKpa, text: p(inletKpa), fill: FILL.inlet, estimate: true },
  ];
  // Zoomed on the band where the pressure goes; the axis says where it starts.
  const low = Math.min(inletKpa, ratingKpa);
  const x = scaleLinear()
    .domain([
      kpaTo(Math.max(0, low - 0.25 * Math.max(supplyKpa - low, 0.1 * supplyKpa)), pressureUnit),
      kpaTo(Math.max(supplyKpa, ratingKpa), pressureUnit),
    ])
    .nice()
    .range([14, W - 14]);
  const [d0] = x.domain();
  const toX = (kpa: number) => x(Math.max(d0, kpaTo(kpa, pressureUnit)));
  const H = TOP + rows.length * ROW + AXIS;
  const summary = rows.map((r) => `${r.label}: ${r.text}`).join("; ");

  return (
    <figure className="rounded-lg border border-stone-200 bg-white p-3">
      <p className="mb-1 text-sm font-semibold text-stone-800">Pressure along your line while the tool runs</p>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        role="img"
        aria-labelledby="waterfall-title waterfall-desc"
        className="h-auto w-full max-w-md"
        data-testid="line-waterfall"
      >
        <title id="waterfall-title">Pressure from the regulator to the tool inlet, segment by segment</title>
        <desc id="waterfall-desc">{summary}</desc>
        <defs>
          <pattern id="estimate-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="6" height="6" fill="white" fillOpacity="0.0" />
            <line x1="0" y1="0" x2="0" y2="6" stroke="white" strokeWidth="2" strokeOpacity="0.55" />
          </pattern>
        </defs>
        {x.ticks(4).map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={TOP} y2={H - AXIS + 4} stroke="#e7e5e4" />
            <text x={x(t)} y={H - AXIS + 20} textAnchor="middle" fontSize="12" fill="#57534e">
              {t}
            </text>
          </g>
        ))}
        <text x={W / 2} y={H - 4} textAnchor="middle" fontSize="12" fill="#44403c">
          {pressureUnit}, gauge (scale starts at {d0})
        </text>
        <line
          x1={toX(ratingKpa)}
          x2={toX(ratingKpa)}
          y1={TOP}
          y2={H - AXIS + 4}
          stroke="#b91c1c"
          strokeWidth={1.5}
          strokeDasharray="5 3"
        />
        {rows.map((r, i) => {
          const y = TOP + i * ROW;
          const left = toX(r.from);
          const width = Math.max(1.5, toX(r.to) - left);
          return (
            <g key={`${r.label}-${i}`}>
              <text x={4} y={y + 13} fontSize="13" fill="#1c1917" {...HALO}>
                {r.label}
              </text>
              <text
                x={W - 4}
                y={y + 13}
                fontSize="13"
                textAnchor="end"
                fill="#1c1917"
                {...HALO}
                fontWeight={i === rows.length - 1 ? 700 : 400}
              >
                {r.text}
              </text>
              <rect x={left} y={y + 19} width={width} height={16} fill={r.fill} rx={2} />
              {r.estimate && <rect x={left} y={y + 19} width={width} height={16} fill="url(#estimate-hatch)" rx={2} />}
              {i > 0 && i < rows.length - 1 && (
                <line x1={left} x2={left} y1={y + 35} y2={y + ROW + 19} stroke="#a8a29e" strokeDasharray="2 2" />
              )}
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-2 space-y-1 text-xs text-stone-700">
        <span className="flex flex-wrap gap-x-4 gap-y-1">
          <Swatch fill={FILL.entered}>as you entered it</Swatch>
          <Swatch fill={FILL.hose} hatched>
            hose loss (estimate)
          </Swatch>
          <Swatch fill={FILL.coupler} hatched>
            coupler loss (estimate)
          </Swatch>
          <Swatch fill={FILL.inlet} hatched>
            left at the inlet (estimate)
          </Swatch>
          <span className="flex items-center gap-1">
            <span aria-hidden className="inline-block h-3 w-0 border-l-2 border-dashed border-red-700" /> tool rating,{" "}
            {p(ratingKpa)}
          </span>
        </span>
        <span className="block">
          Striped bars are estimates from the line model, not readings: each segment is worked out at the pressure where
          it sits, at the air the tool draws while running.
        </span>
      </figcaption>
    </figure>
  );
}

function Swatch({ fill, hatched = false, children }: { fill: string; hatched?: boolean; children: React.ReactNode }) {
  const stripes = "repeating-linear-gradient(45deg, rgba(255,255,255,0.55) 0 2px, transparent 2px 6px)";
  return (
    <span className="flex items-center gap-1">
      <span
        aria-hidden
        className="inline-block h-3 w-4 rounded-sm"
        style={{ background: hatched ? `${stripes}, ${fill}` : fill }}
      />
      {children}
    </span>
  );
}
