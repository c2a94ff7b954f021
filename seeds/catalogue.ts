// The demo catalogue: invented makers and tool models. None of these is a real brand or product.
import type { BitRetainer, Fitting, SpecSource } from "../db/schema";

export const makers = [
  { slug: "brackwater", name: "Brackwater Pneumatics", country: "Invented" },
  { slug: "quillon", name: "Quillon Air Tools", country: "Invented" },
  { slug: "marrowpike", name: "Marrowpike Industrial", country: "Invented" },
  { slug: "tessaly", name: "Tessaly Tool Works", country: "Invented" },
  { slug: "orrin", name: "Orrin & Daughters", country: "Invented" },
  { slug: "halvard", name: "Halvard Pneumatic", country: "Invented" },
] as const;

export const categories = [
  {
    slug: "air-hammer",
    name: "Air hammer",
    action: "percussive" as const,
    description: "Percussive hammers taking round-shank bits: forks, punches, chisels and cutters.",
  },
  {
    slug: "impact-wrench",
    name: "Impact wrench",
    action: "rotary" as const,
    description: "Rotary impact wrenches with a square drive, for breaking fasteners loose.",
  },
  {
    slug: "air-ratchet",
    name: "Air ratchet",
    action: "rotary" as const,
    description: "Ratchet wrenches for running fasteners in tight places once they are broken loose.",
  },
];

type CategorySlug = (typeof categories)[number]["slug"];

export const jobTypes: {
  slug: string;
  category: CategorySlug;
  name: string;
  description: string;
  seized: boolean;
  /** Demo only: how hard the job is (logit offset) and its typical time in seconds. */
  difficulty: number;
  medianS: number;
  popularity: number;
}[] = [
  {
    slug: "ball-joint-separation",
    category: "air-hammer",
    name: "Ball joint separation",
    description: "Breaking a tapered ball-joint stud out of its knuckle or control arm.",
    seized: true,
    difficulty: 0.6,
    medianS: 45,
    popularity: 1.0,
  },
  {
    slug: "tie-rod-end-release",
    category: "air-hammer",
    name: "Tie rod end release",
    description: "Shocking a tie rod end taper loose from the steering arm.",
    seized: true,
    difficulty: 1.0,
    medianS: 25,
    popularity: 0.8,
  },
  {
    slug: "seized-bolt-punch-out",
    category: "air-hammer",
    name: "Seized bolt punch-out",
    description: "Driving a seized through-bolt out of a bushing sleeve or bracket.",
    seized: true,
    difficulty: -0.2,
    medianS: 90,
    popularity: 0.7,
  },
  {
    slug: "exhaust-joint-split",
    category: "air-hammer",
    name: "Exhaust joint split",
    description: "Splitting a rusted slip joint or clamp seam on an exhaust.",
    seized: true,
    difficulty: 0.4,
    medianS: 60,
    popularity: 0.6,
  },
  {
    slug: "rivet-shear",
    category: "air-hammer",
    name: "Rivet shear",
    description: "Cutting the heads off chassis or brake-lining rivets.",
    seized: false,
    difficulty: 0.9,
    medianS: 20,
    popularity: 0.35,
  },
  {
    slug: "bushing-press-out",
    category: "air-hammer",
    name: "Bushing press-out",
    description: "Driving a rubber or steel bushing out of its bore.",
    seized: true,
    difficulty: -0.4,
    medianS: 150,
    popularity: 0.45,
  },
  {
    slug: "king-pin-drive-out",
    category: "air-hammer",
    name: "King pin drive-out",
    description: "Driving a seized steer-axle king pin out of its knuckle (heavy truck).",
    seized: true,
    difficulty: -1.0,
    medianS: 600,
    popularity: 0.3,
  },
  {
    slug: "lug-nut-breakaway",
    category: "impact-wrench",
    name: "Lug nut breakaway",
    description: "Breaking wheel nuts loose.",
    seized: false,
    difficulty: 1.6,
    medianS: 6,
    popularity: 1.0,
  },
  {
    slug: "axle-nut-breakaway",
    category: "impact-wrench",
    name: "Axle nut breakaway",
    description: "Breaking a staked or rusted drive-axle nut loose.",
    seized: true,
    difficulty: 0.2,
    medianS: 20,
    popularity: 0.8,
  },
  {
    slug: "crank-bolt-breakaway",
    category: "impact-wrench",
    name: "Crank bolt breakaway",
    description: "Breaking a crankshaft pulley bolt loose without holding the crank.",
    seized: true,
    difficulty: 0.0,
    medianS: 15,
    popularity: 0.5,
  },
  {
    slug: "control-arm-bolt-breakaway",
    category: "impact-wrench",
    name: "Control arm bolt breakaway",
    description: "Breaking loose a rusted suspension pivot bolt.",
    seized: true,
    difficulty: 0.3,
    medianS: 30,
    popularity: 0.55,
  },
  {
    slug: "manifold-nut-removal",
    category: "air-ratchet",
    name: "Manifold nut removal",
    description: "Running exhaust manifold nuts off their studs after breakaway.",
    seized: true,
    difficulty: 0.5,
    medianS: 40,
    popularity: 0.6,
  },
  {
    slug: "caliper-bracket-bolt-removal",
    category: "air-ratchet",
    name: "Caliper bracket bolt removal",
    description: "Running caliper bracket bolts out once cracked loose.",
    seized: false,
    difficulty: 1.3,
    medianS: 12,
    popularity: 0.7,
  },
  {
    slug: "water-pump-bolt-run-out",
    category: "air-ratchet",
    name: "Water pump bolt run-out",
    description: "Running water pump bolts out in a tight engine bay.",
    seized: false,
    difficulty: 1.1,
    medianS: 18,
    popularity: 0.4,
  },
];

export interface ModelSeed {
  maker: (typeof makers)[number]["slug"];
  category: CategorySlug;
  code: string;
  name: string;
  fitting: Fitting;
  boreMm?: number;
  strokeMm?: number;
  bpm?: number;
  rpm?: number;
  torqueNm?: number;
  weightKg: number;
  lengthMm: number;
  priceUsd: number;
  inlet: string;
  ratedLps: number;
  maxInletKpa?: number;
  measured?: string[];
  /** Demo only: how popular the model is among reporters (relative). */
  popularity: number;
}

const NPT14 = "1/4 in NPT";
const NPT38 = "3/8 in NPT";

export const models: ModelSeed[] = [
  // 0.401 in shank hammers
  {
    maker: "brackwater",
    category: "air-hammer",
    code: "BH-150",
    name: "Short-barrel hammer",
    fitting: "shank-0.401",
    boreMm: 19,
    strokeMm: 41,
    bpm: 4500,
    weightKg: 1.05,
    lengthMm: 165,
    priceUsd: 49,
    inlet: NPT14,
    ratedLps: 1.9,
    popularity: 1.0,
  },
  {
    maker: "brackwater",
    category: "air-hammer",
    code: "BH-260L",
    name: "Long-barrel hammer",
    fitting: "shank-0.401",
    boreMm: 19,
    strokeMm: 67,
    bpm: 3500,
    weightKg: 1.2,
    lengthMm: 245,
    priceUsd: 79,
    inlet: NPT14,
    ratedLps: 2.1,
    popularity: 0.9,
  },
  {
    maker: "quillon",
    category: "air-hammer",
    code: "QH-3",
    name: "Q3 hammer",
    fitting: "shank-0.401",
    boreMm: 19,
    strokeMm: 76,
    bpm: 3000,
    weightKg: 1.3,
    lengthMm: 260,
    priceUsd: 135,
    inlet: NPT14,
    ratedLps: 2.2,
    measured: ["weight_kg"],
    popularity: 0.7,
  },
  {
    maker: "tessaly",
    category: "air-hammer",
    code: "T-401V",
    name: "Vibration-damped hammer",
    fitting: "shank-0.401",
    boreMm: 19,
    strokeMm: 89,
    bpm: 2800,
    weightKg: 1.55,
    lengthMm: 285,
    priceUsd: 219,
    inlet: NPT14,
    ratedLps: 2.4,
    popularity: 0.5,
  },
  {
    maker: "orrin",
    category: "air-hammer",
    code: "OD-12",
    name: "Pocket hammer",
    fitting: "shank-0.401",
    boreMm: 16,
    strokeMm: 35,
    bpm: 5000,
    weightKg: 0.85,
    lengthMm: 150,
    priceUsd: 39,
    inlet: NPT14,
    ratedLps: 1.6,
    popularity: 0.6,
  },
  {
    maker: "halvard",
    category: "air-hammer",
    code: "HP-40X",
    name: "Extended-stroke hammer",
    fitting: "shank-0.401",
    boreMm: 19,
    strokeMm: 100,
    bpm: 2500,
    weightKg: 1.6,
    lengthMm: 300,
    priceUsd: 169,
    inlet: NPT14,
    ratedLps: 2.5,
    popularity: 0.45,
  },
  // 0.498 in shank hammers
  {
    maker: "marrowpike",
    category: "air-hammer",
    code: "MP-498",
    name: "Heavy hammer",
    fitting: "shank-0.498",
    boreMm: 25,
    strokeMm: 76,
    bpm: 2400,
    weightKg: 2.3,
    lengthMm: 290,
    priceUsd: 189,
    inlet: NPT14,
    ratedLps: 3.3,
    maxInletKpa: 758.4,
    popularity: 0.75,
  },
  {
    maker: "quillon",
    category: "air-hammer",
    code: "QH-9H",
    name: "Q9 heavy hammer",
    fitting: "shank-0.498",
    boreMm: 27,
    strokeMm: 89,
    bpm: 2100,
    weightKg: 2.7,
    lengthMm: 320,
    priceUsd: 279,
    inlet: NPT38,
    ratedLps: 3.8,
    maxInletKpa: 758.4,
    measured: ["weight_kg", "length_mm"],
    popularity: 0.55,
  },
  {
    maker: "tessaly",
    category: "air-hammer",
    code: "T-498S",
    name: "Spring-retainer heavy hammer",
    fitting: "shank-0.498",
    boreMm: 25,
    strokeMm: 102,
    bpm: 1900,
    weightKg: 2.9,
    lengthMm: 335,
    priceUsd: 245,
    inlet: NPT38,
    ratedLps: 4.0,
    maxInletKpa: 758.4,
    popularity: 0.35,
  },
  {
    maker: "halvard",
    category: "air-hammer",
    code: "HP-50",
    name: "Frame hammer",
    fitting: "shank-0.498",
    boreMm: 29,
    strokeMm: 114,
    bpm: 1600,
    weightKg: 3.4,
    lengthMm: 360,
    priceUsd: 329,
    inlet: NPT38,
    ratedLps: 4.7,
    maxInletKpa: 758.4,
    popularity: 0.3,
  },
  {
    maker: "orrin",
    category: "air-hammer",
    code: "OD-55",
    name: "Shop heavy hammer",
    fitting: "shank-0.498",
    boreMm: 25,
    strokeMm: 64,
    bpm: 2600,
    weightKg: 2.1,
    lengthMm: 270,
    priceUsd: 119,
    inlet: NPT14,
    ratedLps: 3.1,
    maxInletKpa: 758.4,
    popularity: 0.5,
  },
  // 1/2 in impact wrenches
  {
    maker: "brackwater",
    category: "impact-wrench",
    code: "BW-12T",
    name: "Twin-hammer impact",
    fitting: "drive-1/2",
    rpm: 8000,
    torqueNm: 880,
    weightKg: 2.2,
    lengthMm: 190,
    priceUsd: 89,
    inlet: NPT14,
    ratedLps: 2.4,
    popularity: 1.0,
  },
  {
    maker: "quillon",
    category: "impact-wrench",
    code: "QI-1200",
    name: "Q1200 compact impact",
    fitting: "drive-1/2",
    rpm: 9500,
    torqueNm: 1200,
    weightKg: 1.6,
    lengthMm: 165,
    priceUsd: 199,
    inlet: NPT14,
    ratedLps: 2.8,
    popularity: 0.85,
  },
  {
    maker: "orrin",
    category: "impact-wrench",
    code: "OD-I5",
    name: "Stubby impact",
    fitting: "drive-1/2",
    rpm: 10000,
    torqueNm: 650,
    weightKg: 1.3,
    lengthMm: 120,
    priceUsd: 129,
    inlet: NPT14,
    ratedLps: 2.1,
    popularity: 0.5,
  },
  {
    maker: "marrowpike",
    category: "impact-wrench",
    code: "MP-I1600",
    name: "High-output impact",
    fitting: "drive-1/2",
    rpm: 8500,
    torqueNm: 1600,
    weightKg: 2.0,
    lengthMm: 185,
    priceUsd: 259,
    inlet: NPT14,
    ratedLps: 3.1,
    popularity: 0.7,
  },
  {
    maker: "halvard",
    category: "impact-wrench",
    code: "HI-900",
    name: "Pistol-grip impact",
    fitting: "drive-1/2",
    rpm: 7500,
    torqueNm: 950,
    weightKg: 2.4,
    lengthMm: 200,
    priceUsd: 109,
    inlet: NPT14,
    ratedLps: 2.6,
    popularity: 0.45,
  },
  // 3/4 in impact wrenches
  {
    maker: "marrowpike",
    category: "impact-wrench",
    code: "MP-I34",
    name: "3/4 in fleet impact",
    fitting: "drive-3/4",
    rpm: 5500,
    torqueNm: 1900,
    weightKg: 4.2,
    lengthMm: 230,
    priceUsd: 349,
    inlet: NPT38,
    ratedLps: 4.5,
    maxInletKpa: 758.4,
    popularity: 0.6,
  },
  {
    maker: "tessaly",
    category: "impact-wrench",
    code: "T-750",
    name: "3/4 in short impact",
    fitting: "drive-3/4",
    rpm: 6200,
    torqueNm: 1650,
    weightKg: 3.4,
    lengthMm: 205,
    priceUsd: 289,
    inlet: NPT38,
    ratedLps: 4.1,
    maxInletKpa: 758.4,
    popularity: 0.4,
  },
  {
    maker: "brackwater",
    category: "impact-wrench",
    code: "BW-34H",
    name: "3/4 in heavy impact",
    fitting: "drive-3/4",
    rpm: 5000,
    torqueNm: 2400,
    weightKg: 5.1,
    lengthMm: 255,
    priceUsd: 229,
    inlet: NPT38,
    ratedLps: 5.2,
    maxInletKpa: 758.4,
    popularity: 0.45,
  },
  {
    maker: "halvard",
    category: "impact-wrench",
    code: "HI-2700",
    name: "3/4 in D-handle impact",
    fitting: "drive-3/4",
    rpm: 4800,
    torqueNm: 2700,
    weightKg: 5.6,
    lengthMm: 270,
    priceUsd: 419,
    inlet: NPT38,
    ratedLps: 5.6,
    maxInletKpa: 758.4,
    popularity: 0.3,
  },
  // 3/8 in ratchets
  {
    maker: "quillon",
    category: "air-ratchet",
    code: "QR-38",
    name: "Q38 ratchet",
    fitting: "drive-3/8",
    rpm: 200,
    torqueNm: 75,
    weightKg: 1.0,
    lengthMm: 270,
    priceUsd: 79,
    inlet: NPT14,
    ratedLps: 1.7,
    popularity: 0.9,
  },
  {
    maker: "orrin",
    category: "air-ratchet",
    code: "OD-R2",
    name: "Long-neck ratchet",
    fitting: "drive-3/8",
    rpm: 170,
    torqueNm: 95,
    weightKg: 1.25,
    lengthMm: 330,
    priceUsd: 119,
    inlet: NPT14,
    ratedLps: 1.9,
    popularity: 0.6,
  },
  {
    maker: "tessaly",
    category: "air-ratchet",
    code: "T-R60",
    name: "Mini ratchet",
    fitting: "drive-1/4",
    rpm: 260,
    torqueNm: 40,
    weightKg: 0.7,
    lengthMm: 220,
    priceUsd: 59,
    inlet: NPT14,
    ratedLps: 1.4,
    popularity: 0.5,
  },
  {
    maker: "brackwater",
    category: "air-ratchet",
    code: "BR-100",
    name: "High-torque ratchet",
    fitting: "drive-3/8",
    rpm: 160,
    torqueNm: 110,
    weightKg: 1.3,
    lengthMm: 300,
    priceUsd: 99,
    inlet: NPT14,
    ratedLps: 2.0,
    popularity: 0.55,
  },
  {
    maker: "halvard",
    category: "air-ratchet",
    code: "HR-12",
    name: "1/2 in ratchet",
    fitting: "drive-1/2",
    rpm: 150,
    torqueNm: 135,
    weightKg: 1.5,
    lengthMm: 340,
    priceUsd: 139,
    inlet: NPT14,
    ratedLps: 2.1,
    popularity: 0.3,
  },
];

/**
 * Demo only: each model's air use while running (hammering, impacting) in the demo world, and what
 * the catalogue says of it — the maker's sheet, a measurement, or the average times a stated factor.
 * The world's tools draw 2–3× their average while hammering or impacting (issue 17, from memory),
 * ratchets 1.3–1.8×.
 */
export const runningAir = models.map((m, i) => {
  const spread = (i * 0.37) % 1;
  const ratchet = m.category === "air-ratchet";
  const trueLps = Math.round(m.ratedLps * (ratchet ? 1.3 + 0.5 * spread : 2 + spread) * 100) / 100;
  const source = i % 4 === 0 ? ("maker_sheet" as const) : i % 5 === 0 ? ("measured" as const) : ("estimated" as const);
  const factor = ratchet ? 1.5 : 2.5;
  const lps =
    source === "maker_sheet"
      ? Math.round(trueLps * 10) / 10
      : source === "measured"
        ? Math.round(trueLps * (0.95 + 0.1 * ((i * 0.61) % 1)) * 100) / 100
        : Math.round(m.ratedLps * factor * 100) / 100;
  return { trueLps, catalogue: { lps, source, factor: source === "estimated" ? factor : null } };
});

const round1 = (x: number) => Math.round(x * 10) / 10;
const between = (lo: number, hi: number, t: number) => lo + (hi - lo) * Math.min(1, Math.max(0, t));

/**
 * Demo only: each model's declared exposure figures, invented but plausible for its class ("common
 * practice" ranges from memory, not any real tool's sheet): air hammers a_hv 8–20 m/s² (K 1.5–4) under
 * ISO 28927-10 and L_pA 95–105 dB; impact wrenches a_hv 3–10 m/s² (K 1–2.5) under ISO 28927-2 and L_pA
 * 90–100 dB, more with the drive size; ratchets a_hv 2.5–5 m/s² and L_pA 82–90 dB. L_WA is L_pA plus
 * 10–12 dB, K 3 dB. The hose whip adds 0.2–0.4 kg. Most come from the maker's sheet; a few were measured
 * by a shop or estimated (an estimate names no test part and no K). Deterministic: no random draws.
 */
export const declaredExposure = models.map((m, i) => {
  const spread = (i * 0.618) % 1;
  const drive = { "drive-1/4": 0, "drive-3/8": 0.15, "drive-1/2": 0.4, "drive-3/4": 0.7, "drive-1": 1 } as const;
  let ahv: number, k: number, part: number, lpa: number, retainer: BitRetainer;
  if (m.category === "air-hammer") {
    const size = ((m.strokeMm ?? 50) - 40) / 60 + (m.fitting === "shank-0.498" ? 0.3 : 0);
    ahv = round1(between(8, 20, 0.5 * size + 0.5 * spread));
    k = round1(between(1.5, 4, ahv / 20));
    part = 10;
    lpa = Math.round(between(95, 105, 0.5 * size + 0.5 * ((i * 0.37) % 1)));
    retainer = i % 3 === 0 ? "quick_change" : i % 7 === 5 ? "none" : "beehive_spring";
  } else if (m.category === "impact-wrench") {
    const size = m.fitting in drive ? drive[m.fitting as keyof typeof drive] : 0.5;
    ahv = round1(between(3, 10, 0.7 * size + 0.3 * spread));
    k = round1(between(1, 2.5, ahv / 10));
    part = 2;
    lpa = Math.round(between(90, 100, 0.6 * size + 0.4 * ((i * 0.37) % 1)));
    retainer = m.fitting === "drive-1" || m.fitting === "drive-3/4" ? "detent_pin" : "friction_ring";
  } else {
    ahv = round1(between(2.5, 5, spread));
    k = 1.5;
    part = 2;
    lpa = Math.round(between(82, 90, (i * 0.37) % 1));
    retainer = "detent_pin";
  }
  const vibrationSource: SpecSource = i % 9 === 4 ? "estimated" : i % 7 === 3 ? "measured" : "maker_sheet";
  const noiseSource: SpecSource = i % 8 === 5 ? "measured" : "maker_sheet";
  return {
    vibration_ahv_ms2: ahv,
    vibration_k_ms2: vibrationSource === "estimated" ? null : k,
    vibration_iso28927_part: vibrationSource === "estimated" ? null : part,
    vibration_source: vibrationSource,
    sound_pressure_db: lpa,
    sound_pressure_k_db: 3,
    sound_pressure_source: noiseSource,
    // A shop's meter gives L_pA at the ear; sound power needs a test room, so only the sheet gives it.
    sound_power_db: noiseSource === "maker_sheet" ? lpa + 10 + (i % 3) : null,
    sound_power_k_db: noiseSource === "maker_sheet" ? 3 : null,
    sound_power_source: noiseSource === "maker_sheet" ? ("maker_sheet" as const) : null,
    bit_retainer: retainer,
    weight_with_whip_kg: Math.round((m.weightKg + between(0.2, 0.4, (i * 0.29) % 1)) * 100) / 100,
    weight_with_whip_source: i % 3 === 1 ? ("measured" as const) : ("maker_sheet" as const),
  };
});
