import { hosePressureDropBar } from "./hose";

export type CouplerProfile = "industrial_m" | "automotive_t" | "high_flow_v" | "iso_6150_b" | "other";

/**
 * Couplers and fittings counted as an equivalent length of straight pipe at the coupler's throat
 * bore (a common practice way to fold fittings into a line-loss formula). The throat bores and
 * lengths below are our own rough figures for a plug-and-socket pair, not a published table:
 * treat the result as an estimate and prefer a gauge at the tool inlet.
 */
export const COUPLER_PROFILES: Record<CouplerProfile, { label: string; throatMm: number; equivalentLengthM: number }> = {
  industrial_m: { label: "Industrial (M-style)", throatMm: 6.5, equivalentLengthM: 3.0 },
  automotive_t: { label: "Automotive (T-style)", throatMm: 6.0, equivalentLengthM: 4.0 },
  high_flow_v: { label: "High-flow (V-style)", throatMm: 8.5, equivalentLengthM: 1.5 },
  iso_6150_b: { label: "ISO 6150 B", throatMm: 7.0, equivalentLengthM: 2.5 },
  other: { label: "Other / unknown", throatMm: 6.0, equivalentLengthM: 4.0 },
};

export function couplerPressureDropBar(profile: CouplerProfile, count: number, flowLps: number, inletAbsBar: number): number {
  if (!Number.isInteger(count) || count < 0) throw new RangeError("coupler count must be a whole number, zero or more");
  const c = COUPLER_PROFILES[profile];
  if (!c) throw new RangeError(`unknown coupler profile: ${profile}`);
  if (count === 0) return 0;
  return hosePressureDropBar({ flowLps, lengthM: c.equivalentLengthM * count, insideDiameterMm: c.throatMm, inletAbsBar });
}
