// A raw trace drawn for reading: the signal decimated to a min–max band per pixel column, each
// detected blow marked, and clipped blows (at the sensor's capacity) marked apart. Used on a run's
// page (from the server's analysis) and in the filing form's preview (from the browser's).
import { useId } from "react";
import { scaleLinear } from "~/components/linear-scale";
import { area } from "d3-shape";

export interface TraceDrawing {
  buckets: { timeS: number; min: number; max: number }[];
  blows: { timeS: number; peak: number; clipped: boolean }[];
  baseline: number;
  capacity?: number | null;
}

export function TracePlot({
  drawing,
  unit,
  perSi,
  title,
}: {
  drawing: TraceDrawing;
  unit: string;
  perSi: number;
  title: string;
}) {
  const titleId = useId();
  const W = 360,
    H = 190,
    m = { l: 52, r: 8, t: 10, b: 34 };
  const { buckets, blows } = drawing;
  const end = buckets.at(-1)?.timeS ?? 1;
  const top = Math.max(...buckets.map((b) => b.max), ...blows.map((b) => b.peak), drawing.capacity ?? 0) * perSi;
  const bottom = Math.min(0, ...buckets.map((b) => b.min * perSi));
  const x = scaleLinear()
    .domain([0, end])
    .range([m.l, W - m.r]);
  const y = scaleLinear()
    .domain([bottom, top * 1.05])
    .range([H - m.b, m.t])
    .nice();
  const band = area<(typeof buckets)[number]>()
    .x((b) => x(b.timeS))
    .y0((b) => y(b.min * perSi))
    .y1((b) => y(b.max * perSi));
  const clipped = blows.filter((b) => b.clipped).length;
  return (
    <figure className="rounded-lg border border-stone-200 bg-white p-2">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby={titleId} className="h-auto w-full">
        <title id={titleId}>{`${title}: the raw signal with ${blows.length} detected blows marked`}</title>
        {y.ticks(4).map((t) => (
          <g key={t}>
            <line x1={m.l} x2={W - m.r} y1={y(t)} y2={y(t)} stroke="#e7e5e4" />
            <text x={m.l - 5} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="11" fill="#57534e">
              {Math.round(t).toLocaleString("en-US")}
            </text>
          </g>
        ))}
        {x.ticks(5).map((t) => (
          <text key={t} x={x(t)} y={H - m.b + 14} textAnchor="middle" fontSize="11" fill="#57534e">
            {t}
          </text>
        ))}
        <text x={(m.l + W - m.r) / 2} y={H - 3} textAnchor="middle" fontSize="11" fill="#57534e">
          {`time (s) · ${unit}`}
        </text>
        {drawing.capacity != null && (
          <line
            x1={m.l}
            x2={W - m.r}
            y1={y(drawing.capacity * perSi)}
            y2={y(drawing.capacity * perSi)}
            stroke="#b91c1c"
            strokeDasharray="4 3"
          />
        )}
        <path d={band(buckets) ?? ""} fill="#2f6b5f" stroke="#2f6b5f" strokeWidth={0.6} opacity={0.8} />
        {blows.map((b, i) => (
          <path
            key={i}
            d={`M${x(b.timeS)},${y(b.peak * perSi) - 9} l-3.5,-6 h7 z`}
            fill={b.clipped ? "#b91c1c" : "#1c1917"}
            data-blow=""
          />
        ))}
      </svg>
      <figcaption className="px-1 text-xs text-stone-600">
        {blows.length} blows detected{clipped > 0 ? `, ${clipped} clipped at the sensor's capacity (red)` : ""}; each
        marked with a triangle above its peak.
        {drawing.capacity != null ? " The dashed line is the sensor's capacity." : ""}
      </figcaption>
    </figure>
  );
}
