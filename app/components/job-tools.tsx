// The job page's "Tools used on this job": the one order (stats/standings.ts), the mark against the
// top tool, the interval chart and the cards with their "How this is worked out" folds.
import { Link } from "react-router";
import { FITTING_LABELS, formatPrice, formatWeight, toolName, type Units } from "~/domain";
import { FEW_REPORTS, MARK_LABELS } from "~/stats/marks";
import type { OrderBasis, Standing } from "~/stats/standings";
import type { JobCell } from "~/stats/cells.server";
import { CellTable } from "./cell-table";
import { IntervalChart, IntervalsExplained } from "./intervals";

export interface JobFitSummary {
  fit_n: number;
  fit_models: number;
  slope: number | null;
  slope_se: number | null;
  fit_reason: string | null;
}

export const ORDER_BASIS_LABELS: Record<OrderBasis, string> = {
  pressure_adjusted: "the lower end of its 95 % interval at 90 psi inlet (the job's pressure fit)",
  rate: "the lower end of its 95 % success-rate interval",
};

export function orderSentence(basis: OrderBasis) {
  return basis === "pressure_adjusted"
    ? "Ordered by the lower end of each tool's 95 % interval at 90 psi inlet, from the job's pressure fit — the chance each tool has shown at the least, not its point. Tools without a figure at 90 psi follow, by the lower end of their success rate's interval."
    : "Ordered by the lower end of each tool's 95 % success-rate interval — the rate each tool has shown at the least, not its point. This job has no pressure fit to order by.";
}

export function fitNote(fit: JobFitSummary | null) {
  if (!fit || fit.slope == null) return fit?.fit_reason ?? "this job has no pressure fit";
  return `one logistic fit over this job's ${fit.fit_n} reports with a known inlet pressure (measured at the inlet, or read at the regulator less the line loss predicted for the reported hose and couplers) of ${fit.fit_models} tools (an intercept per tool, a common slope of ${fit.slope.toFixed(2)} ± ${fit.slope_se!.toFixed(2)} on the logit per bar, Firth-penalised)`;
}

export function JobTools({
  job,
  basis,
  rows,
  fit,
  setAside,
  units,
}: {
  job: { slug: string; name: string };
  units: Units;
  basis: OrderBasis;
  rows: Standing<JobCell>[];
  fit: JobFitSummary | null;
  setAside: number;
}) {
  return (
    <section aria-labelledby="tools-heading" className="space-y-3">
      <h2 id="tools-heading" className="text-lg font-semibold">
        Tools used on this job
      </h2>
      <IntervalsExplained />
      {setAside > 0 && (
        <p className="text-sm text-stone-700" data-testid="set-aside">
          {`${setAside} accepted ${setAside === 1 ? "report" : "reports"} ran the tool above its rated inlet pressure: listed with the reports below, but set aside from every figure here — running over the rating is a hazard, and those results do not compare with the others.`}
        </p>
      )}
      {rows.length === 0 ? (
        <p className="text-stone-600">No accepted reports yet.</p>
      ) : (
        <>
          <p className="text-sm text-stone-600" data-testid="order-basis" data-basis={basis}>
            {orderSentence(basis)} Beside each tool: whether it can be told apart from the top tool; tools with fewer
            than {FEW_REPORTS} reports are greyed.
          </p>
          <div className="rounded-lg border border-stone-200 bg-white p-3">
            <IntervalChart
              title={`Share of ${job.name.toLowerCase()} jobs freed, per tool, with 95 % intervals`}
              rows={rows.map(({ cell: m, mark }) => ({
                key: m.model_slug,
                label: toolName(m.maker_name, m.model_code),
                estimate: m.estimate,
                lower: m.lower,
                upper: m.upper,
                n: m.n,
                tag: mark === "top" ? undefined : MARK_LABELS[mark],
                muted: m.n < FEW_REPORTS,
                highlight: mark === "top" || mark === "not_told_apart",
              }))}
            />
          </div>
          {rows.length >= 2 && (
            <p>
              <Link
                to={`/compare?job=${job.slug}&models=${rows
                  .slice(0, 3)
                  .map((r) => r.cell.model_slug)
                  .join(",")}`}
                className="text-bay-700 underline"
              >
                Compare the first three side by side →
              </Link>
            </p>
          )}
          <CellTable
            firstColumn="Tool"
            rows={rows.map(({ cell: m, mark, orderedBy, vsTop }) => ({
              ...m,
              key: m.model_slug,
              href: `/models/${m.model_slug}`,
              label: toolName(m.maker_name, m.model_code),
              sub: `${FITTING_LABELS[m.fitting]} · ${formatWeight(m.weight_kg, units)} · ${formatPrice(m.street_price_cents)}`,
              tag: MARK_LABELS[mark],
              orderedBy: ORDER_BASIS_LABELS[orderedBy],
              vsTop,
              fitNote: fitNote(fit),
            }))}
          />
        </>
      )}
    </section>
  );
}
