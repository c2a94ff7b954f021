// Predicted share freed against inlet pressure, per tool, from the job's pooled fit: drawn in the
// browser from the stored fit (no round trip as the pressure moves). Each curve spans only the
// 10th–90th percentile of the tool's own known inlet pressures.
import { scaleLinear } from "~/components/linear-scale";
import { area, line } from "d3-shape";
import { kpaToPsi, psiToKpa } from "~/domain";
import { predictAt, type PooledCellFit } from "~/stats/predict";

export const CURVE_COLOURS = ["#2f6b5f", "#b45309", "#1d4ed8", "#7c3aed"];

export function PressureCurves({
  tools,
  psi,
}: {
  tools: { slug: string; label?: string; fit: PooledCellFit | null; colour: string }[];
  psi: number;
}) {
  const fitted = tools.filter((t) => t.fit);
  if (fitted.length === 0)
    return (
      <p className="text-sm text-stone-600">
        None of these tools has a pressure fit on this job, so there is no curve to draw.
      </p>
    );
  const W = 340,
    H = 220,
    m = { l: 46, r: 10, t: 10, b: 40 };
  const x = scaleLinear()
    .domain([60, 130])
    .range([m.l, W - m.r]);
  const y = scaleLinear()
    .domain([0, 1])
    .range([H - m.b, m.t]);
  return (
    <figure className="max-w-xl rounded-lg border border-stone-200 bg-white p-3">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="curves-title" className="h-auto w-full">
        <title id="curves-title">
          Share of jobs freed against the pressure at the tool, with the range each likely lies in
        </title>
        {y.ticks(2).map((t) => (
          <g key={t}>
            <line x1={m.l} x2={W - m.r} y1={y(t)} y2={y(t)} stroke="#e7e5e4" />
            <text x={m.l - 6} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="13" fill="#57534e">
              {Math.round(t * 100)} %
            </text>
          </g>
        ))}
        {x.ticks(4).map((t) => (
          <text key={t} x={x(t)} y={H - m.b + 16} textAnchor="middle" fontSize="13" fill="#57534e">
            {t}
          </text>
        ))}
        <text x={(m.l + W - m.r) / 2} y={H - 4} textAnchor="middle" fontSize="13" fill="#44403c">
          inlet pressure (psi)
        </text>
        <line x1={x(psi)} x2={x(psi)} y1={m.t} y2={H - m.b} stroke="#dc2626" strokeDasharray="5 4" />
        {fitted.map(({ slug, fit, colour }) => {
          const lo = Math.max(60, kpaToPsi(fit!.p10Kpa)),
            hi = Math.min(130, kpaToPsi(fit!.p90Kpa));
          const pts = Array.from({ length: 30 }, (_, i) => lo + ((hi - lo) * i) / 29).map((p) => ({
            p,
            ...predictAt(fit!, psiToKpa(p)),
          }));
          const band = area<(typeof pts)[number]>()
            .x((d) => x(d.p))
            .y0((d) => y(d.lower))
            .y1((d) => y(d.upper));
          const mid = line<(typeof pts)[number]>()
            .x((d) => x(d.p))
            .y((d) => y(d.estimate));
          return (
            <g key={slug}>
              <path d={band(pts) ?? ""} fill={colour} opacity={0.15} />
              <path d={mid(pts) ?? ""} fill="none" stroke={colour} strokeWidth={2.5} />
            </g>
          );
        })}
      </svg>
      <ChartKey
        items={fitted.map((t) => ({ key: t.slug, label: t.label ?? t.slug, colour: t.colour }))}
        extra="Red dashed line: the pressure chosen above."
      />
      <figcaption className="mt-1 text-xs text-stone-600">
        The shaded band is the range each tool's share likely lies in; a curve covers only the pressures its own reports
        ran at.
        <details className="mt-1">
          <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
          One logistic fit for the whole job (an intercept per tool, a common slope), 95 % Wald band on the logit scale;
          each curve spans the 10th–90th percentile of the tool's known inlet pressures.
        </details>
      </figcaption>
    </figure>
  );
}

/** Kaplan–Meier curves: share of jobs not yet freed against time, give-ups counted as censored. */
export function SurvivalCurves({
  tools,
}: {
  tools: { slug: string; label: string; steps: { time: number; survival: number }[] | null; colour: string }[];
}) {
  const drawn = tools.filter((t) => t.steps && t.steps.length > 0);
  if (drawn.length === 0) return null;
  const W = 340,
    H = 200,
    m = { l: 46, r: 10, t: 10, b: 40 };
  const maxT = Math.max(...drawn.flatMap((t) => t.steps!.map((s) => s.time)));
  const x = scaleLinear()
    .domain([0, maxT])
    .nice()
    .range([m.l, W - m.r]);
  const y = scaleLinear()
    .domain([0, 1])
    .range([H - m.b, m.t]);
  return (
    <figure className="max-w-xl rounded-lg border border-stone-200 bg-white p-3">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="km-title" className="h-auto w-full">
        <title id="km-title">Share of jobs not yet freed against time, counting the ones given up</title>
        {y.ticks(2).map((t) => (
          <g key={t}>
            <line x1={m.l} x2={W - m.r} y1={y(t)} y2={y(t)} stroke="#e7e5e4" />
            <text x={m.l - 6} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="13" fill="#57534e">
              {Math.round(t * 100)} %
            </text>
          </g>
        ))}
        {x.ticks(4).map((t) => (
          <text key={t} x={x(t)} y={H - m.b + 16} textAnchor="middle" fontSize="13" fill="#57534e">
            {t}
          </text>
        ))}
        <text x={(m.l + W - m.r) / 2} y={H - 4} textAnchor="middle" fontSize="13" fill="#44403c">
          seconds on the job
        </text>
        <line x1={m.l} x2={W - m.r} y1={y(0.5)} y2={y(0.5)} stroke="#a8a29e" strokeDasharray="4 4" />
        {drawn.map(({ slug, steps, colour }) => {
          let d = `M${x(0)},${y(1)}`;
          let prev = 1;
          for (const s of steps!) {
            d += `H${x(s.time)}V${y(s.survival)}`;
            prev = s.survival;
          }
          d += `H${x(maxT)}V${y(prev)}`;
          return <path key={slug} d={d} fill="none" stroke={colour} strokeWidth={2.5} />;
        })}
      </svg>
      <ChartKey
        items={drawn.map((t) => ({ key: t.slug, label: t.label, colour: t.colour }))}
        extra="Dashed line: half the jobs freed."
      />
      <figcaption className="mt-1 text-xs text-stone-600">
        Each step is a job freed; jobs not freed (or freed with help) leave the curve at the time the tool was given up.
        Where a curve crosses the dashed line is its median time to free it.
      </figcaption>
    </figure>
  );
}

/** The colours of a chart, named. */
function ChartKey({ items, extra }: { items: { key: string; label: string; colour: string }[]; extra?: string }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-stone-700" aria-label="Key">
      {items.map((i) => (
        <li key={i.key} className="flex items-center gap-1">
          <span className="inline-block h-1 w-5 rounded" style={{ background: i.colour }} aria-hidden />
          {i.label}
        </li>
      ))}
      {extra && <li>{extra}</li>}
    </ul>
  );
}
