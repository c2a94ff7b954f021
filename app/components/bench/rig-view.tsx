// One rig: what it is, its calibration (the fit, its residuals, who verified it) and its check
// standard's individuals chart with the sessions that fell outside the limits.
import { benchUnit, formatCapacity, RIG_KIND_LABELS, type BenchQuantity } from "~/bench/terms";
import type { RigDetail } from "~/bench/rigs.server";
import { formatDate, formatDateTime, type Units } from "~/domain";
import { Card, DataTable } from "../ui";
import { CalibrationPlot, IndividualsChart } from "./charts";
import { RigStatusBadge } from "./rig-status";

export function RigView({ detail, units }: { detail: RigDetail; units: Units }) {
  const { rig, standing, fit, chart, checkReadings } = detail;
  const latest = detail.calibrations[0];
  const quantity: BenchQuantity = rig.kind === "percussive_force" ? "peak_force_n" : "peak_torque_nm";
  const { label: unit, perSi } = benchUnit(quantity, units);
  const outside = chart ? checkReadings.filter((_, i) => chart.points[i]?.outOfControl) : [];
  const num = (x: number, digits = 3) => (x * 1).toPrecision(digits);
  return (
    <div className="space-y-6">
      <Card as="section" aria-labelledby="rig-about">
        <h2 id="rig-about" className="mb-2 font-semibold">
          The rig
        </h2>
        <p className="mb-2">
          <RigStatusBadge status={standing.status} />
        </p>
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
          <Row label="Kind" value={RIG_KIND_LABELS[rig.kind]} />
          <Row label="Sensor capacity" value={formatCapacity(rig.kind, rig.sensor_capacity, units)} />
          <Row label="Sample rate" value={`${rig.sample_rate_hz.toLocaleString("en-US")} Hz`} />
          <Row label="Owner" value={`${rig.owner_handle}${rig.shop_name ? `, ${rig.shop_name}` : ""}`} />
          <Row label="Anvil or fixture" value={rig.fixture} />
          <Row label="Check standard" value={rig.checkTool ?? "None named"} />
          <Row label="A calibration counts for" value={`${rig.check_interval_months} months`} />
        </dl>
      </Card>

      <section aria-labelledby="rig-calibration" className="space-y-3">
        <h2 id="rig-calibration" className="text-lg font-semibold">
          Calibration
        </h2>
        {!latest || !fit ? (
          <p className="text-stone-600">No calibration on record.</p>
        ) : (
          <>
            <p className="text-sm">
              Calibrated {formatDate(latest.calibrated_on)}; fitted by least squares as a{" "}
              {fit.degree === 1 ? "straight line" : "quadratic"} over {fit.n} reference loads. Residual standard
              deviation {formatCapacity(rig.kind, fit.residualSD, units)}, R² {fit.rSquared.toFixed(5)}.{" "}
              {latest.verified_at
                ? `Verified by ${latest.verified_by_handle ?? "a moderator"} on ${formatDateTime(latest.verified_at)}.`
                : "Not yet verified by a moderator."}
              {standing.expiresOn ? ` Counts until ${formatDate(standing.expiresOn)}.` : ""}
            </p>
            <p className="text-xs text-stone-600">
              Reading ={" "}
              {fit.coefficients
                .map((c, k) => `${num(c, 6)}${k === 0 ? "" : k === 1 ? " × load" : " × load²"}`)
                .join(" + ")}{" "}
              (loads in SI; standard errors {fit.standardErrors.map((s) => num(s, 2)).join(", ")}).
            </p>
            <CalibrationPlot
              residuals={fit.residuals}
              coefficients={fit.coefficients}
              residualSD={fit.residualSD}
              unit={unit}
              perSi={perSi}
            />
            <DataTable
              label="Calibration points"
              head={
                <tr>
                  <th className="px-3 py-2">Reference</th>
                  <th className="px-3 py-2">Reading</th>
                  <th className="px-3 py-2">Residual</th>
                </tr>
              }
            >
              {fit.residuals.map((p) => (
                <tr key={p.reference}>
                  <td className="px-3 py-1">{formatCapacity(rig.kind, p.reference, units)}</td>
                  <td className="px-3 py-1">{formatCapacity(rig.kind, p.reading, units)}</td>
                  <td className="px-3 py-1">{`${(p.residual * perSi).toFixed(1)} ${unit}`}</td>
                </tr>
              ))}
            </DataTable>
          </>
        )}
      </section>

      <section aria-labelledby="rig-check" className="space-y-3">
        <h2 id="rig-check" className="text-lg font-semibold">
          Check standard
        </h2>
        {!chart ? (
          <p className="text-stone-600">Too few check-standard sessions to draw a chart.</p>
        ) : (
          <>
            <p className="text-sm">
              {checkReadings.length} sessions. Centre line {formatCapacity(rig.kind, chart.centre, units)}, limits{" "}
              {formatCapacity(rig.kind, chart.lower, units)} to {formatCapacity(rig.kind, chart.upper, units)} (the
              centre ± 2.66 × the mean moving range of {formatCapacity(rig.kind, chart.meanMovingRange, units)}).
            </p>
            <IndividualsChart
              points={chart.points}
              centre={chart.centre}
              lower={chart.lower}
              upper={chart.upper}
              labels={checkReadings.map((r) => formatDate(r.session_on))}
              unit={unit}
              perSi={perSi}
            />
            {outside.length === 0 ? (
              <p className="text-sm">Every session lies inside the limits.</p>
            ) : (
              <div className="text-sm">
                <p className="font-semibold">Sessions outside the limits (their runs are held for review):</p>
                <ul className="list-disc pl-5">
                  {outside.map((r) => (
                    <li key={r.id}>
                      {formatDate(r.session_on)}: {formatCapacity(rig.kind, r.value, units)}
                    </li>
                  ))}
                </ul>
              </div>
            )}
          </>
        )}
      </section>
    </div>
  );
}

function Row({ label, value }: { label: string; value: string }) {
  return (
    <div className="border-b border-stone-100 py-1">
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd>{value}</dd>
    </div>
  );
}
