// The first-edition line model, kept for one user: the stats refresh corrects regulator readings
// with it (app/stats/refresh.server.ts, docs/decisions/010), at the tool's rated air use, the line
// linearised at the supply pressure. The pages use the second edition (line.ts, tank.ts). Pure;
// pressures in kPa gauge unless named abs, flows in l/s of free air.
import { ATMOSPHERE_KPA, type CouplerProfile, RANGES, inRange } from "~/domain";
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
  const hose =
    hosePressureDropBar({ flowLps, lengthM: line.hoseLengthM, insideDiameterMm: line.hoseIdMm, inletAbsBar: absBar }) *
    100;
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
  if (!inRange(RANGES.gaugePressure, supplyKpa))
    throw new RangeError(`supply pressure must be ${RANGES.gaugePressure.stated.kPa.join("–")} kPa gauge`);
  if (!(ratedLps > 0)) throw new RangeError("rated air consumption must be more than 0 l/s");
  const residual = (p: number) => supplyKpa - lineLossKpa(supplyKpa, airDemandLps(ratedLps, p), line).total - p;
  let lo = 0;
  let hi = supplyKpa;
  let iterations = 0;
  if (residual(0) <= 0) {
    const demand = airDemandLps(ratedLps, 0);
    return {
      inletKpa: 0,
      demandLps: demand,
      loss: lineLossKpa(supplyKpa, demand, line),
      stalled: true,
      converged: true,
      iterations,
    };
  }
  while (hi - lo > 1e-6 && iterations < 200) {
    const mid = (lo + hi) / 2;
    if (residual(mid) > 0) lo = mid;
    else hi = mid;
    iterations++;
  }
  const inletKpa = (lo + hi) / 2;
  const demandLps = airDemandLps(ratedLps, inletKpa);
  return {
    inletKpa,
    demandLps,
    loss: lineLossKpa(supplyKpa, demandLps, line),
    stalled: false,
    converged: hi - lo <= 1e-6,
    iterations,
  };
}
