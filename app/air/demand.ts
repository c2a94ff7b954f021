import { ATMOSPHERE_KPA, RATED_INLET_KPA } from "~/domain";

/**
 * Free-air demand of a tool at a given gauge inlet pressure, from its rated consumption at
 * 6.2 bar (90 psi). Common practice: a tool's orifices pass a free-air flow roughly in proportion
 * to absolute inlet pressure, so demand scales with (p + p_atm) / (p_rated + p_atm). An estimate,
 * valid roughly from 3 to 10 bar gauge.
 */
export function airDemandLps(ratedLps: number, inletGaugeKpa: number, ratedGaugeKpa = RATED_INLET_KPA): number {
  if (!(ratedLps > 0)) throw new RangeError("rated air consumption must be more than 0 l/s");
  if (!(inletGaugeKpa >= 0)) throw new RangeError("inlet pressure must be zero or more kPa gauge");
  return (ratedLps * (inletGaugeKpa + ATMOSPHERE_KPA)) / (ratedGaugeKpa + ATMOSPHERE_KPA);
}
