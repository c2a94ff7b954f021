// One (tool model, job type) cell's figures from its accepted reports. Pure; the refresh job
// (refresh.server.ts) feeds it and stores the result. The pressure-adjusted figure comes from the
// job's pooled fit (pressure.ts), not from the cell alone.
import { clusteredWilson } from "./clustered";
import { medianInterval } from "./median";
import { REFERENCE_INLET_KPA } from "./pressure";
import { kaplanMeier } from "./survival";

/** A stored cell as the pages read it (the `stats_cells` row). */
export type { StatsCell } from "../../db/schema";

export { predictAt, pressureX, REFERENCE_INLET_KPA, type PooledCellFit } from "./pressure";
export { FEW_REPORTS } from "./standings";

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

/** The cell's figures, or null where every report was set aside. */
export function cellFigures(all: readonly CellReport[], confidence = 0.95): CellFigures | null {
  const reports = all.filter((r) => !r.aboveRated);
  const setAside = all.length - reports.length;
  const n = reports.length;
  if (n === 0) return null;
  const clusters = new Map<number, { successes: number; trials: number }>();
  let successes = 0;
  for (const r of reports) {
    const c = clusters.get(r.reporterId) ?? { successes: 0, trials: 0 };
    c.trials++;
    if (r.outcome === "freed") {
      c.successes++;
      successes++;
    }
    clusters.set(r.reporterId, c);
  }
  const w = clusteredWilson([...clusters.values()], confidence);
  const freedTimes = reports.filter((r) => r.outcome === "freed").map((r) => r.timeS);
  let time: CellFigures["time"] = null;
  if (freedTimes.length > 0) {
    const m = medianInterval(freedTimes, confidence);
    const sorted = [...freedTimes].sort((a, b) => a - b);
    const mid = sorted.length >> 1;
    const median = m?.estimate ?? (sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2);
    time = {
      n: freedTimes.length,
      median,
      lower: m?.lower ?? null,
      upper: m?.upper ?? null,
      coverage: m?.coverage ?? null,
    };
  }
  const k = kaplanMeier(
    reports.map((r) => r.timeS),
    reports.map((r) => r.outcome === "freed"),
    confidence,
  );
  const km = {
    n,
    median: k.median,
    lower: k.lower,
    upper: k.upper,
    steps: k.steps.map((s) => ({ time: s.time, survival: s.survival })),
  };
  return {
    n,
    successes,
    setAside,
    estimate: w.estimate,
    lower: w.lower,
    upper: w.upper,
    reporters: w.clusters,
    designEffect: w.designEffect,
    effectiveN: w.effectiveN,
    time,
    km,
    measuredShare: reports.filter((r) => r.inletSource === "measured_at_inlet").length / n,
    estimatedShare: reports.filter((r) => r.inletSource === "estimated").length / n,
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
