// "Which tool for my job and my air?": for each tool with a pressure fit, the pressure its rated
// air use would get through the shopper's line, and the fitted success there. Pure.
import { operatingInletPressure, type Line } from "~/air/supply";
import { RATED_INLET_KPA } from "~/air/units";
import { type PooledCellFit, predictAt } from "./pressure";

export interface ToolAtSupply {
  slug: string;
  fitting: string;
  ratedLps: number;
  fit: PooledCellFit | null;
}

export interface Supply {
  regulatorKpa: number;
  line: Line;
  /** The hammer bits the shopper already owns, if any. */
  bits: "shank-0.401" | "shank-0.498" | null;
}

export function atSupply(tool: ToolAtSupply, supply: Supply) {
  const point = operatingInletPressure(supply.regulatorKpa, tool.ratedLps, supply.line);
  const needs: string[] = [];
  if (supply.bits && tool.fitting.startsWith("shank-") && tool.fitting !== supply.bits) {
    needs.push(`${tool.fitting === "shank-0.498" ? "0.498" : "0.401"} in shank bits (yours will not fit; never use a shank adapter)`);
  }
  if (point.inletKpa < RATED_INLET_KPA - 1) needs.push("a bigger air supply or hose: it would run below its 90 psi rating");
  return {
    inletKpa: point.inletKpa,
    demandLps: point.demandLps,
    predicted: tool.fit ? predictAt(tool.fit, point.inletKpa) : null,
    needs,
  };
}
