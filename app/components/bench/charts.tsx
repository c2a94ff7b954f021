// The bench's pictures, drawn as SVG on the server (they work without JavaScript); every figure is
// also given as text beside the picture. Values arrive in SI and are drawn in the reader's unit.
import { scaleLinear } from "~/components/linear-scale";
import { line } from "d3-shape";
import { AXIS, Axes, GRID, INK, tick } from "~/components/bench-figures/svg";

const W = 360;
const ALARM = "#b91c1c";

interface Frame {
  width?: number;
  height: number;
  left?: number;
}

function frame({ width = W, height, left = 52 }: Frame) {
  return { W: width, H: height, m: { l: left, r: 10, t: 10, b: 34 } };
}

/** A calibration: the rig's readings against the reference loads with the fitted curve, and the residuals below. */
export function CalibrationPlot({
  residuals,
  coefficients,
  residualSD,
  unit,
  perSi,
}: {
  residuals: { reference: number; reading: number; fitted: number; residual: number }[];
  coefficients: number[];
  residualSD: number;
  unit: string;
  perSi: number;
}) {
  const { W: w, H, m } = frame({ height: 200 });
  const refs = residuals.map((r) => r.reference * perSi);
  const x = scaleLinear()
    .domain([0, Math.max(...refs) * 1.05])
    .range([m.l, w - m.r])
    .nice();
  const y = scaleLinear()
    .domain([0, Math.max(...residuals.map((r) => r.reading * perSi)) * 1.05])
    .range([H - m.b, m.t])
    .nice();
  const curve = Array.from({ length: 40 }, (_, i) => (x.domain()[1] * i) / 39);
  const predict = (refSi: number) => coefficients.reduce((sum, c, k) => sum + c * refSi ** k, 0);
  const path = line<number>()
    .x((r) => x(r))
    .y((r) => y(predict(r / perSi) * perSi))(curve);
  const r = frame({ height: 150 });
  const span = Math.max(3 * residualSD, ...residuals.map((p) => Math.abs(p.residual))) * perSi * 1.1 || 1;
  const ry = scaleLinear()
    .domain([-span, span])
    .range([r.H - r.m.b, r.m.t]);
  return (
    <div className="grid gap-3 md:grid-cols-2">
      <figure className="rounded-lg border border-stone-200 bg-white p-2">
        <svg viewBox={`0 0 ${w} ${H}`} role="img" aria-labelledby="cal-fit-title" className="h-auto w-full">
          <title id="cal-fit-title">Rig reading against reference load, with the fitted calibration curve</title>
          <Axes x={x} y={y} H={H} W={w} m={m} xLabel={`reference (${unit})`} />
          <path d={path ?? ""} fill="none" stroke={INK} strokeWidth={2} />
          {residuals.map((p) => (
            <circle key={p.reference} cx={x(p.reference * perSi)} cy={y(p.reading * perSi)} r={3.5} fill="#1c1917" />
          ))}
        </svg>
        <figcaption className="px-1 text-xs text-stone-600">Reading ({unit}) against the reference load.</figcaption>
      </figure>
      <figure className="rounded-lg border border-stone-200 bg-white p-2">
        <svg viewBox={`0 0 ${r.W} ${r.H}`} role="img" aria-labelledby="cal-res-title" className="h-auto w-full">
          <title id="cal-res-title">
            Residuals of the calibration fit, with a band of two residual standard deviations
          </title>
          <rect
            x={r.m.l}
            width={r.W - r.m.l - r.m.r}
            y={ry(2 * residualSD * perSi)}
            height={Math.max(0, ry(-2 * residualSD * perSi) - ry(2 * residualSD * perSi))}
            fill={INK}
            opacity={0.12}
          />
          <Axes
            x={x.copy().range([r.m.l, r.W - r.m.r])}
            y={ry}
            H={r.H}
            W={r.W}
            m={r.m}
            xLabel={`reference (${unit})`}
          />
          <line x1={r.m.l} x2={r.W - r.m.r} y1={ry(0)} y2={ry(0)} stroke={AXIS} />
          {residuals.map((p) => (
            <circle
              key={p.reference}
              cx={x.copy().range([r.m.l, r.W - r.m.r])(p.reference * perSi)}
              cy={ry(p.residual * perSi)}
              r={3.5}
              fill="#1c1917"
            />
          ))}
        </svg>
        <figcaption className="px-1 text-xs text-stone-600">
          Residual ({unit}): reading less the fitted value; the band is ±2 residual standard deviations.
        </figcaption>
      </figure>
    </div>
  );
}

/** An individuals control chart: each session's check reading, the centre line and the 3-sigma limits. */
export function IndividualsChart({
  points,
  centre,
  lower,
  upper,
  labels,
  unit,
  perSi,
}: {
  points: { index: number; value: number; outOfControl: boolean }[];
  centre: number;
  lower: number;
  upper: number;
  labels: string[];
  unit: string;
  perSi: number;
}) {
  const { W: w, H, m } = frame({ height: 220 });
  const values = points.map((p) => p.value * perSi);
  const lo = Math.min(lower * perSi, ...values);
  const hi = Math.max(upper * perSi, ...values);
  const pad = (hi - lo) * 0.08;
  const x = scaleLinear()
    .domain([0, Math.max(1, points.length - 1)])
    .range([m.l, w - m.r]);
  const y = scaleLinear()
    .domain([lo - pad, hi + pad])
    .range([H - m.b, m.t]);
  const path = line<(typeof points)[number]>()
    .x((p) => x(p.index))
    .y((p) => y(p.value * perSi))(points);
  const limit = (v: number, name: string) => (
    <g>
      <line x1={m.l} x2={w - m.r} y1={y(v * perSi)} y2={y(v * perSi)} stroke={ALARM} strokeDasharray="5 4" />
      <text x={w - m.r} y={y(v * perSi) - 3} textAnchor="end" fontSize="10" fill={ALARM}>
        {name}
      </text>
    </g>
  );
  return (
    <figure className="rounded-lg border border-stone-200 bg-white p-2">
      <svg viewBox={`0 0 ${w} ${H}`} role="img" aria-labelledby="check-chart-title" className="h-auto w-full">
        <title id="check-chart-title">
          Check-standard reading per session, with the centre line and the upper and lower control limits
        </title>
        <Axes x={x} y={y} H={H} W={w} m={m} xLabel="session (oldest to newest)" />
        <line x1={m.l} x2={w - m.r} y1={y(centre * perSi)} y2={y(centre * perSi)} stroke={INK} />
        {limit(upper, "upper limit")}
        {limit(lower, "lower limit")}
        <path d={path ?? ""} fill="none" stroke="#a8a29e" />
        {points.map((p) =>
          p.outOfControl ? (
            <rect
              key={p.index}
              x={x(p.index) - 4.5}
              y={y(p.value * perSi) - 4.5}
              width={9}
              height={9}
              transform={`rotate(45 ${x(p.index)} ${y(p.value * perSi)})`}
              fill={ALARM}
            >
              <title>{`${labels[p.index] ?? ""}: outside the limits`}</title>
            </rect>
          ) : (
            <circle key={p.index} cx={x(p.index)} cy={y(p.value * perSi)} r={3} fill="#1c1917">
              <title>{labels[p.index] ?? ""}</title>
            </circle>
          ),
        )}
      </svg>
      <figcaption className="px-1 text-xs text-stone-600">
        Reading ({unit}) per session. Red diamonds fell outside the limits; runs of those sessions are held for review.
      </figcaption>
    </figure>
  );
}

/** The spread of blows: one row per trial, a dot per blow and a tick at the trial's mean. */
export function BlowStrip({
  trials,
  unit,
  perSi,
  title,
}: {
  trials: { trial: number; peaks: number[] }[];
  unit: string;
  perSi: number;
  title: string;
}) {
  const rowH = 22;
  const { W: w, m } = frame({ height: 0, left: 40 });
  const H = m.t + trials.length * rowH + m.b;
  const all = trials.flatMap((t) => t.peaks.map((p) => p * perSi));
  const x = scaleLinear()
    .domain([Math.min(...all) * 0.95, Math.max(...all) * 1.03])
    .range([m.l, w - m.r])
    .nice();
  const y = scaleLinear()
    .domain([0, trials.length])
    .range([m.t, m.t + trials.length * rowH]);
  return (
    <svg viewBox={`0 0 ${w} ${H}`} role="img" aria-label={title} className="h-auto w-full">
      {x.ticks(4).map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={m.t} y2={H - m.b} stroke={GRID} />
          <text x={x(t)} y={H - m.b + 14} textAnchor="middle" fontSize="11" fill={AXIS}>
            {tick(t)}
          </text>
        </g>
      ))}
      <text x={(m.l + w - m.r) / 2} y={H - 3} textAnchor="middle" fontSize="11" fill={AXIS}>
        {`peak per blow (${unit})`}
      </text>
      {trials.map((t, i) => {
        const mean = t.peaks.reduce((s, p) => s + p, 0) / t.peaks.length;
        const cy = y(i + 0.5);
        return (
          <g key={t.trial}>
            <text x={m.l - 6} y={cy} textAnchor="end" dominantBaseline="middle" fontSize="11" fill={AXIS}>
              {`trial ${t.trial}`}
            </text>
            {t.peaks.map((p, k) => (
              <circle key={k} cx={x(p * perSi)} cy={cy + (((k * 7) % 9) - 4)} r={2} fill={INK} opacity={0.45} />
            ))}
            <rect x={x(mean * perSi) - 1.5} y={cy - 9} width={3} height={18} fill="#1c1917" />
          </g>
        );
      })}
    </svg>
  );
}
