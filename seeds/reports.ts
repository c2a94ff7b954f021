// Deterministic generator of the demo's reports. Invented data with believable structure:
// success rises with inlet pressure and with tool size on seized jobs, times are long-tailed,
// air supplies vary from shop to shop. The structure is for the demo only, not a finding.
import seedrandom from "seedrandom";
import { couplerPressureDropBar } from "../app/air/couplers";
import { airDemandLps } from "../app/air/demand";
import { hosePressureDropBar } from "../app/air/hose";
import { ATMOSPHERE_KPA, type CouplerProfile, inToMm, ftToM, psiToKpa } from "../app/domain";
import { plausibilityFlags } from "../app/moderation/flags";
import type { CorrosionLevel, InletSource, Outcome, ReportStatus, VehicleClass } from "../db/schema";
import { jobTypes, models, type ModelSeed } from "./catalogue";
import { people, shops } from "./people";

export type Rng = () => number;

export const makeRng = (seed: string): Rng => seedrandom(seed);

const pick = <T,>(rng: Rng, items: readonly T[]): T => items[Math.floor(rng() * items.length)]!;

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
const round = (x: number, step: number) => Math.round(x / step) * step;

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
}

/** How much work a tool can do relative to others in its category (demo only). */
function toolPower(m: ModelSeed): number {
  if (m.category === "air-hammer") return ((m.boreMm ?? 19) ** 2 * (m.strokeMm ?? 60)) / (19 ** 2 * 67);
  return (m.torqueNm ?? 800) / (m.category === "impact-wrench" ? 1200 : 80);
}

const VEHICLES: Record<string, VehicleClass[]> = {
  automotive: ["passenger_car", "passenger_car", "light_truck"],
  fleet: ["light_truck", "heavy_truck", "bus", "trailer"],
  heavy_equipment: ["heavy_truck", "construction", "agricultural", "trailer"],
};
const CORROSION: CorrosionLevel[] = ["none", "light", "moderate", "heavy", "severe"];
const ATTACHMENTS: Record<string, string[]> = {
  "air-hammer": ["pickle fork", "tapered punch", "blunt punch", "flat chisel", "panel cutter", "tie rod splitter"],
  "impact-wrench": ["impact socket", "deep impact socket", "extension and impact socket"],
  "air-ratchet": ["socket", "swivel socket", "extension and socket"],
};
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
    jobTypes.flatMap((j, ji) => (j.category === m.category ? [{ mi, ji, score: m.popularity * j.popularity * (0.6 + 0.8 * rng()) }] : [])),
  );
  pairs.sort((a, b) => b.score - a.score);
  return pairs.map((p, rank) => ({ ...p, count: Math.round(98 * Math.exp(-rank / 28)) + 2 + Math.floor(rng() * 4) }));
}

export function generateReports(seed = "bayproof-demo-v1"): GeneratedReport[] {
  const rng = makeRng(seed);
  const reporterWeights = people.map((p, i) => (p.roles.length ? 0.3 : 1 / (1 + i * 0.15)));
  const reporterIndexes = people.map((_, i) => i);
  const out: GeneratedReport[] = [];

  for (const { mi, ji, count } of pairCounts(rng)) {
    const model = models[mi]!;
    const job = jobTypes[ji]!;
    const power = toolPower(model);
    for (let k = 0; k < count; k++) {
      const reporterIndex = pickWeighted(rng, reporterIndexes, (i) => reporterWeights[i]!);
      const person = people[reporterIndex]!;
      const shop = shops[person.shopIndex]!;

      const regulatorKpa = round(psiToKpa(shop.air.regulatorPsi + round(normal(rng) * 6, 1)), 0.1);
      const hoseIdMm = round(inToMm(rng() < 0.75 ? shop.air.hoseIdIn : pick(rng, [0.25, 0.3125, 0.375, 0.5])), 0.01);
      const hoseLengthM = round(ftToM(rng() < 0.7 ? shop.air.hoseFt : pick(rng, [15, 25, 35, 50, 75])), 0.1);
      const couplerProfile = pick(rng, ["industrial_m", "industrial_m", "automotive_t", "high_flow_v", "iso_6150_b"] as const);
      const couplerCount = 1 + Math.floor(rng() * 3);
      const compressorLps = round(shop.air.compressorLps * (0.9 + 0.2 * rng()), 0.1);

      // The pressure that really reached the tool while it ran.
      const pAbsBar = (regulatorKpa + ATMOSPHERE_KPA) / 100;
      const demand = airDemandLps(model.ratedLps, regulatorKpa);
      const dropBar =
        hosePressureDropBar({ flowLps: demand, lengthM: hoseLengthM, insideDiameterMm: hoseIdMm, inletAbsBar: pAbsBar }) +
        couplerPressureDropBar(couplerProfile, couplerCount, demand, pAbsBar);
      const sagKpa = compressorLps < demand ? 60 + 120 * rng() : 0;
      const trueInletKpa = Math.max(150, regulatorKpa - dropBar * 100 - sagKpa);

      const inletSource = pickWeighted(rng, ["measured_at_inlet", "read_at_regulator", "estimated"] as const, (s) =>
        s === "measured_at_inlet" ? 0.35 : s === "read_at_regulator" ? 0.4 : 0.25,
      );
      const inletKpa = round(
        inletSource === "measured_at_inlet" ? trueInletKpa + normal(rng) * 5
          : inletSource === "read_at_regulator" ? regulatorKpa
            : trueInletKpa + normal(rng) * 25,
        0.1,
      );

      const corrosionIdx = Math.min(4, Math.floor(rng() * (shop.trade === "automotive" ? 4 : 5)));
      const seizedPenalty = job.seized ? 0.35 * corrosionIdx : 0.1 * corrosionIdx;
      const sizeGain = job.seized ? 1.6 * Math.log(power) : 0.6 * Math.log(power);
      const pressureGain = 0.9 * ((trueInletKpa - 620) / 100);
      const pFree = logistic(job.difficulty + sizeGain + pressureGain - seizedPenalty + 0.3 * normal(rng));
      const u = rng();
      const outcome: Outcome = u < pFree ? "freed" : u < pFree + (1 - pFree) * 0.35 ? "freed_with_help" : "not_freed";

      const speed = Math.exp(-0.5 * Math.log(power) - 0.25 * ((trueInletKpa - 620) / 100));
      const giveUp = outcome === "not_freed" ? 2.5 : outcome === "freed_with_help" ? 1.6 : 1;
      const timeS = Math.min(28800, Math.max(2, Math.round(job.medianS * speed * giveUp * Math.exp(0.75 * normal(rng)))));
      const attempts = Math.min(50, 1 + Math.floor(-Math.log(1 - rng()) * (outcome === "freed" ? 0.8 : 2.2)));

      const flags: string[] = plausibilityFlags({ inletKpa, regulatorKpa, maxInletKpa: model.maxInletKpa ?? 689.5 });
      const s = rng();
      const status: ReportStatus = s < 0.86 ? "accepted" : s < 0.92 ? "submitted" : s < 0.95 ? "returned" : s < 0.985 ? "rejected" : "withdrawn";

      out.push({
        modelIndex: mi, jobIndex: ji, reporterIndex, status,
        vehicleClass: pick(rng, VEHICLES[shop.trade]!),
        componentAgeYears: round(1 + rng() * (shop.trade === "automotive" ? 18 : 25), 0.5),
        corrosion: CORROSION[corrosionIdx]!,
        attachment: pick(rng, ATTACHMENTS[model.category]!),
        attachmentLengthMm: round(model.category === "air-hammer" ? 120 + rng() * 180 : 40 + rng() * 160, 5),
        regulatorKpa, inletKpa, inletSource, hoseIdMm, hoseLengthM, couplerProfile, couplerCount,
        compressorLps, tankL: shop.air.tankL,
        outcome, timeS, attempts,
        triggerControl: Math.max(1, Math.min(5, Math.round(4.2 - 0.6 * Math.log(power) * 2 + normal(rng) * 0.7))),
        notes: rng() < 0.45 ? pick(rng, NOTES) : null,
        flags,
        submittedAt: new Date(START + Math.floor(rng() * SPAN_MS)),
      });
    }
  }
  return out;
}
