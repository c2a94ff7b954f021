// Deterministic generator of the demo's reports. Invented data with believable structure: the air
// that reaches each tool comes from the demo world's own line model (seeds/air-world.ts: smooth-hose
// Darcy–Weisbach, fixed-Cv couplers), not the product's, so app/air can be checked against it;
// regulators are set where shops set them (90–120 psi) and mostly at or under the tool's maximum;
// vehicles fit the job; success rises with tool size and inlet pressure on seized and breakaway
// jobs; no reporter is more than about 10 % of a (model, job) cell; values are rounded to the
// precision they are entered at. The structure is for the demo only, not a finding.
import seedrandom from "seedrandom";
import { type CouplerProfile, KPA_PER_PSI, M_PER_FT, MM_PER_IN } from "../app/domain";
import { plausibilityFlags } from "../app/moderation/flags";
import type { CorrosionLevel, InletSource, Outcome, ReportStatus, VehicleClass } from "../db/schema";
import { worldInletKpa } from "./air-world";
import { jobTypes, models, runningAir, type ModelSeed } from "./catalogue";
import { people, shops } from "./people";

/** A usual maximum inlet pressure on demo tool sheets (100 psi); seeds/index.ts stores the same. */
const DEFAULT_MAX_KPA = 689.5;

export type Rng = () => number;

export const makeRng = (seed: string): Rng => seedrandom(seed);

const pick = <T>(rng: Rng, items: readonly T[]): T => items[Math.floor(rng() * items.length)]!;

function pickWeighted<T>(rng: Rng, items: readonly T[], weight: (t: T) => number): T {
  const total = items.reduce((s, t) => s + weight(t), 0);
  let r = rng() * total;
  for (const item of items) {
    r -= weight(item);
    if (r <= 0) return item;
  }
  return items[items.length - 1]!;
}

/** Standard normal deviate by Box–Muller. */
function normal(rng: Rng): number {
  const u = 1 - rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng());
}

const logistic = (x: number) => 1 / (1 + Math.exp(-x));
/** Rounded to `digits` decimals and stored as the double nearest that decimal (no float noise). */
const fixed = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
const roundStep = (x: number, step: number) => Math.round(x / step) * step;

export interface GeneratedReport {
  modelIndex: number;
  jobIndex: number;
  reporterIndex: number;
  status: ReportStatus;
  vehicleClass: VehicleClass;
  componentAgeYears: number;
  corrosion: CorrosionLevel;
  attachment: string;
  attachmentLengthMm: number;
  regulatorKpa: number;
  inletKpa: number;
  inletSource: InletSource;
  hoseIdMm: number;
  hoseLengthM: number;
  couplerProfile: CouplerProfile;
  couplerCount: number;
  compressorLps: number;
  tankL: number;
  outcome: Outcome;
  timeS: number;
  attempts: number;
  triggerControl: number;
  notes: string | null;
  flags: string[];
  submittedAt: Date;
  /** Demo only, never stored: the world's truth behind the report (for checking app/air against it). */
  world: { regulatorSetKpa: number; inletKpa: number; demandLps: number };
}

/**
 * How much work a tool can do relative to others in its category (demo only): the latent size that
 * drives its field success here and its bench force in seeds/bench.ts alike.
 */
export function toolPower(m: ModelSeed): number {
  if (m.category === "air-hammer") return ((m.boreMm ?? 19) ** 2 * (m.strokeMm ?? 60)) / (19 ** 2 * 67);
  return (m.torqueNm ?? 800) / (m.category === "impact-wrench" ? 1200 : 80);
}

/** The vehicles each job is done on, with how often (demo only). */
const JOB_VEHICLES: Record<string, Partial<Record<VehicleClass, number>>> = {
  "ball-joint-separation": { passenger_car: 6, light_truck: 4 },
  "tie-rod-end-release": { passenger_car: 5, light_truck: 4, heavy_truck: 2, bus: 1, agricultural: 1 },
  "seized-bolt-punch-out": {
    passenger_car: 3,
    light_truck: 3,
    heavy_truck: 3,
    trailer: 2,
    construction: 2,
    agricultural: 1,
    bus: 1,
  },
  "exhaust-joint-split": { passenger_car: 6, light_truck: 4, heavy_truck: 1, bus: 1 },
  "rivet-shear": { heavy_truck: 4, trailer: 4, bus: 2, light_truck: 1 },
  "bushing-press-out": { passenger_car: 3, light_truck: 3, heavy_truck: 3, trailer: 2, bus: 1, construction: 1 },
  "king-pin-drive-out": { heavy_truck: 6, bus: 3 },
  "lug-nut-breakaway": {
    passenger_car: 4,
    light_truck: 4,
    heavy_truck: 3,
    trailer: 2,
    bus: 2,
    construction: 1,
    agricultural: 1,
  },
  "axle-nut-breakaway": { passenger_car: 6, light_truck: 4 },
  "crank-bolt-breakaway": { passenger_car: 7, light_truck: 3 },
  "control-arm-bolt-breakaway": { passenger_car: 6, light_truck: 4 },
  "manifold-nut-removal": { passenger_car: 4, light_truck: 4, heavy_truck: 2 },
  "caliper-bracket-bolt-removal": { passenger_car: 6, light_truck: 4 },
  "water-pump-bolt-run-out": { passenger_car: 6, light_truck: 4 },
};

/** Which vehicles each kind of shop works on. */
const TRADE_VEHICLES: Record<string, VehicleClass[]> = {
  automotive: ["passenger_car", "light_truck"],
  fleet: ["light_truck", "heavy_truck", "bus", "trailer"],
  heavy_equipment: ["heavy_truck", "construction", "agricultural", "trailer"],
};
const HEAVY: VehicleClass[] = ["heavy_truck", "bus", "trailer", "construction", "agricultural"];

/** Coupler profiles by trade, with weights. */
const TRADE_COUPLERS: Record<string, [CouplerProfile, number][]> = {
  automotive: [
    ["automotive_t", 4],
    ["industrial_m", 5],
    ["high_flow_v", 1],
  ],
  fleet: [
    ["industrial_m", 6],
    ["high_flow_v", 2],
    ["iso_6150_b", 1],
    ["automotive_t", 1],
  ],
  heavy_equipment: [
    ["industrial_m", 4],
    ["high_flow_v", 4],
    ["iso_6150_b", 2],
  ],
};

const ATTACHMENTS: Record<string, string[]> = {
  "air-hammer": ["pickle fork", "tapered punch", "blunt punch", "flat chisel", "panel cutter", "tie rod splitter"],
  "impact-wrench": ["impact socket", "deep impact socket", "extension and impact socket"],
  "air-ratchet": ["socket", "swivel socket", "extension and socket"],
};
const CORROSION: CorrosionLevel[] = ["none", "light", "moderate", "heavy", "severe"];
const NOTES = [
  "Soaked with penetrant overnight first.",
  "Had to heat it before the last attempt.",
  "Rust belt truck, original parts.",
  "Second tech held a backing hammer against the knuckle.",
  "Bit retainer fitted, glasses and muffs on.",
  "Hose run across the bay from the drop.",
  "Compressor kicked on halfway through.",
  "Used a shorter bit to get more of the blow into the joint.",
];

const START = Date.UTC(2025, 0, 6);
const SPAN_MS = Date.UTC(2026, 10, 20) - START;

/** Report counts per (model, job) pair: a few popular pairs with 40–100, a long tail with a handful. */
export function pairCounts(rng: Rng) {
  const pairs = models.flatMap((m, mi) =>
    jobTypes.flatMap((j, ji) =>
      j.category === m.category ? [{ mi, ji, score: m.popularity * j.popularity * (0.6 + 0.8 * rng()) }] : [],
    ),
  );
  pairs.sort((a, b) => b.score - a.score);
  return pairs.map((p, rank) => ({ ...p, count: Math.round(98 * Math.exp(-rank / 28)) + 2 + Math.floor(rng() * 4) }));
}

/** The reporters who work on a vehicle class, by their shop's trade. */
const reportersFor = (vehicle: VehicleClass) =>
  people.flatMap((p, i) => (TRADE_VEHICLES[shops[p.shopIndex]!.trade]!.includes(vehicle) ? [i] : []));

export function generateReports(seed = "bayproof-demo-v2"): GeneratedReport[] {
  const rng = makeRng(seed);
  const reporterWeight = (i: number) => (people[i]!.roles.length ? 0.3 : 1 / (1 + i * 0.03));
  const out: GeneratedReport[] = [];

  for (const { mi, ji, count } of pairCounts(rng)) {
    const model = models[mi]!;
    const job = jobTypes[ji]!;
    const power = toolPower(model);
    const maxKpa = model.maxInletKpa ?? DEFAULT_MAX_KPA;
    const vehicles = Object.entries(JOB_VEHICLES[job.slug]!) as [VehicleClass, number][];
    // No reporter more than about 10 % of the cell (at least one report each).
    const cap = Math.max(1, Math.floor(count / 10));
    const inCell = new Map<number, number>();
    const breakaway = job.seized || job.slug.endsWith("-breakaway");

    for (let k = 0; k < count; k++) {
      const vehicleClass = pickWeighted(rng, vehicles, ([, w]) => w)[0];
      const eligible = reportersFor(vehicleClass);
      const open = eligible.filter((i) => (inCell.get(i) ?? 0) < cap);
      const pool = open.length ? open : eligible;
      const reporterIndex = pickWeighted(rng, pool, reporterWeight);
      inCell.set(reporterIndex, (inCell.get(reporterIndex) ?? 0) + 1);
      const shop = shops[people[reporterIndex]!.shopIndex]!;

      // The regulator: where the shop keeps it (90–120 psi), turned down to the tool's maximum by
      // most technicians; a few leave it where it is.
      let regulatorSetKpa = Math.min(120, Math.max(90, shop.air.regulatorPsi + normal(rng) * 3)) * KPA_PER_PSI;
      if (regulatorSetKpa > maxKpa && rng() < 0.9) regulatorSetKpa = maxKpa - rng() * 5 * KPA_PER_PSI;
      // A tool with a 3/8 in inlet is mostly run on 3/8 in hose or bigger and high-flow couplers.
      const bigInlet = model.inlet.startsWith("3/8");
      const shopHose = rng() < 0.75 ? shop.air.hoseIdIn : pick(rng, [0.25, 0.3125, 0.375, 0.5]);
      const hoseIdIn = bigInlet && rng() < 0.85 ? Math.max(0.375, shopHose) : shopHose;
      const hoseFt = rng() < 0.7 ? shop.air.hoseFt : pick(rng, [15, 25, 35, 50, 75]);
      const couplerProfile =
        bigInlet && rng() < 0.7 ? "high_flow_v" : pickWeighted(rng, TRADE_COUPLERS[shop.trade]!, ([, w]) => w)[0];
      const couplerCount = 1 + Math.floor(rng() * (bigInlet ? 2 : 3));
      const line = { hoseIdMm: hoseIdIn * MM_PER_IN, hoseLengthM: hoseFt * M_PER_FT, couplerProfile, couplerCount };
      const runningLps = runningAir[mi]!.trueLps;
      const inletSource = pickWeighted(rng, ["measured_at_inlet", "read_at_regulator", "estimated"] as const, (s) =>
        s === "measured_at_inlet" ? 0.4 : s === "read_at_regulator" ? 0.35 : 0.25,
      );
      // With a gauge at the inlet, many set the regulator so the inlet under load sits just under
      // the tool's maximum (the regulator staying within 90–120 psi).
      if (inletSource === "measured_at_inlet" && rng() < 0.6) {
        const target = maxKpa - rng() * 6 * KPA_PER_PSI;
        // The inlet follows the regulator nearly one for one: a few corrections settle it.
        for (let i = 0; i < 6; i++) {
          const step = target - worldInletKpa(regulatorSetKpa, runningLps, line).inletKpa;
          regulatorSetKpa = Math.min(120 * KPA_PER_PSI, Math.max(90 * KPA_PER_PSI, regulatorSetKpa + step));
        }
      }
      const truth = worldInletKpa(regulatorSetKpa, runningLps, line);

      // What the reporter writes down: gauges read to a couple of psi.
      const regulatorKpa = fixed(regulatorSetKpa + normal(rng) * 1 * KPA_PER_PSI, 1);
      const inletKpa = fixed(
        Math.max(
          50,
          inletSource === "measured_at_inlet"
            ? truth.inletKpa + normal(rng) * 2 * KPA_PER_PSI
            : inletSource === "read_at_regulator"
              ? regulatorKpa
              : Math.min(regulatorKpa, truth.inletKpa + normal(rng) * 6 * KPA_PER_PSI),
        ),
        1,
      );

      const corrosionIdx = Math.min(4, Math.floor(rng() * (shop.trade === "automotive" ? 4 : 5)));
      const heavy = HEAVY.includes(vehicleClass);
      const seizedPenalty = job.seized ? 0.35 * corrosionIdx : 0.1 * corrosionIdx;
      const sizeGain = breakaway ? 1.8 * Math.log(power) : 0.6 * Math.log(power);
      const pressureGain = 1.0 * ((truth.inletKpa - 620) / 100);
      const vehiclePenalty = heavy && breakaway ? 0.4 : 0;
      const pFree = logistic(
        job.difficulty + sizeGain + pressureGain - seizedPenalty - vehiclePenalty + 0.3 * normal(rng),
      );
      const u = rng();
      const outcome: Outcome = u < pFree ? "freed" : u < pFree + (1 - pFree) * 0.35 ? "freed_with_help" : "not_freed";

      const speed = Math.exp(-0.5 * Math.log(power) - 0.25 * ((truth.inletKpa - 620) / 100));
      const giveUp = outcome === "not_freed" ? 2.5 : outcome === "freed_with_help" ? 1.6 : 1;
      const timeS = Math.min(
        28800,
        Math.max(2, Math.round(job.medianS * speed * giveUp * Math.exp(0.75 * normal(rng)))),
      );
      const attempts = Math.min(50, 1 + Math.floor(-Math.log(1 - rng()) * (outcome === "freed" ? 0.8 : 2.2)));

      const flags: string[] = plausibilityFlags({ inletKpa, regulatorKpa, maxInletKpa: maxKpa });
      const s = rng();
      const status: ReportStatus =
        s < 0.86 ? "accepted" : s < 0.92 ? "submitted" : s < 0.95 ? "returned" : s < 0.985 ? "rejected" : "withdrawn";

      out.push({
        modelIndex: mi,
        jobIndex: ji,
        reporterIndex,
        status,
        vehicleClass,
        componentAgeYears: roundStep(1 + rng() * (heavy ? 25 : 18), 0.5),
        corrosion: CORROSION[corrosionIdx]!,
        attachment: pick(rng, ATTACHMENTS[model.category]!),
        attachmentLengthMm: roundStep(model.category === "air-hammer" ? 120 + rng() * 180 : 40 + rng() * 160, 5),
        regulatorKpa,
        inletKpa,
        inletSource,
        hoseIdMm: fixed(line.hoseIdMm, 2),
        hoseLengthM: fixed(line.hoseLengthM, 2),
        couplerProfile,
        couplerCount,
        compressorLps: fixed(shop.air.compressorLps * (0.9 + 0.2 * rng()), 2),
        tankL: fixed(shop.air.tankL, 1),
        outcome,
        timeS,
        attempts,
        triggerControl: Math.max(1, Math.min(5, Math.round(4.2 - 0.6 * Math.log(power) * 2 + normal(rng) * 0.7))),
        notes: rng() < 0.45 ? pick(rng, NOTES) : null,
        flags,
        submittedAt: new Date(START + Math.floor(rng() * SPAN_MS)),
        world: { regulatorSetKpa, inletKpa: truth.inletKpa, demandLps: truth.demandLps },
      });
    }
  }
  return out;
}
