// A model's force against the running inlet pressure: each run's mean as a point, the fitted line
// and its pointwise band, and the force predicted at 90 psi.
import { scaleLinear } from "~/components/linear-scale";
import { area, line } from "d3-shape";
import { benchUnit, type BenchQuantity } from "~/bench/terms";
import { formatPressure, type Units } from "~/domain";
import type { ModelAcrossRigs } from "~/bench/figures-read.server";
import { Axes, BAND, Figure, INK, M, W } from "./svg";

const H = 220;
type Slope = NonNullable<ModelAcrossRigs["slope"]>;
type PressurePointRow = Slope["points"][number];
type BandPointRow = Slope["band"][number];

export function PressurePlot({
  quantity,
  points,
  band,
  atKpa,
  predicted,
  units,
}: {
  quantity: BenchQuantity;
  points: PressurePointRow[];
  band: BandPointRow[];
  atKpa: number;
  predicted: number;
  units: Units;
}) {
  const u = benchUnit(quantity, units);
  const pu = units.pressure;
  // kPa in the reader's pressure unit (1 psi = 6.894757 kPa, 1 bar = 100 kPa; exact by definition).
  const px = (kpa: number) => (pu === "psi" ? kpa / 6.894757 : pu === "bar" ? kpa / 100 : kpa);
  const ps = [...points.map((p) => p.pressureKpa), atKpa];
  const fs = [...points.map((p) => p.force), ...band.flatMap((b) => [b.lower, b.upper]), predicted];
  const x = scaleLinear()
    .domain([px(Math.min(...ps)), px(Math.max(...ps))])
    .nice()
    .range([M.l, W - M.r]);
  const y = scaleLinear()
    .domain([Math.min(...fs) * u.perSi, Math.max(...fs) * u.perSi])
    .nice()
    .range([H - M.b, M.t]);
  const bandPath = area<BandPointRow>()
    .x((b) => x(px(b.pressureKpa)))
    .y0((b) => y(b.lower * u.perSi))
    .y1((b) => y(b.upper * u.perSi))(band);
  const linePath = line<BandPointRow>()
    .x((b) => x(px(b.pressureKpa)))
    .y((b) => y(b.fit * u.perSi))(band);
  return (
    <Figure
      id="pressure-plot"
      H={H}
      title={`Force against inlet pressure (${u.label})`}
      desc={`${points.length} runs' means as points, the fitted straight line with its 95 % band, and the force at ${formatPressure(atKpa, units.pressure)} marked.`}
    >
      <Axes x={x} y={y} H={H} xLabel={`Running inlet pressure (${pu}); force in ${u.label}`} />
      {bandPath && <path d={bandPath} fill={BAND} />}
      {linePath && <path d={linePath} fill="none" stroke={INK} strokeWidth="2" />}
      {points.map((p, i) => (
        <circle
          key={i}
          cx={x(px(p.pressureKpa))}
          cy={y(p.force * u.perSi)}
          r="3.5"
          fill="white"
          stroke={INK}
          strokeWidth="1.5"
        />
      ))}
      <line x1={x(px(atKpa))} x2={x(px(atKpa))} y1={M.t} y2={H - M.b} stroke={INK} strokeDasharray="3 3" />
      <circle cx={x(px(atKpa))} cy={y(predicted * u.perSi)} r="4.5" fill={INK} />
    </Figure>
  );
}
