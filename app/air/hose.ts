// Pressure drop along a hose or pipe, from the empirical formula of the Atlas Copco Compressed Air
// Manual (from memory; checked for consistency with a second published form):
//   Δp = 450 · qc^1.85 · l / (d^5 · p)
// Δp in bar, qc free-air flow in l/s, l length in m, d inside diameter in mm, p absolute inlet
// pressure in bar(a). It is a fit for steel pipe; hose charts differ from it by up to about 2×,
// so every figure built on it is an estimate.

export interface HoseDropInput {
  flowLps: number;
  lengthM: number;
  insideDiameterMm: number;
  inletAbsBar: number;
}

export function hosePressureDropBar({ flowLps, lengthM, insideDiameterMm, inletAbsBar }: HoseDropInput): number {
  if (!(flowLps >= 0) || !Number.isFinite(flowLps)) throw new RangeError("flow must be zero or more l/s");
  if (!(lengthM >= 0) || !Number.isFinite(lengthM)) throw new RangeError("hose length must be zero or more metres");
  if (!(insideDiameterMm > 0) || !Number.isFinite(insideDiameterMm))
    throw new RangeError("hose inside diameter must be more than 0 mm");
  if (!(inletAbsBar > 0) || !Number.isFinite(inletAbsBar))
    throw new RangeError("absolute inlet pressure must be more than 0 bar(a)");
  return (450 * flowLps ** 1.85 * lengthM) / (insideDiameterMm ** 5 * inletAbsBar);
}
