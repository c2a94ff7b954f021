// Shared drawing pieces of the bench figures: the frame, the axes and the number format. Figures are
// drawn on the server as SVG (no JavaScript needed), scaled to the width of a phone, each with a
// title and description and a table beside it.
import { type scaleLinear } from "~/components/linear-scale";

export const INK = "#2f6b5f";
export const BAND = "#cfe3dd";
export const AXIS = "#57534e";
export const GRID = "#e7e5e4";
export const FIELD = "#92400e";

export const W = 360;
export const M = { l: 52, r: 12, t: 10, b: 36 };

export type Scale = ReturnType<typeof scaleLinear<number, number>>;

export const tick = (x: number) =>
  Math.abs(x) >= 1000 ? Math.round(x).toLocaleString("en-US") : String(Number(x.toPrecision(3)));

export type Margins = { l: number; r: number; t: number; b: number };

/** Grid lines with the y ticks, the x ticks and the x label; the frame is the figures' own unless given. */
export function Axes({
  x,
  y,
  H,
  W: width = W,
  m = M,
  xLabel,
  yFormat = tick,
}: {
  x: Scale;
  y: Scale;
  H: number;
  W?: number;
  m?: Margins;
  xLabel: string;
  yFormat?: (v: number) => string;
}) {
  return (
    <g aria-hidden="true">
      {y.ticks(4).map((t) => (
        <g key={`y${t}`}>
          <line x1={m.l} x2={width - m.r} y1={y(t)} y2={y(t)} stroke={GRID} />
          <text x={m.l - 5} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="11" fill={AXIS}>
            {yFormat(t)}
          </text>
        </g>
      ))}
      {x.ticks(4).map((t) => (
        <text key={`x${t}`} x={x(t)} y={H - m.b + 14} textAnchor="middle" fontSize="11" fill={AXIS}>
          {tick(t)}
        </text>
      ))}
      <text x={(m.l + width - m.r) / 2} y={H - 3} textAnchor="middle" fontSize="11" fill={AXIS}>
        {xLabel}
      </text>
    </g>
  );
}

/** An SVG that takes the width it is given (never more than its drawn width) and names itself. */
export function Figure({
  id,
  H,
  title,
  desc,
  children,
}: {
  id: string;
  H: number;
  title: string;
  desc: string;
  children: React.ReactNode;
}) {
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="h-auto w-full max-w-[360px]"
      role="img"
      aria-labelledby={`${id}-title ${id}-desc`}
    >
      <title id={`${id}-title`}>{title}</title>
      <desc id={`${id}-desc`}>{desc}</desc>
      {children}
    </svg>
  );
}
