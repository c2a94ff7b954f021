// "Which tool for my job and my air?": for each tool with a pressure fit, the pressure it would get
// through the shopper's line while it runs (its running air use, second-edition line model), and
// the fitted success there. Pure; the job page's shortlist (app/exposure/shortlist.ts) calls it per tool.
import { operatingPoint, type RunningAirSource } from "~/air/line";
import { type ShopLine, shopLineSegments } from "~/air/shop-line";
import { RATED_INLET_KPA } from "~/domain";
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
