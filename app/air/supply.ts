// What reaches the tool: the operating inlet pressure where supply minus line loss balances the
// tool's demand, and how long a receiver tank holds the tool at its rating. Pure functions; all
// pressures in kPa gauge unless named abs, flows in l/s of free air, volumes in litres.
import { ATMOSPHERE_KPA, type CouplerProfile, RANGES, RATED_INLET_KPA, inRange } from "~/domain";
import { couplerPressureDropBar } from "./couplers";
import { airDemandLps } from "./demand";
import { hosePressureDropBar } from "./hose";

export interface Line {
  hoseIdMm: number;
  hoseLengthM: number;
  couplerProfile: CouplerProfile;
  couplerCount: number;
}

/**
 * Pressure lost between the supply (regulator outlet) and the tool inlet at a given free-air flow,
 * split into hose and couplers. The empirical formula takes the absolute pressure at the start of
 * the line, i.e. the supply pressure (an estimate: the pressure falls along the line).
 */
export function lineLossKpa(supplyKpa: number, flowLps: number, line: Line) {
  if (!(supplyKpa >= 0)) throw new RangeError("supply pressure must be zero or more kPa gauge");
  const absBar = (supplyKpa + ATMOSPHERE_KPA) / 100;
  const hose = hosePressureDropBar({ flowLps, lengthM: line.hoseLengthM, insideDiameterMm: line.hoseIdMm, inletAbsBar: absBar }) * 100;
  const couplers = couplerPressureDropBar(line.couplerProfile, line.couplerCount, flowLps, absBar) * 100;
  return { hose, couplers, total: hose + couplers };
}

export interface OperatingPoint {
  inletKpa: number;
  demandLps: number;
  loss: { hose: number; couplers: number; total: number };
  /** The line cannot pass the tool's demand at any pressure above zero: the tool stalls. */
  stalled: boolean;
  converged: boolean;
  iterations: number;
}

/**
 * Solves p = supply − loss(demand(p)) for the inlet pressure p by bisection on [0, supply]. The
 * residual supply − loss(demand(p)) − p falls strictly as p rises (demand and loss grow with p), so
 * the root is unique when it exists. Tolerance 1e-6 kPa.
 */
export function operatingInletPressure(supplyKpa: number, ratedLps: number, line: Line): OperatingPoint {
  if (!inRange(RANGES.gaugePressure, supplyKpa)) throw new RangeError(`supply pressure must be ${RANGES.gaugePressure.stated.kPa.join("–")} kPa gauge`);
  if (!(ratedLps > 0)) throw new RangeError("rated air consumption must be more than 0 l/s");
  const residual = (p: number) => supplyKpa - lineLossKpa(supplyKpa, airDemandLps(ratedLps, p), line).total - p;
  let lo = 0;
  let hi = supplyKpa;
  let iterations = 0;
  if (residual(0) <= 0) {
    const demand = airDemandLps(ratedLps, 0);
    return { inletKpa: 0, demandLps: demand, loss: lineLossKpa(supplyKpa, demand, line), stalled: true, converged: true, iterations };
  }
  while (hi - lo > 1e-6 && iterations < 200) {
    const mid = (lo + hi) / 2;
    if (residual(mid) > 0) lo = mid;
    else hi = mid;
    iterations++;
  }
  const inletKpa = (lo + hi) / 2;
  const demandLps = airDemandLps(ratedLps, inletKpa);
  return { inletKpa, demandLps, loss: lineLossKpa(supplyKpa, demandLps, line), stalled: false, converged: hi - lo <= 1e-6, iterations };
}

/** The supply pressure that puts `targetInletKpa` at the tool: target + loss at the demand there. */
export function supplyNeededKpa(targetInletKpa: number, ratedLps: number, line: Line): number {
  const demand = airDemandLps(ratedLps, targetInletKpa);
  // The loss depends on the supply pressure itself; a few fixed-point steps settle it.
  let supply = targetInletKpa;
  for (let i = 0; i < 50; i++) supply = targetInletKpa + lineLossKpa(supply, demand, line).total;
  return supply;
}

export interface Tank {
  volumeL: number;
  cutOutKpa: number;
  cutInKpa: number;
  compressorLps: number;
}

/**
 * Seconds a receiver feeds a demand before its pressure falls to `floorKpa`, isothermal:
 * free air released = V·Δp / p_atm (common practice receiver formula). From cut-out the
 * compressor is off and the tank drains at the full demand; below cut-in it runs and the tank
 * drains at demand − delivery. Infinity when the compressor keeps up below cut-in.
 */
export function tankRunTimeS(tank: Tank, demandLps: number, floorKpa: number): number {
  if (!(tank.volumeL > 0)) throw new RangeError("tank volume must be more than 0 l");
  if (!(tank.cutOutKpa > tank.cutInKpa) || tank.cutInKpa < 0) throw new RangeError("cut-out pressure must be above cut-in, both zero or more");
  if (!(tank.compressorLps >= 0)) throw new RangeError("compressor delivery must be zero or more l/s");
  if (!(demandLps > 0)) throw new RangeError("demand must be more than 0 l/s");
  if (floorKpa >= tank.cutOutKpa) return 0;
  const freeAir = (fromKpa: number, toKpa: number) => (tank.volumeL * Math.max(0, fromKpa - toKpa)) / ATMOSPHERE_KPA;
  const first = freeAir(tank.cutOutKpa, Math.max(tank.cutInKpa, floorKpa)) / demandLps;
  if (floorKpa >= tank.cutInKpa) return first;
  const net = demandLps - tank.compressorLps;
  if (net <= 0) return Infinity;
  return first + freeAir(tank.cutInKpa, floorKpa) / net;
}

export interface SupplyInput {
  supplyKpa: number;
  ratedLps: number;
  line: Line;
  tank: Tank;
  ratingKpa?: number;
}

export interface SupplyAnalysis extends OperatingPoint {
  ratingKpa: number;
  belowRating: boolean;
  compressorShort: boolean;
  supplyNeededKpa: number;
  /** Seconds at or above the rating, from a full tank; 0 when below rating from the start. */
  runTimeS: number;
}

/** The whole picture the /air page shows, from one set of SI inputs. */
export function analyseSupply({ supplyKpa, ratedLps, line, tank, ratingKpa = RATED_INLET_KPA }: SupplyInput): SupplyAnalysis {
  const point = operatingInletPressure(supplyKpa, ratedLps, line);
  const needed = supplyNeededKpa(ratingKpa, ratedLps, line);
  const belowRating = point.inletKpa < ratingKpa - 1e-6;
  // While the tank is above the regulator setting the regulator holds it; the inlet falls below the
  // rating once the tank drops under what the line needs for the rating.
  const runTimeS = belowRating ? 0 : tankRunTimeS(tank, airDemandLps(ratedLps, ratingKpa), needed);
  return {
    ...point,
    ratingKpa,
    belowRating,
    compressorShort: tank.compressorLps < point.demandLps,
    supplyNeededKpa: needed,
    runTimeS,
  };
}

/** Inlet pressure against hose length for one bore: the points of the page's chart. */
export function inletAlongLengths(supplyKpa: number, ratedLps: number, line: Omit<Line, "hoseLengthM">, lengthsM: number[]) {
  return lengthsM.map((hoseLengthM) => ({
    hoseLengthM,
    inletKpa: operatingInletPressure(supplyKpa, ratedLps, { ...line, hoseLengthM }).inletKpa,
  }));
}
