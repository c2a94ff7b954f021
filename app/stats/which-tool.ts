// "Which tool for my job and my air?": for each tool with a pressure fit, the pressure it would get
// through the shopper's line while it runs (its running air use, second-edition line model), and
// the fitted success there. Pure.
import { operatingPoint, type RunningAirSource } from "~/air/line";
import { type ShopLine, shopLineSegments } from "~/air/shop-line";
import { RATED_INLET_KPA, toolName } from "~/domain";
import { type PooledCellFit, predictAt } from "./pressure";

export interface ToolAtSupply {
  slug: string;
  fitting: string;
  ratedLps: number;
  runningLps?: number | null;
  runningSource?: RunningAirSource | null;
  runningFactor?: number | null;
  fit: PooledCellFit | null;
}

export interface Supply {
  regulatorKpa: number;
  line: ShopLine;
  /** The hammer bits the shopper already owns, if any. */
  bits: "shank-0.401" | "shank-0.498" | null;
}

export function atSupply(tool: ToolAtSupply, supply: Supply) {
  const point = operatingPoint(supply.regulatorKpa, shopLineSegments(supply.regulatorKpa, supply.line), tool);
  const needs: string[] = [];
  if (supply.bits && tool.fitting.startsWith("shank-") && tool.fitting !== supply.bits) {
    needs.push(
      `${tool.fitting === "shank-0.498" ? "0.498" : "0.401"} in shank bits (yours will not fit; never use a shank adapter)`,
    );
  }
  if (point.inletKpa < RATED_INLET_KPA - 1)
    needs.push("a bigger air supply or hose: it would run below its 90 psi rating");
  return {
    inletKpa: point.inletKpa,
    demandLps: point.demandLps,
    running: point.running,
    predicted: tool.fit ? predictAt(tool.fit, point.inletKpa) : null,
    needs,
  };
}

export interface RankableCell {
  model_slug: string;
  maker_name: string;
  model_code: string;
  fitting: string;
  rated_air_lps: number;
  running_air_lps: number | null;
  running_air_source: string | null;
  running_air_factor: number | null;
  street_price_cents: number | null;
  weight_kg: number;
  adj_reason: string | null;
  fit: PooledCellFit | null;
}

/**
 * "Which tool, on your air?": every tool on the job at the pressure its running air use leaves it
 * through the shopper's line, ordered by the lower bound of its fitted chance there (tools without a fit
 * last, each saying why).
 */
export function rankAtSupply(cells: readonly RankableCell[], supply: Supply) {
  return cells
    .map((m) => {
      const r = atSupply(
        {
          slug: m.model_slug,
          fitting: m.fitting,
          ratedLps: m.rated_air_lps,
          runningLps: m.running_air_lps,
          runningSource: runningSourceOf(m.running_air_source),
          runningFactor: m.running_air_factor,
          fit: m.fit,
        },
        supply,
      );
      return {
        slug: m.model_slug,
        label: toolName(m.maker_name, m.model_code),
        price: m.street_price_cents,
        weightKg: m.weight_kg,
        inletKpa: r.inletKpa,
        running: r.running,
        predicted: r.predicted,
        reason: m.adj_reason,
        needs: r.needs,
      };
    })
    .sort((a, b) => (b.predicted?.lower ?? -1) - (a.predicted?.lower ?? -1) || a.slug.localeCompare(b.slug));
}
const RUNNING_SOURCES: readonly string[] = ["maker_sheet", "measured", "estimated"] satisfies RunningAirSource[];
const runningSourceOf = (s: string | null) =>
  s != null && RUNNING_SOURCES.includes(s) ? (s as RunningAirSource) : null;

export type SupplyRow = ReturnType<typeof rankAtSupply>[number];
