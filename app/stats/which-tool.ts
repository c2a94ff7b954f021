// "Which tool for my job and my air?": for each tool with a pressure fit, the pressure its rated
// air use would get through the shopper's line, and the fitted success there. Pure.
import { operatingInletPressure, type Line } from "~/air/supply";
import { FITTING_LABELS, RATED_INLET_KPA, type Shank } from "~/domain";
import { type CellFigures, predictAt } from "./cells";

export interface ToolAtSupply {
  slug: string;
  fitting: string;
  ratedLps: number;
  fit: CellFigures["fit"];
}

export interface Supply {
  regulatorKpa: number;
  line: Line;
  /** The hammer bits the shopper already owns, if any. */
  bits: Shank | null;
}

export function atSupply(tool: ToolAtSupply, supply: Supply) {
  const point = operatingInletPressure(supply.regulatorKpa, tool.ratedLps, supply.line);
  const needs: string[] = [];
  if (supply.bits && tool.fitting.startsWith("shank-") && tool.fitting !== supply.bits) {
    needs.push(`${FITTING_LABELS[tool.fitting]} bits (yours will not fit; never use a shank adapter)`);
  }
  if (point.inletKpa < RATED_INLET_KPA - 1) needs.push("a bigger air supply or hose: it would run below its 90 psi rating");
  return {
    inletKpa: point.inletKpa,
    demandLps: point.demandLps,
    predicted: tool.fit ? predictAt(tool.fit, point.inletKpa) : null,
    needs,
  };
}
