// The one rule that orders a job's tools and says which can be told apart from the first. The job
// page, the compare page and the feed all call it, so they can never disagree. Pure.
import { type Interval, probabilityGreater } from "./proportions";
import { distinguishable } from "./clustered";
import { FEW_REPORTS, type Mark } from "./marks";

export { FEW_REPORTS, MARK_LABELS, type Mark } from "./marks";

export interface StandingInput {
  model_slug: string;
  n: number;
  successes: number;
  lower: number;
  design_effect: number;
  adj_lower: number | null;
}

/** What a list is ordered by: the pressure-adjusted figure's lower bound, or the rate's. */
export type OrderBasis = "pressure_adjusted" | "rate";

export interface Standing<T> {
  cell: T;
  /** The figure this row was ordered by. */
  orderedBy: OrderBasis;
  mark: Mark;
  /** Difference top − this tool (Newcombe hybrid, design effects applied), where the mark compares them. */
  vsTop: (Interval & { distinguishable: boolean }) | null;
}

export interface TellApart {
  distinguishable: boolean;
  /** a − b, Newcombe's hybrid score interval with each side at its effective n. */
  difference: Interval;
  /** P(a's rate > b's) from Beta posteriors with uniform priors. */
  chanceAFreesMore: number;
}

/** Whether two tools on one job can be told apart: the difference interval excludes 0 (issue 16, item 5). */
export function tellApart(a: StandingInput, b: StandingInput, confidence = 0.95): TellApart {
  const d = distinguishable(a.successes, a.n, b.successes, b.n, confidence, {
    designEffect1: a.design_effect,
    designEffect2: b.design_effect,
  });
  return { ...d, chanceAFreesMore: probabilityGreater(a.successes, a.n, b.successes, b.n) };
}

const byLower = (key: (c: StandingInput) => number) => (a: StandingInput, b: StandingInput) =>
  key(b) - key(a) || b.n - a.n || a.model_slug.localeCompare(b.model_slug);

/**
 * Orders a job's cells: where the job has a pressure fit, by the lower bound of each tool's
 * pressure-adjusted figure at 90 psi (tools without one follow, by their rate's lower bound);
 * otherwise by the lower bound of the clustered rate. Tools with fewer than FEW_REPORTS reports are
 * marked "too few"; the first tool with enough is the top tool, and every other is marked by
 * whether the difference of rates with it excludes 0.
 */
export function orderCells<T extends StandingInput>(
  cells: readonly T[],
  jobHasFit: boolean,
): { basis: OrderBasis; rows: Standing<T>[] } {
  const basis: OrderBasis = jobHasFit && cells.some((c) => c.adj_lower != null) ? "pressure_adjusted" : "rate";
  const adjusted =
    basis === "pressure_adjusted" ? cells.filter((c) => c.adj_lower != null).sort(byLower((c) => c.adj_lower!)) : [];
  const rest = cells.filter((c) => !adjusted.includes(c)).sort(byLower((c) => c.lower));
  const ordered = [...adjusted, ...rest];
  const top = ordered.find((c) => c.n >= FEW_REPORTS);
  return {
    basis,
    rows: ordered.map((cell) => {
      const orderedBy: OrderBasis = adjusted.includes(cell) ? "pressure_adjusted" : "rate";
      if (cell.n < FEW_REPORTS) return { cell, orderedBy, mark: "too_few", vsTop: null };
      if (cell === top || !top) return { cell, orderedBy, mark: "top", vsTop: null };
      const t = tellApart(top, cell);
      const mark: Mark = !t.distinguishable ? "not_told_apart" : t.difference.estimate > 0 ? "behind" : "ahead";
      return { cell, orderedBy, mark, vsTop: { ...t.difference, distinguishable: t.distinguishable } };
    }),
  };
}
