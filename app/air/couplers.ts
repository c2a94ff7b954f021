import type { CouplerProfile } from "~/domain";
import { hosePressureDropBar } from "./hose";

/**
 * Couplers and fittings counted as an equivalent length of straight pipe at the coupler's throat
 * bore (a common practice way to fold fittings into a line-loss formula). The throat bores and
 * lengths below are our own rough figures for a plug-and-socket pair, not a published table:
 * treat the result as an estimate and prefer a gauge at the tool inlet.
 */
export const COUPLER_FLOW: Record<CouplerProfile, { throatMm: number; equivalentLengthM: number }> = {
  industrial_m: { throatMm: 6.5, equivalentLengthM: 3.0 },
  automotive_t: { throatMm: 6.0, equivalentLengthM: 4.0 },
  high_flow_v: { throatMm: 8.5, equivalentLengthM: 1.5 },
  iso_6150_b: { throatMm: 7.0, equivalentLengthM: 2.5 },
  other: { throatMm: 6.0, equivalentLengthM: 4.0 },
};

export function couplerPressureDropBar(
  profile: CouplerProfile,
  count: number,
  flowLps: number,
  inletAbsBar: number,
): number {
  if (!Number.isInteger(count) || count < 0) throw new RangeError("coupler count must be a whole number, zero or more");
  const c = COUPLER_FLOW[profile];
  if (!c) throw new RangeError(`unknown coupler profile: ${profile}`);
  if (count === 0) return 0;
  return hosePressureDropBar({
    flowLps,
    lengthM: c.equivalentLengthM * count,
    insideDiameterMm: c.throatMm,
    inletAbsBar,
  });
}
