// What the /air page works out from one set of SI inputs, with the second-edition model: the
// operating point of the tool's running air use through the line's segments, the pressure after
// each segment, the regulator setting the rating needs, and the tank's run time. Pure.
import { RATED_INLET_KPA } from "~/domain";
import { operatingPoint, type OperatingPoint, type SegmentPressure, type ToolAir } from "./line";
import { type ShopLine, shopLineSegments } from "./shop-line";
import { tankRunTime, type TankRunResult, type TankSpec } from "./tank";

export interface AirInput {
  /** The regulator setting (or the tank, with no regulator), kPa gauge. */
  supplyKpa: number;
  tool: ToolAir;
  line: ShopLine;
  tank: TankSpec;
  compressorLps: number;
  ratingKpa?: number;
}

export interface AirAnalysis {
  point: OperatingPoint;
  /** The pressure into and out of each segment while the tool runs, regulator first. */
  segments: SegmentPressure[];
  loss: { hose: number; couplers: number; total: number };
  ratingKpa: number;
  belowRating: boolean;
  compressorShort: boolean;
  /** The regulator setting that puts the rating at the running tool; null when no setting up to 2,000 kPa does. */
  supplyNeededKpa: number | null;
  tank: TankRunResult;
}

const MAX_SUPPLY_KPA = 2000;

/** The regulator setting whose operating point is `targetKpa` at the inlet (bisection: the inlet rises with the setting). */
export function supplyForInlet(targetKpa: number, line: ShopLine, tool: ToolAir): number | null {
  const inletAt = (s: number) => operatingPoint(s, shopLineSegments(s, line), tool).inletKpa;
  if (inletAt(MAX_SUPPLY_KPA) < targetKpa) return null;
  let lo = targetKpa;
  let hi = MAX_SUPPLY_KPA;
  for (let i = 0; i < 60 && hi - lo > 1e-4; i++) {
    const mid = (lo + hi) / 2;
    if (inletAt(mid) < targetKpa) lo = mid;
    else hi = mid;
  }
  return hi;
}

export function analyseAir({
  supplyKpa,
  tool,
  line,
  tank,
  compressorLps,
  ratingKpa = RATED_INLET_KPA,
}: AirInput): AirAnalysis {
  const segments = shopLineSegments(supplyKpa, line);
  const point = operatingPoint(supplyKpa, segments, tool);
  const sum = (kind: SegmentPressure["kind"]) =>
    point.line.segments.filter((s) => s.kind === kind).reduce((a, s) => a + s.dropKpa, 0);
  const hose = sum("hose");
  const couplers = sum("coupler");
  const belowRating = point.inletKpa < ratingKpa - 1e-6;
  return {
    point,
    segments: point.line.segments,
    loss: { hose, couplers, total: hose + couplers },
    ratingKpa,
    belowRating,
    compressorShort: compressorLps < point.demandLps,
    supplyNeededKpa: belowRating ? supplyForInlet(ratingKpa, line, tool) : null,
    tank: tankRunTime(tank, { deliveryLps: compressorLps }, segments, tool, { minInletKpa: ratingKpa }),
  };
}

/** Inlet pressure against hose length for one bore, at the tool's running air use: the points of the bore chart. */
export function inletAlongLengths(
  supplyKpa: number,
  tool: ToolAir,
  line: Omit<ShopLine, "hoseLengthM">,
  lengthsM: number[],
) {
  return lengthsM.map((hoseLengthM) => ({
    hoseLengthM,
    inletKpa: operatingPoint(supplyKpa, shopLineSegments(supplyKpa, { ...line, hoseLengthM }), tool).inletKpa,
  }));
}
