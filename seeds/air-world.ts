// The demo world's own air line: a different model from the product's (app/air) on purpose
// (issue 17), so the product's estimates can be checked against data they did not produce.
// Demo only; SI throughout (Pa absolute, kg/s, m).
//
// Hose: isothermal compressible flow in a smooth pipe of constant bore, Darcy–Weisbach:
//   p₁² − p₂² = G²·R·T·[f·L/D + 2·ln(p₁/p₂)]   (the isothermal pipe-flow result of fluid-mechanics
//   texts, e.g. White, Fluid Mechanics, §9.9 — from memory; REFERENCES.md "Hose and line flow")
// with the Haaland (1983) friction factor 1/√f = −1.8·log10[(ε/D/3.7)^1.11 + 6.9/Re], ε = 0
// (published form, REFERENCES.md).
// Couplers: fixed-Cv orifices, the ISA-75.01 gas sizing form q = N·Cv·P₁·Y·√(x/(G·T₁)), x = Δp/P₁,
// Y = 1 − x/(3·x_T), x_T = 0.5, choked beyond (q in scfh, N = 1360, psia, °R; as printed from
// ISA-75.01/75.02 on a valve maker's flow-coefficient page — published; x_T = 0.5 our choice,
// matching its Y = 0.667 at P₂ ≤ 0.5·P₁).
import { KPA_PER_PSI, LPS_PER_SCFM } from "../app/domain";

/** J/(kg·K), dry air (REFERENCES.md). */
export const R_AIR = 287.05;
/** Air in the line at 20 °C (the ISO 8778 reference temperature, from memory). */
export const LINE_T_K = 293.15;
/** Dynamic viscosity of air at 20 °C, Pa·s (from memory: 1.81e-5). */
export const AIR_VISCOSITY = 1.81e-5;
/** Free air: 101.325 kPa and 20 °C, as the product counts it. */
export const FREE_AIR_PA = 101_325;
const FREE_AIR_DENSITY = FREE_AIR_PA / (R_AIR * LINE_T_K);

/** The world's coupler pairs: invented flow coefficients for a 1/4 in body plug and socket of each profile. */
export const WORLD_COUPLER_CV: Record<string, number> = {
  industrial_m: 0.55,
  automotive_t: 0.5,
  high_flow_v: 1.0,
  iso_6150_b: 0.65,
  other: 0.5,
};

/** Haaland's friction factor for a smooth bore (ε = 0). */
export function haalandSmooth(re: number): number {
  if (re < 2300) return 64 / re; // laminar
  const inv = -1.8 * Math.log10(6.9 / re);
  return 1 / inv ** 2;
}

/** Outlet pressure (Pa abs) of a smooth hose; 0 when it cannot pass the flow. */
export function hoseOutletPa(p1: number, flowLps: number, idMm: number, lengthM: number): number {
  if (flowLps <= 0 || lengthM <= 0) return p1;
  const d = idMm / 1000;
  const area = (Math.PI * d * d) / 4;
  const g = (FREE_AIR_DENSITY * flowLps) / 1000 / area;
  const f = haalandSmooth((g * d) / AIR_VISCOSITY);
  const k = g * g * R_AIR * LINE_T_K;
  let p2Sq = p1 * p1 - k * ((f * lengthM) / d);
  if (p2Sq <= 0) return 0;
  for (let i = 0; i < 50; i++) {
    const next = p1 * p1 - k * ((f * lengthM) / d + 2 * Math.log(p1 / Math.sqrt(p2Sq)));
    if (next <= 0) return 0;
    if (Math.abs(next - p2Sq) < 1e-6 * p1) return Math.sqrt(next);
    p2Sq = next;
  }
  return Math.sqrt(p2Sq);
}

/** Outlet pressure (Pa abs) of one fixed-Cv coupler pair; 0 when choked below the flow. */
export function couplerOutletPa(p1: number, flowLps: number, cv: number): number {
  if (flowLps <= 0) return p1;
  const p1Psia = p1 / 1000 / KPA_PER_PSI;
  const tR = LINE_T_K * 1.8;
  const scfh = (flowLps / LPS_PER_SCFM) * 60;
  // q = c·(1 − x/1.5)·√x with c = 1360·Cv·P₁/√T₁; choked (no solution) above q(x_T = 0.5).
  const c = (1360 * cv * p1Psia) / Math.sqrt(tR);
  if (scfh >= c * (1 - 0.5 / 1.5) * Math.sqrt(0.5)) return 0;
  // Fixed point x = (q/c / (1 − x/1.5))², which contracts on the subcritical branch.
  let x = (scfh / c) ** 2;
  for (let i = 0; i < 100; i++) {
    const next = (scfh / c / (1 - x / 1.5)) ** 2;
    if (next >= 0.5) return 0;
    if (Math.abs(next - x) < 1e-13) return p1 * (1 - next);
    x = next;
  }
  return p1 * (1 - x);
}

export interface WorldLine {
  hoseIdMm: number;
  hoseLengthM: number;
  couplerProfile: string;
  couplerCount: number;
}

/** Gauge kPa at the tool inlet for a free-air flow; 0 when the line cannot pass it. */
export function worldOutletKpa(regulatorKpa: number, flowLps: number, line: WorldLine): number {
  let p = regulatorKpa * 1000 + FREE_AIR_PA;
  p = hoseOutletPa(p, flowLps, line.hoseIdMm, line.hoseLengthM);
  for (let i = 0; i < line.couplerCount && p > 0; i++)
    p = couplerOutletPa(p, flowLps, WORLD_COUPLER_CV[line.couplerProfile]!);
  return Math.max(0, (p - FREE_AIR_PA) / 1000);
}

/**
 * The inlet pressure while the tool runs: its free-air draw grows with absolute inlet pressure
 * (a choked port), from `runningLpsAt90` at 90 psi. The residual outlet − p falls as p rises; the
 * Illinois form of regula falsi on [0, regulator] finds its root to 1e-7 kPa.
 */
export function worldInletKpa(regulatorKpa: number, runningLpsAt90: number, line: WorldLine) {
  const at90Abs = 90 * KPA_PER_PSI + FREE_AIR_PA / 1000;
  const demand = (p: number) => (runningLpsAt90 * (p + FREE_AIR_PA / 1000)) / at90Abs;
  const residual = (p: number) => worldOutletKpa(regulatorKpa, demand(p), line) - p;
  let a = 0;
  let fa = residual(a);
  let b = regulatorKpa;
  let fb = residual(b);
  let inletKpa = 0;
  if (fa > 0 && fb < 0) {
    let side = 0;
    for (let i = 0; i < 100; i++) {
      inletKpa = (a * fb - b * fa) / (fb - fa);
      const f = residual(inletKpa);
      if (Math.abs(f) < 1e-7 || b - a < 1e-9) break;
      if (f > 0) {
        a = inletKpa;
        fa = f;
        if (side === -1) fb /= 2;
        side = -1;
      } else {
        b = inletKpa;
        fb = f;
        if (side === 1) fa /= 2;
        side = 1;
      }
    }
  } else if (fb >= 0) inletKpa = regulatorKpa;
  return { inletKpa, demandLps: demand(inletKpa) };
}
