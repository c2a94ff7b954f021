// One bench run: each series with its trials, the trial means and their interval, the spread of the
// blows, the blow rate against the maker's, traces where one was uploaded, and the trigger control range.
import { benchUnit, formatBench, TRIGGER_LABELS } from "~/bench/terms";
import type { RunDetail, RunFigures } from "~/bench/runs.server";
import { formatPressure, type Units } from "~/domain";
import { Card, DataTable } from "../ui";
import { BlowStrip } from "./charts";
import { TracePlot, type TraceDrawing } from "./trace-plot";

const pct = (x: number) => `${Math.round(x * 100)} %`;

export function RunSeries({
  detail,
  figures,
  traces,
  units,
}: {
  detail: RunDetail;
  figures: RunFigures;
  traces: Record<number, TraceDrawing | null>;
  units: Units;
}) {
  const { quantity, stated_bpm } = detail.run;
  const { label: unit, perSi } = benchUnit(quantity, units);
  const show = (v: number | null | undefined) => formatBench(quantity, v, units);
  return (
    <div className="space-y-4">
      {detail.series.map((s, i) => {
        const f = figures.series[i]!;
        const headingId = `series-${s.id}`;
        return (
          <Card as="section" key={s.id} aria-labelledby={headingId} className="space-y-3">
            <header>
              <h2 id={headingId} className="font-semibold">
                {s.label}
              </h2>
              <p className="text-sm text-stone-600">
                Inlet {formatPressure(s.static_inlet_kpa, units)} standing, {formatPressure(s.running_inlet_kpa, units)}{" "}
                while running
              </p>
            </header>
            {f.figures && (
              <p>
                Mean of the {f.figures.n} trial means: <strong>{show(f.figures.mean)}</strong>
                {f.figures.n >= 2 && (
                  <>
                    {" "}
                    ({Math.round(figures.confidence * 100)} % t interval {show(f.figures.lower)} to{" "}
                    {show(f.figures.upper)})
                  </>
                )}
                . Blows: median {show(f.figures.blows.median)}, 10th–90th percentile {show(f.figures.blows.p10)} to{" "}
                {show(f.figures.blows.p90)} over {f.figures.blows.n} blows.
              </p>
            )}
            <DataTable
              label={`Trials of ${s.label}`}
              framed={false}
              head={
                <tr className="text-xs text-stone-600">
                  <th className="py-1 pr-3">Trial</th>
                  <th className="py-1 pr-3">Blows</th>
                  <th className="py-1 pr-3">Mean peak</th>
                  <th className="py-1">Blows/min</th>
                </tr>
              }
            >
              {s.trials.map((t) => (
                <tr key={t.id} className="border-t border-stone-100">
                  <td className="py-1 pr-3">{t.trial_number}</td>
                  <td className="py-1 pr-3">{t.peaks.length}</td>
                  <td className="py-1 pr-3">{show(t.peaks.reduce((a, b) => a + b, 0) / t.peaks.length)}</td>
                  <td className="py-1">{t.blows_per_minute == null ? "—" : Math.round(t.blows_per_minute)}</td>
                </tr>
              ))}
            </DataTable>
            <BlowStrip
              title={`Peak of every blow in ${s.label}, one row per trial, with each trial's mean as a bar`}
              trials={s.trials.map((t) => ({ trial: t.trial_number, peaks: t.peaks }))}
              unit={unit}
              perSi={perSi}
            />
            {f.measuredBpm != null && (
              <p className="text-sm">
                Measured blow rate {Math.round(f.measuredBpm).toLocaleString("en-US")} per minute
                {stated_bpm != null && f.rateAgreement?.ratio != null ? (
                  <>
                    {" "}
                    against the maker's {stated_bpm.toLocaleString("en-US")} ({pct(f.rateAgreement.ratio)} of it
                    {s.trigger === "full"
                      ? f.rateAgreement.withinTolerance
                        ? ", within the expected range"
                        : ", outside the expected range"
                      : "; a feathered trigger runs slower"}
                    )
                  </>
                ) : null}
                .
              </p>
            )}
            {s.trials.map((t) => {
              const drawing = traces[t.id];
              if (!t.trace_key) return null;
              return drawing ? (
                <TracePlot
                  key={t.id}
                  drawing={drawing}
                  unit={unit}
                  perSi={perSi}
                  title={`Trace of trial ${t.trial_number}`}
                />
              ) : (
                <p key={t.id} className="text-sm text-stone-600">
                  The trace of trial {t.trial_number} could not be read from storage just now.
                </p>
              );
            })}
          </Card>
        );
      })}
      {figures.controlRange && (
        <Card as="section" aria-labelledby="control-range-heading">
          <h2 id="control-range-heading" className="font-semibold">
            Trigger control range
          </h2>
          <p>
            {TRIGGER_LABELS.full} less {TRIGGER_LABELS.lightest_steady.toLowerCase()}:{" "}
            <strong>{show(figures.controlRange.estimate)}</strong> ({Math.round(figures.confidence * 100)} % interval{" "}
            {show(figures.controlRange.lower)} to {show(figures.controlRange.upper)}, a t interval on the trial means,{" "}
            {figures.controlRange.df.toFixed(1)} degrees of freedom). A wider range means the trigger can feather the
            tool further down from its full blow.
          </p>
        </Card>
      )}
    </div>
  );
}
