import { Link } from "react-router";
import { formatDuration } from "~/domain";
import type { StatsCell } from "~/stats/cells";
import { FEW_REPORTS } from "~/stats/marks";
import { IntervalBar, pct, plainLine } from "./intervals";

export type CellRow = Pick<
  StatsCell,
  | "n"
  | "successes"
  | "estimate"
  | "lower"
  | "upper"
  | "shrunk_estimate"
  | "reporters"
  | "design_effect"
  | "effective_n"
  | "set_aside"
  | "time_n"
  | "time_median_s"
  | "time_lower_s"
  | "time_upper_s"
  | "time_coverage"
  | "km_n"
  | "km_median_s"
  | "km_lower_s"
  | "km_upper_s"
  | "adj_estimate"
  | "adj_lower"
  | "adj_upper"
  | "adj_reason"
  | "measured_share"
  | "confidence"
> & {
  key: string;
  href: string;
  label: string;
  sub?: string;
  /** The mark against the top tool, in words. */
  tag?: string;
  /** What the row was ordered by, said in the fold. */
  orderedBy?: string;
  /** The difference from the top tool, said in the fold. */
  vsTop?: { estimate: number; lower: number; upper: number } | null;
  /** The job's pooled fit, said in the fold of the pressure figure. */
  fitNote?: string;
};

const level = (c: number) => `${Math.round(c * 100)} %`;
const reporters = (k: number) => `from ${k} reporter${k === 1 ? "" : "s"}`;

/**
 * Stored cells as cards (phone first): the plain headline — rate, time to free it, figure at 90 psi —
 * and a "How this is worked out" fold with n, method and confidence level for every figure.
 */
export function CellTable({ rows, firstColumn }: { rows: CellRow[]; firstColumn: string }) {
  return (
    <ul className="space-y-3" aria-label={`${firstColumn}s with their figures`}>
      {rows.map((r) => (
        <li
          key={r.key}
          data-testid="cell-row"
          data-slug={r.key}
          data-mark={r.tag ?? ""}
          className="rounded-lg border border-stone-200 bg-white p-3"
        >
          <div className="flex flex-wrap items-baseline justify-between gap-x-3">
            <Link to={r.href} className="font-semibold text-bay-700 hover:underline">
              {r.label}
            </Link>
            {r.tag && <span className="text-xs font-semibold text-bay-700">{r.tag}</span>}
          </div>
          {r.sub && <div className="text-xs text-stone-500">{r.sub}</div>}
          <dl className="mt-2 grid grid-cols-1 gap-2 text-sm sm:grid-cols-3">
            <div>
              <dt className="text-xs uppercase text-stone-500">Freed</dt>
              <dd className="flex flex-wrap items-center gap-2">
                <IntervalBar estimate={r.estimate} lower={r.lower} upper={r.upper} muted={r.n < FEW_REPORTS} />
                <span>
                  {pct(r.estimate)}{" "}
                  <span className="text-stone-500">
                    ({pct(r.lower)}–{pct(r.upper)})
                  </span>
                </span>
              </dd>
              <dd className="text-xs text-stone-600">
                {r.n < FEW_REPORTS ? `${r.n} reports — too few to compare; ` : `${r.n} reports, `}
                {reporters(r.reporters)}
              </dd>
            </div>
            <div>
              <dt className="text-xs uppercase text-stone-500">Time to free it, counting give-ups</dt>
              <dd>
                {r.km_median_s != null ? formatDuration(r.km_median_s) : r.km_n > 0 ? "not reached: most gave up" : "—"}
                {r.km_median_s != null && (
                  <span className="text-stone-500">
                    {" "}
                    ({formatDuration(r.km_lower_s)}–
                    {r.km_upper_s == null ? "not reached" : formatDuration(r.km_upper_s)})
                  </span>
                )}
              </dd>
            </div>
            <div>
              <dt className="text-xs uppercase text-stone-500">At 90 psi inlet</dt>
              <dd>
                {r.adj_estimate != null ? (
                  <>
                    {pct(r.adj_estimate)}{" "}
                    <span className="text-stone-500">
                      ({pct(r.adj_lower!)}–{pct(r.adj_upper!)})
                    </span>
                  </>
                ) : (
                  <span className="text-xs text-stone-500">{r.adj_reason}</span>
                )}
              </dd>
            </div>
          </dl>
          <details className="mt-2 text-xs text-stone-700">
            <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              <li>{rateNote(r)}</li>
              <li>{timeNote(r)}</li>
              <li>{pressureNote(r)}</li>
              {r.orderedBy && <li>{`Ordered by ${r.orderedBy}.`}</li>}
              {r.vsTop && (
                <li>
                  {`Difference from the top tool: ${pct(r.vsTop.estimate)} (${pct(r.vsTop.lower)} to ${pct(r.vsTop.upper)}), Newcombe's hybrid score interval at each tool's effective sample size; told apart only when it leaves out zero.`}
                </li>
              )}
            </ul>
          </details>
        </li>
      ))}
    </ul>
  );
}

const s = (k: number, one: string, many: string) => (k === 1 ? one : many);

function rateNote(r: CellRow) {
  return (
    `${plainLine(r.successes, r.n, r.lower, r.upper)} ${level(r.confidence)} Wilson score interval at the effective sample size ${(r.effective_n ?? r.n).toFixed(1)} = n / design effect ${r.design_effect.toFixed(2)} (reports clustered by reporter, ${reporters(r.reporters)}).` +
    (r.set_aside > 0
      ? ` ${r.set_aside} ${s(r.set_aside, "report", "reports")} run above the tool's rated inlet pressure ${s(r.set_aside, "is", "are")} listed but set aside from every figure.`
      : "") +
    (r.shrunk_estimate != null
      ? ` Pooled with the other tools on this job: ${pct(r.shrunk_estimate)} — the rate pulled toward what all tools do on this job, more so the fewer reports a tool has, so a lucky or unlucky handful of jobs does not read as the whole story (empirical-Bayes beta-binomial).`
      : "")
  );
}

function timeNote(r: CellRow) {
  const km = `Time to free it: Kaplan–Meier median over ${r.km_n} reports, counting the jobs not freed (or freed with help) as given up at the time reported; ${level(r.confidence)} Brookmeyer–Crowley interval (log-log)${r.km_median_s == null ? "; the curve does not reach one half, so no median" : ""}.`;
  if (r.time_median_s == null) return km;
  return r.time_lower_s != null
    ? `${km} Jobs freed: median ${formatDuration(r.time_median_s)} of ${r.time_n} times, order-statistic interval ${formatDuration(r.time_lower_s)}–${formatDuration(r.time_upper_s)} (exact coverage ${((r.time_coverage ?? 0) * 100).toFixed(1)} %).`
    : `${km} Jobs freed: median ${formatDuration(r.time_median_s)} of ${r.time_n} ${s(r.time_n, "time", "times")}; too few for a ${level(r.confidence)} interval.`;
}

function pressureNote(r: CellRow) {
  return `At 90 psi: ${r.fitNote ?? "one logistic fit per job type over its reports with a known inlet pressure (an intercept per tool, a common pressure slope, Firth-penalised)"}; ${level(r.confidence)} Wald interval on the logit scale, shown only where 90 psi lies between the 10th and 90th percentile of the tool's own known inlet pressures. ${pct(r.measured_share)} of its reports measured the pressure at the inlet.`;
}
