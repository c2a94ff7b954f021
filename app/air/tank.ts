// How long a receiver tank keeps a tool at its pressure, integrated over time at the operating
// demand: the tank feeds the line (regulator first), the tool draws its running demand at the inlet
// pressure the line leaves it, the compressor cuts in at the cut-in pressure and out at cut-out.
// Pure; pressures kPa gauge, flows l/s of free air, volume litres, time seconds.
import { operatingPoint, type Segment, type ToolAir } from "./line";
import { ATMOSPHERE_KPA, RATED_INLET_KPA } from "~/domain";

export interface TankSpec {
  volumeL: number;
  cutOutKpa: number;
  cutInKpa: number;
}

export interface CompressorSpec {
  /** Free-air delivery, l/s. */
  deliveryLps: number;
}

export interface TankRunOptions {
  /** The run ends when the tool inlet falls below this (default: the 90 psi rating point). */
  minInletKpa?: number;
}

export interface TankRunResult {
  /** Seconds from a full tank (at cut-out, compressor just stopped); Infinity when the compressor keeps up. */
  seconds: number;
  ending: "inlet_below_minimum" | "compressor_keeps_up" | "below_minimum_from_start";
  minInletKpa: number;
  startInletKpa: number;
  /** The tank pressure at which the inlet reaches the minimum. */
  floorTankKpa: number;
  /** When the compressor cut in (s), null when it never did within the run. */
  compressorOnS: number | null;
  demandLps: { start: number; end: number };
  steps: number;
  assumptions: string[];
}

export const TANK_RUN_ASSUMPTIONS = [
  "isothermal tank: the air in it stays at room temperature (free air released = V·Δp / p_atm)",
  "no regulator droop: the regulator holds its setting while the tank is above it",
  "the tool draws its running figure, in proportion to absolute inlet pressure",
  "constant compressor delivery while it runs, none while it is off",
  "the run starts with a full tank at cut-out and the compressor just stopped",
];

const MAX_STEP_KPA = 0.5;
/** The inlet solver's answer is good to 1e-6 kPa; an inlet held exactly at the minimum counts as reaching it. */
const SOLVER_SLACK_KPA = 1e-5;

/** Time-stepped (fourth-order Runge–Kutta) tank pressure until the tool inlet falls below the minimum. */
export function tankRunTime(
  tank: TankSpec,
  compressor: CompressorSpec,
  line: Segment[],
  tool: ToolAir,
  options: TankRunOptions = {},
): TankRunResult {
  if (!(tank.volumeL > 0)) throw new RangeError("tank volume must be more than 0 l");
  if (!(tank.cutOutKpa > tank.cutInKpa) || tank.cutInKpa < 0 || tank.cutOutKpa > 2000)
    throw new RangeError("cut-out must be above cut-in, both 0–2,000 kPa");
  if (!(compressor.deliveryLps >= 0)) throw new RangeError("compressor delivery must be zero or more l/s");
  const minInletKpa = options.minInletKpa ?? RATED_INLET_KPA;
  // While the tank is above a leading regulator's setting the regulator holds its outlet, so the
  // operating point is the same one: solve it once (most of a run from cut-out is spent there).
  const first = line[0];
  const heldKpa = first?.kind === "regulator" ? first.setKpa : Infinity;
  let held: ReturnType<typeof operatingPoint> | null = null;
  const point = (tankKpa: number) =>
    tankKpa >= heldKpa ? (held ??= operatingPoint(heldKpa, line, tool)) : operatingPoint(tankKpa, line, tool);
  const start = point(tank.cutOutKpa);
  const base = { minInletKpa, startInletKpa: start.inletKpa, assumptions: TANK_RUN_ASSUMPTIONS };
  if (start.inletKpa < minInletKpa - SOLVER_SLACK_KPA) {
    return {
      ...base,
      seconds: 0,
      ending: "below_minimum_from_start",
      floorTankKpa: tank.cutOutKpa,
      compressorOnS: null,
      demandLps: { start: start.demandLps, end: start.demandLps },
      steps: 0,
    };
  }

  // The inlet rises with tank pressure, so the tank pressure where it meets the minimum is one root.
  let lo = 0;
  let hi = tank.cutOutKpa;
  for (let i = 0; i < 60 && hi - lo > 1e-7; i++) {
    const mid = (lo + hi) / 2;
    if (point(mid).inletKpa >= minInletKpa - SOLVER_SLACK_KPA) hi = mid;
    else lo = mid;
  }
  const floorTankKpa = hi;
  const floorDemand = point(floorTankKpa).demandLps;
  if (floorTankKpa < tank.cutInKpa && compressor.deliveryLps >= floorDemand) {
    // Once on, the compressor holds the tank above the floor (it settles, or cycles back to cut-out).
    return {
      ...base,
      seconds: Infinity,
      ending: "compressor_keeps_up",
      floorTankKpa,
      compressorOnS: null,
      demandLps: { start: start.demandLps, end: floorDemand },
      steps: 0,
    };
  }

  const rate = (p: number, on: boolean) =>
    (ATMOSPHERE_KPA * ((on ? compressor.deliveryLps : 0) - point(p).demandLps)) / tank.volumeL;
  const rk4 = (p: number, on: boolean, dt: number) => {
    const k1 = rate(p, on);
    const k2 = rate(p + (dt / 2) * k1, on);
    const k3 = rate(p + (dt / 2) * k2, on);
    const k4 = rate(p + dt * k3, on);
    return p + (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
  };

  let p = tank.cutOutKpa;
  let t = 0;
  let on = false;
  let compressorOnS: number | null = null;
  let steps = 0;
  for (;;) {
    const slope = rate(p, on);
    // Pressure falls whenever the run can end (checked above), so a step is sized by the pressure it moves.
    let dt = Math.min(5, MAX_STEP_KPA / Math.max(Math.abs(slope), 1e-9));
    // Land the compressor's cut-in exactly.
    const target = !on && tank.cutInKpa > floorTankKpa ? tank.cutInKpa : floorTankKpa;
    let next = rk4(p, on, dt);
    if (next <= target) {
      let a = 0;
      let b = dt;
      for (let i = 0; i < 60 && b - a > 1e-9; i++) {
        const m = (a + b) / 2;
        if (rk4(p, on, m) > target) a = m;
        else b = m;
      }
      dt = b;
      next = target;
    }
    t += dt;
    p = next;
    steps++;
    if (p <= floorTankKpa) break;
    if (!on && p <= tank.cutInKpa) {
      on = true;
      compressorOnS = t;
    }
    if (steps > 1_000_000) throw new Error("tank run did not end: step size collapsed");
  }
  return {
    ...base,
    seconds: t,
    ending: "inlet_below_minimum",
    floorTankKpa,
    compressorOnS,
    demandLps: { start: start.demandLps, end: floorDemand },
    steps,
  };
}
