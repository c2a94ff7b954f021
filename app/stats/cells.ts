// One (tool model, job type) cell's figures from its accepted reports. Pure; the refresh job
// (refresh.server.ts) feeds it and stores the result. The pressure-adjusted figure comes from the
// job's pooled fit (pressure.ts), not from the cell alone.
import { clusteredWilson } from "./clustered";
import { medianIntervalOfTally, medianOfTally } from "./median";
import { REFERENCE_INLET_KPA } from "./predict";
import type { Group } from "./proportions";
import { kaplanMeierOfTally, type SurvivalTally, tallySurvival } from "./survival";

/** A stored cell as the pages read it (the `stats_cells` row). */
export type { StatsCell } from "../../db/schema";

export { predictAt, REFERENCE_INLET_KPA } from "./predict";

export interface CellReport {
  outcome: "freed" | "freed_with_help" | "not_freed";
  timeS: number;
  inletKpa: number;
  inletSource: "measured_at_inlet" | "read_at_regulator" | "estimated";
  reporterId: number;
  /** Accepted with the "above rated inlet pressure" flag: counted and listed, kept out of the figures. */
  aboveRated: boolean;
}

export interface CellFigures {
  /** Reports in the figures (set-aside reports are not among them). */
  n: number;
  successes: number;
  setAside: number;
  /** Clustered Wilson: the rate's interval at n / deff, clusters = reporters. */
  estimate: number;
  lower: number;
  upper: number;
  reporters: number;
  designEffect: number;
  effectiveN: number;
  /** Median time of the jobs freed, with the order-statistic interval (null bounds for ≤ 5 times). */
  time: { n: number; median: number; lower: number | null; upper: number | null; coverage: number | null } | null;
  /** Kaplan–Meier median time to free it, counting give-ups (censored). */
  km: {
    n: number;
    median: number | null;
    lower: number | null;
    upper: number | null;
    steps: { time: number; survival: number }[];
  } | null;
  measuredShare: number;
  estimatedShare: number;
}

/**
 * What a cell's figures need from its reports, without the reports: counts, one cluster per
 * reporter, and the times as a tally. The full refresh reads this straight from SQL (one row per
 * cell), so its JavaScript work grows with cells and distinct times, not with reports.
 */
export interface CellTally {
  /** Reports set aside (above the tool's rated inlet): counted, not in the figures. */
  setAside: number;
  /** Counted reports by inlet source. */
  measured: number;
  estimated: number;
  /** One per reporter with counted reports, in reporter order: reports, and how many freed the part. */
  clusters: Group[];
  /** Counted reports by distinct time, ascending: freed (events) and not freed or freed with help (censored). */
  times: SurvivalTally;
}

/** The tally of a list of reports (what the refresh reads from SQL). */
export function tallyReports(all: readonly CellReport[]): CellTally {
  const reports = all.filter((r) => !r.aboveRated);
  const byReporter = new Map<number, Group>();
  for (const r of reports) {
    const c = byReporter.get(r.reporterId) ?? { successes: 0, trials: 0 };
    c.trials++;
    if (r.outcome === "freed") c.successes++;
    byReporter.set(r.reporterId, c);
  }
  return {
    setAside: all.length - reports.length,
    measured: reports.filter((r) => r.inletSource === "measured_at_inlet").length,
    estimated: reports.filter((r) => r.inletSource === "estimated").length,
    clusters: [...byReporter.entries()].sort((a, b) => a[0] - b[0]).map(([, c]) => c),
    times: tallySurvival(
      reports,
      (r) => r.timeS,
      (r) => r.outcome === "freed",
    ),
  };
}

/** The cell's figures, or null where every report was set aside. */
export function cellFigures(all: readonly CellReport[], confidence = 0.95): CellFigures | null {
  return cellFiguresOfTally(tallyReports(all), confidence);
}

/** cellFigures from a cell's tally. */
export function cellFiguresOfTally(t: CellTally, confidence = 0.95): CellFigures | null {
  let n = 0;
  let successes = 0;
  for (const c of t.clusters) {
    n += c.trials;
    successes += c.successes;
  }
  if (n === 0) return null;
  const w = clusteredWilson(t.clusters, confidence);
  // The freed jobs' times, as a tally: the order-statistic median needs no list of them.
  const freed = { values: [] as number[], counts: [] as number[] };
  t.times.events.forEach((d, j) => {
    if (d > 0) {
      freed.values.push(t.times.times[j]!);
      freed.counts.push(d);
    }
  });
  let time: CellFigures["time"] = null;
  if (successes > 0) {
    const m = medianIntervalOfTally(freed, confidence);
    time = {
      n: successes,
      median: m?.estimate ?? medianOfTally(freed)!,
      lower: m?.lower ?? null,
      upper: m?.upper ?? null,
      coverage: m?.coverage ?? null,
    };
  }
  const k = kaplanMeierOfTally(t.times, confidence);
  const km = {
    n,
    median: k.median,
    lower: k.lower,
    upper: k.upper,
    // Only /compare draws the curve: the steps are copied out when read, not for every cell refreshed.
    get steps() {
      return k.steps.map((s) => ({ time: s.time, survival: s.survival }));
    },
  };
  return {
    n,
    successes,
    setAside: t.setAside,
    estimate: w.estimate,
    lower: w.lower,
    upper: w.upper,
    reporters: w.clusters,
    designEffect: w.designEffect,
    effectiveN: w.effectiveN,
    time,
    km,
    measuredShare: t.measured / n,
    estimatedShare: t.estimated / n,
  };
}

/** A stored cell's pressure-adjusted success at the reference inlet, or null where there is none. */
export function adjustedAtReference(cell: {
  adj_estimate: number | null;
  adj_lower: number | null;
  adj_upper: number | null;
}) {
  if (cell.adj_estimate == null || cell.adj_lower == null || cell.adj_upper == null) return null;
  return { inlet_kpa: REFERENCE_INLET_KPA, estimate: cell.adj_estimate, lower: cell.adj_lower, upper: cell.adj_upper };
}
