// "The force this job takes": the chance that a report frees the job against the tool's bench force,
// with its band, the force at which half do (ED50) with its interval, and the models placed on the
// curve — by their bench force, or, without bench data, where the curve meets their field success.
import { scaleLinear } from "~/components/linear-scale";
import { area, line } from "d3-shape";
import { benchUnit, formatBench } from "~/bench/terms";
import type { JobForce } from "~/bench/figures-read.server";
import { Link } from "react-router";
import { formatChance, toolName, type Units } from "~/domain";
import { DataTable } from "../ui";
import { Axes, BAND, FIELD, Figure, INK, M, W } from "./svg";

const H = 240;
type Point = JobForce["curve"][number];

export function ForceCurvePanel({ data, units }: { data: JobForce | null; units: Units }) {
  if (!data) return null;
  const q = data.quantity;
  const u = benchUnit(q, units);
  const f = (v: number | null) => formatBench(q, v, units);
  const x = scaleLinear()
    .domain([data.curve[0]!.force * u.perSi, data.curve[data.curve.length - 1]!.force * u.perSi])
    .range([M.l, W - M.r]);
  const y = scaleLinear()
    .domain([0, 1])
    .range([H - M.b, M.t]);
  const band = area<Point>()
    .x((p) => x(p.force * u.perSi))
    .y0((p) => y(p.lower))
    .y1((p) => y(p.upper))(data.curve);
  const curve = line<Point>()
    .x((p) => x(p.force * u.perSi))
    .y((p) => y(p.estimate))(data.curve);
  const chanceAt = (force: number) => 1 / (1 + Math.exp(-(data.intercept + data.slope * force)));
  const fromField = data.placed.some((m) => m.placedFrom === "field");
  // A half-way force outside the bench forces on record is an extrapolation (it can even come out
  // below zero): the page says where it lies instead of printing it.
  const below = data.ed50 < data.force_min;
  const above = data.ed50 > data.force_max;
  return (
    <section aria-labelledby="job-force-heading" className="space-y-3">
      <h2 id="job-force-heading" className="text-lg font-semibold">
        The force this job takes
      </h2>
      <p className="text-sm">
        {below ? (
          <>
            Half or more of the reports free this job even with the weakest tool measured ({f(data.force_min)}): the
            force at which half do lies below every bench force on record, so it is not given.
          </>
        ) : above ? (
          <>
            Fewer than half the reports free this job even with the strongest tool measured ({f(data.force_max)}): the
            force at which half would lies above every bench force on record, so it is not given.
          </>
        ) : (
          <>
            Half the reports free this job with a tool of about <strong>{f(data.ed50)}</strong>
            {data.ed50_lower != null && data.ed50_upper != null
              ? ` (95 % interval ${data.ed50_lower < data.force_min ? `from under ${f(data.force_min)}` : f(data.ed50_lower)} to ${data.ed50_upper > data.force_max ? `over ${f(data.force_max)}` : f(data.ed50_upper)})`
              : " (the reports do not pin the interval down)"}
            .
          </>
        )}
      </p>
      <figure className="space-y-1">
        <Figure
          id="job-force-curve"
          H={H}
          title={`Chance of freeing the job against bench force (${u.label})`}
          desc={`A rising curve with its 95 % band; ${below ? "half or more of the reports free the job at every force on record" : above ? "fewer than half free it at any force on record" : `the force at which half the reports free the job is ${f(data.ed50)}`}. ${data.placed.length} models are marked on the curve.`}
        >
          <Axes
            x={x}
            y={y}
            H={H}
            xLabel={`Bench force at the inlet (${u.label})`}
            yFormat={(v) => `${Math.round(v * 100)}%`}
          />
          {band && <path d={band} fill={BAND} />}
          {curve && <path d={curve} fill="none" stroke={INK} strokeWidth="2" />}
          {!below && !above && (
            <line
              x1={x(data.ed50 * u.perSi)}
              x2={x(data.ed50 * u.perSi)}
              y1={M.t}
              y2={H - M.b}
              stroke={INK}
              strokeDasharray="3 3"
            />
          )}
          {data.placed.map((m) => (
            <circle
              key={m.id}
              cx={x(m.force * u.perSi)}
              cy={y(chanceAt(m.force))}
              r="4"
              fill={m.placedFrom === "bench" ? INK : "white"}
              stroke={m.placedFrom === "bench" ? "white" : FIELD}
              strokeWidth="1.5"
            />
          ))}
        </Figure>
        <figcaption className="text-xs text-stone-600">
          Filled dots: placed by their bench force at 90 psi.{" "}
          {fromField && "Open dots: no bench data; placed from their field reports only."}
        </figcaption>
      </figure>
      <DataTable
        label="Models on the force curve"
        head={
          <tr>
            <th className="px-3 py-2">Model</th>
            <th className="px-3 py-2">Force</th>
            <th className="px-3 py-2">Chance on the curve</th>
          </tr>
        }
      >
        {data.placed.map((m) => (
          <tr key={m.id} className="border-t border-stone-100">
            <th scope="row" className="px-3 py-2 font-normal">
              <Link to={`/models/${m.slug}`} className="text-bay-700 underline">
                {toolName(m.maker_name, m.model_code)}
              </Link>
            </th>
            <td className="px-3 py-2">
              {f(m.force)}
              {m.placedFrom === "field" && (
                <span className="block text-xs text-stone-600">from field reports only, no bench data</span>
              )}
            </td>
            <td className="px-3 py-2">{formatChance(chanceAt(m.force))}</td>
          </tr>
        ))}
      </DataTable>
      <details className="text-sm">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <p className="mt-2 text-stone-700">
          A logistic regression of whether each accepted report freed the job ({data.reports} reports of {data.models}{" "}
          models with bench data) on the tool's bench force at the report's inlet pressure — the model's pressure line
          where it has one, else its pooled full-trigger force — in place of a separate level per model, so one curve
          serves every tool, tested or not.{" "}
          {data.firth ? "Firth's penalised likelihood (the reports separate by force). " : "Maximum likelihood. "}
          The force at which half the reports free the job has a 95 %{" "}
          {data.method === "Fieller" ? "Fieller" : "delta-method"} interval; the band is pointwise 95 %. Inlet pressures
          read at a regulator are carried to the tool through the reported hose and couplers; estimated ones are left
          out.
        </p>
      </details>
    </section>
  );
}
