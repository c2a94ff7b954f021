// The air line, second edition: segments in order from the supply to the tool inlet (regulator,
// hose, each coupler and plug, whip hose), each solved at its own inlet pressure. Pure functions;
// pressures in kPa gauge unless named abs, flows in l/s of free air, lengths in m, bores in mm.
//
// Hose: the pipe formula of the Atlas Copco Compressed Air Manual (from memory; see app/air/hose.ts)
//   dp/dx = −K · q^1.85 / (d⁵ · p), K = 450 (bar, l/s, m, mm, bar(a)),
// integrated along the hose with q the free-air flow (the same all along: mass is conserved):
//   p₂² = p₁² − 2 · K · q^1.85 · l / d⁵   (absolute pressure; isothermal).
// For a small drop it reduces to the linear form Δp = K · q^1.85 · l / (d⁵ · p₁) of app/air/hose.ts.
import { ATMOSPHERE_KPA, type CouplerProfile, RATED_INLET_KPA } from "~/domain";

/** The pipe formula's constant, as in app/air/hose.ts (Atlas Copco Compressed Air Manual, from memory). */
export const LINE_LOSS_K = 450;
export const FLOW_EXPONENT = 1.85;

/**
 * A plug-and-socket pair counted as an equivalent length of its own throat bore, evaluated at the
 * pressure where it sits. Throat bores are the narrowest bore of a common 1/4 in body plug of each
 * profile, from memory (issue 17: common industrial plugs are nearer 5 mm than 6.5 mm); the 0.6 m
 * equivalent length per pair is our own estimate, not a published figure. Estimates: prefer a gauge
 * at the tool inlet.
 */
export const COUPLER_THROATS: Record<CouplerProfile, { throatMm: number; equivalentLengthM: number; source: string }> =
  {
    industrial_m: { throatMm: 5.0, equivalentLengthM: 0.6, source: "throat from memory; length our estimate" },
    automotive_t: { throatMm: 4.8, equivalentLengthM: 0.6, source: "throat from memory; length our estimate" },
    high_flow_v: { throatMm: 7.0, equivalentLengthM: 0.6, source: "throat from memory; length our estimate" },
    iso_6150_b: { throatMm: 5.5, equivalentLengthM: 0.6, source: "throat from memory; length our estimate" },
    other: { throatMm: 4.8, equivalentLengthM: 0.6, source: "the narrowest common throat, to err on the safe side" },
  };

export type Segment =
  /** Holds its outlet at the setting while the inlet is above it (no droop assumed). */
  | { kind: "regulator"; setKpa: number }
  | { kind: "hose"; idMm: number; lengthM: number; label?: string }
  /** `count` pairs in a row, each solved at its own inlet; throat and length override the profile's. */
  | {
      kind: "coupler";
      profile: CouplerProfile;
      count?: number;
      throatMm?: number;
      equivalentLengthM?: number;
      label?: string;
    };

export interface SegmentPressure {
  kind: Segment["kind"];
  label: string;
  inletKpa: number;
  outletKpa: number;
  dropKpa: number;
}

export interface LineResult {
  flowLps: number;
  outletKpa: number;
  /** The line cannot pass this flow: the pressure falls to atmosphere before the tool. */
  stalled: boolean;
  segments: SegmentPressure[];
}

const absBar = (gaugeKpa: number) => (gaugeKpa + ATMOSPHERE_KPA) / 100;
const gaugeKpa = (absBarValue: number) => absBarValue * 100 - ATMOSPHERE_KPA;

/**
 * Outlet pressure (bar absolute) of a straight bore from the integrated pipe formula; 0 when the
 * bore cannot pass the flow (p₁² < 2·K·q^1.85·l/d⁵).
 */
export function boreOutletAbsBar(
  inletAbsBar: number,
  flowLps: number,
  lengthM: number,
  idMm: number,
  k = LINE_LOSS_K,
): number {
  if (!(inletAbsBar > 0) || !(flowLps >= 0) || !(lengthM >= 0) || !(idMm > 0))
    throw new RangeError("bore: pressures, bore above 0; flow, length 0 or more");
  const square = inletAbsBar ** 2 - (2 * k * flowLps ** FLOW_EXPONENT * lengthM) / idMm ** 5;
  return square > 0 ? Math.sqrt(square) : 0;
}

function label(s: Segment, i: number, all: Segment[]): string {
  if (s.kind === "regulator") return "Regulator";
  if (s.kind === "coupler") return s.label ?? ((s.count ?? 1) > 1 ? `${s.count} couplers` : "Coupler and plug");
  if (s.label) return s.label;
  const lastHose = all.findLastIndex((x) => x.kind === "hose");
  const hoses = all.filter((x) => x.kind === "hose").length;
  return hoses > 1 && i === lastHose ? "Whip hose" : "Hose";
}

/** The pressure after each segment in order, at a given free-air flow; a stalled line reads 0 from there on. */
export function lineOutletPressure(supplyKpa: number, segments: Segment[], demandLps: number): LineResult {
  if (!(supplyKpa >= 0) || !Number.isFinite(supplyKpa))
    throw new RangeError("supply pressure must be zero or more kPa gauge");
  if (!(demandLps >= 0) || !Number.isFinite(demandLps)) throw new RangeError("demand must be zero or more l/s");
  let p = supplyKpa;
  let stalled = false;
  const out: SegmentPressure[] = segments.map((s, i) => {
    const inletKpa = p;
    if (!stalled) {
      if (s.kind === "regulator") p = Math.min(p, s.setKpa);
      else if (s.kind === "hose") p = gaugeKpa(boreOutletAbsBar(absBar(p), demandLps, s.lengthM, s.idMm));
      else {
        const c = COUPLER_THROATS[s.profile];
        if (!c) throw new RangeError(`unknown coupler profile: ${s.profile}`);
        const count = s.count ?? 1;
        if (!Number.isInteger(count) || count < 0)
          throw new RangeError("coupler count must be a whole number, zero or more");
        for (let n = 0; n < count && p > 0; n++) {
          p = gaugeKpa(
            boreOutletAbsBar(
              absBar(p),
              demandLps,
              s.equivalentLengthM ?? c.equivalentLengthM,
              s.throatMm ?? c.throatMm,
            ),
          );
        }
      }
      if (p <= 0 && demandLps > 0 && s.kind !== "regulator") stalled = true;
      p = Math.max(0, p);
    }
    return { kind: s.kind, label: label(s, i, segments), inletKpa, outletKpa: p, dropKpa: inletKpa - p };
  });
  return { flowLps: demandLps, outletKpa: p, stalled, segments: out };
}

// ——— The tool's two air figures ———

export type RunningAirSource = "maker_sheet" | "measured" | "estimated";

/**
 * While hammering or impacting a tool draws about 2–3× the average a maker states (from memory,
 * issue 17); without a running figure we take 2.5× and say so.
 */
export const RUNNING_AIR_FACTOR = 2.5;

export interface ToolAir {
  /** The average use a maker states, l/s of free air at 90 psi (6.2 bar) inlet. */
  ratedLps: number;
  /** The use while running (hammering, impacting), l/s of free air at 90 psi inlet, when known. */
  runningLps?: number | null;
  runningSource?: RunningAirSource | null;
  /** The factor on the average when the running figure is an estimate. */
  runningFactor?: number | null;
}

export interface RunningAir {
  lps: number;
  source: RunningAirSource;
  factor: number | null;
}

/** The running figure and where it came from: the catalogue's, or the average times a stated factor. */
export function runningAir(tool: ToolAir): RunningAir {
  if (!(tool.ratedLps > 0)) throw new RangeError("rated air use must be more than 0 l/s");
  if (tool.runningLps != null && tool.runningLps > 0) {
    const source = tool.runningSource ?? "estimated";
    return {
      lps: tool.runningLps,
      source,
      factor: source === "estimated" ? (tool.runningFactor ?? tool.runningLps / tool.ratedLps) : null,
    };
  }
  return { lps: tool.ratedLps * RUNNING_AIR_FACTOR, source: "estimated", factor: RUNNING_AIR_FACTOR };
}

/**
 * Free-air demand at a gauge inlet pressure from a figure at 90 psi: the tool's ports pass a
 * free-air flow roughly in proportion to absolute inlet pressure (common practice; see demand.ts).
 */
export const demandAt = (lpsAt90: number, inletKpa: number) =>
  (lpsAt90 * (Math.max(0, inletKpa) + ATMOSPHERE_KPA)) / (RATED_INLET_KPA + ATMOSPHERE_KPA);

// ——— The operating point ———

export interface OperatingPoint {
  inletKpa: number;
  demandLps: number;
  running: RunningAir;
  line: LineResult;
  stalled: boolean;
  converged: boolean;
  iterations: number;
}

export const INLET_TOLERANCE_KPA = 1e-6;

/**
 * The inlet pressure p where the line, passing the tool's running demand at p, delivers p:
 * p = outlet(supply, segments, demand(p)). The residual outlet(demand(p)) − p falls strictly as p
 * rises, so bisection on [0, supply] brackets the one root; 2,000 kPa down to 1e-6 kPa takes 31 halvings.
 */
export function operatingPoint(supplyKpa: number, segments: Segment[], tool: ToolAir): OperatingPoint {
  if (!(supplyKpa >= 0) || supplyKpa > 2000) throw new RangeError("supply pressure must be 0–2,000 kPa gauge");
  const running = runningAir(tool);
  const residual = (p: number) => lineOutletPressure(supplyKpa, segments, demandAt(running.lps, p)).outletKpa - p;
  let lo = 0;
  let hi = supplyKpa;
  let iterations = 0;
  const finish = (inletKpa: number, stalled: boolean, converged: boolean) => {
    const demandLps = demandAt(running.lps, inletKpa);
    return {
      inletKpa,
      demandLps,
      running,
      line: lineOutletPressure(supplyKpa, segments, demandLps),
      stalled,
      converged,
      iterations,
    };
  };
  if (residual(0) <= 0) return finish(0, true, true);
  while (hi - lo > INLET_TOLERANCE_KPA && iterations < 59) {
    const mid = (lo + hi) / 2;
    if (residual(mid) > 0) lo = mid;
    else hi = mid;
    iterations++;
  }
  return finish((lo + hi) / 2, false, hi - lo <= INLET_TOLERANCE_KPA);
}
