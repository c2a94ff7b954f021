// "Across rigs" on a model's page: each series pooled over the runs of every rig, how much of the
// spread is the rig (τ, I²), where the next rig's figure should fall, the force against inlet
// pressure, and figures derived from the pooled force. Each stands alone; none is added to another.
import { benchUnit, formatBench, formatDerived, TRIGGER_LABELS } from "~/bench/terms";
import type { ModelAcrossRigs } from "~/bench/figures-read.server";
import { formatPressure, formatShare, type Units } from "~/domain";
import { DataTable } from "../ui";
import { PressurePlot } from "./pressure-plot";

export function AcrossRigsPanel({ data, units }: { data: ModelAcrossRigs; units: Units }) {
  const { forces, ranges, slope, derived } = data;
  if (forces.length === 0) return null;
  const fmt = (q: (typeof forces)[number]["quantity"], v: number | null) => formatBench(q, v, units);
  return (
    <section aria-labelledby="across-rigs-heading" className="space-y-3">
      <h2 id="across-rigs-heading" className="text-lg font-semibold">
        Across rigs
      </h2>
      <p className="text-sm text-stone-700">
        Each series pooled over every accepted run, whichever rig measured it, with the spread between rigs shown rather
        than averaged away.
      </p>
      <DataTable
        label="Pooled bench figures per series"
        head={
          <tr>
            <th className="px-3 py-2">Series</th>
            <th className="px-3 py-2">Pooled (95 % interval)</th>
            <th className="px-3 py-2">Next rig</th>
            <th className="px-3 py-2">Between rigs</th>
          </tr>
        }
      >
        {[...forces, ...ranges].map((f) => (
          <tr key={`${f.series_id}:${f.figure}`} className="border-t border-stone-100 align-top">
            <th scope="row" className="px-3 py-2 font-normal">
              {f.figure === "trigger_range"
                ? `Trigger control range (full minus ${TRIGGER_LABELS.lightest_steady.toLowerCase()})`
                : f.label}
              <span className="block text-xs text-stone-600">
                {f.runs} run{f.runs === 1 ? "" : "s"} on {f.rigs} rig{f.rigs === 1 ? "" : "s"}
              </span>
            </th>
            <td className="px-3 py-2">
              {fmt(f.quantity, f.estimate)}
              <span className="block text-xs text-stone-600">
                {fmt(f.quantity, f.lower)} to {fmt(f.quantity, f.upper)}
              </span>
            </td>
            <td className="px-3 py-2">
              {f.prediction_lower == null || f.prediction_upper == null
                ? "needs 3 runs"
                : `${fmt(f.quantity, f.prediction_lower)} to ${fmt(f.quantity, f.prediction_upper)}`}
            </td>
            <td className="px-3 py-2">
              τ {fmt(f.quantity, Math.sqrt(f.tau2))}
              <span className="block text-xs text-stone-600">I² {formatShare(f.i2)}</span>
            </td>
          </tr>
        ))}
      </DataTable>

      {slope && (
        <figure className="space-y-1">
          <PressurePlot
            quantity={slope.quantity}
            points={slope.points}
            band={slope.band}
            atKpa={slope.at_kpa}
            predicted={slope.predicted}
            units={units}
          />
          <figcaption className="text-sm">
            At {formatPressure(slope.at_kpa, units.pressure)}: {fmt(slope.quantity, slope.predicted)} (
            {fmt(slope.quantity, slope.predicted_lower)} to {fmt(slope.quantity, slope.predicted_upper)}); each{" "}
            {units.pressure === "psi" ? "10 psi" : units.pressure === "bar" ? "1 bar" : "100 kPa"} more at the inlet
            adds {perStep(slope.slope, slope.slope_lower, slope.slope_upper, units, slope.quantity)}.
          </figcaption>
        </figure>
      )}

      {derived && (
        <div>
          <h3 className="font-semibold">Derived from the pooled force</h3>
          <p className="text-xs text-stone-600">
            From “{derived.pooled.series}”; the interval carried through. Each figure stands alone.
          </p>
          <dl className="mt-1 grid gap-1 text-sm sm:grid-cols-3">
            <Derived
              label={`Per kg of tool (${benchUnit(derived.quantity, units).label})`}
              v={derived.perKg}
              units={units}
              q={derived.quantity}
            />
            <Derived
              label={`Per 100 mm of length (${benchUnit(derived.quantity, units).label})`}
              v={derived.per100mm}
              units={units}
              q={derived.quantity}
            />
            {derived.perHundredDollars && (
              <Derived
                label={`Per $100 of street price (${benchUnit(derived.quantity, units).label})`}
                v={derived.perHundredDollars}
                units={units}
                q={derived.quantity}
              />
            )}
          </dl>
        </div>
      )}

      <details className="text-sm">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <div className="mt-2 space-y-2 text-stone-700">
          <p>
            Each accepted run's series gives one figure: the mean of its trial means, with the variance s²/n of those
            trial means (the trial is what is repeated, not the blow). Runs are combined by a random-effects model
            (DerSimonian–Laird); the spread between rigs is τ, and I² is the share of the spread that is between rigs
            rather than within runs. With fewer than ten runs the interval is the Hartung–Knapp–Sidik–Jonkman one (t
            with k − 1 degrees of freedom, never narrower than the usual one); the range for the next rig is a
            prediction interval and needs three runs. Intervals are 95 %. Only runs on rigs whose calibration is
            verified and current count.
          </p>
          {slope && (
            <p>
              The pressure line is a least-squares fit of {slope.n} full-trigger run means on their running inlet
              pressure, with a pointwise 95 % band ({slope.title}).
            </p>
          )}
          <p>
            Derived figures divide the pooled force and both ends of its interval by the tool's weight, length or street
            price, taken as exact. The trigger control range pools each run's full minus lightest-steady difference in
            the same way.
          </p>
        </div>
      </details>
    </section>
  );
}

function perStep(
  slope: number,
  lower: number,
  upper: number,
  units: Units,
  q: ModelAcrossRigs["forces"][number]["quantity"],
) {
  const step = units.pressure === "psi" ? 68.94757 : 100;
  const f = (v: number) => formatBench(q, v * step, units);
  return `${f(slope)} (${f(lower)} to ${f(upper)})`;
}

function Derived({
  label,
  v,
  units,
  q,
}: {
  label: string;
  v: { estimate: number; lower: number; upper: number };
  units: Units;
  q: ModelAcrossRigs["forces"][number]["quantity"];
}) {
  const p = formatDerived(v, q, units);
  return (
    <div className="rounded border border-stone-200 p-2">
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd>
        {p.estimate}{" "}
        <span className="text-xs text-stone-600">
          ({p.lower} to {p.upper})
        </span>
      </dd>
    </div>
  );
}
