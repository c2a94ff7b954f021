// The shopper's supply on a job page ("Which tool, on your air?"): typed in psi, inches and feet,
// checked against the same SI limits as every other form, and read out in SI for the ranking.
import { z } from "zod";
import {
  COUPLER_PROFILES,
  DEFAULT_COUPLER_PROFILE,
  ftToM,
  inToMm,
  RANGES,
  parseMeasure,
  psiToKpa,
  rangeShort,
  SHANKS,
  inRange,
} from "~/domain";

const { couplerCount } = RANGES;
const couplers = `Couplers: ${couplerCount.min}–${couplerCount.max}`;

export const supplySchema = z
  .object({
    reg: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Regulator: a number of psi" })
        .refine(
          (psi) => inRange(RANGES.gaugePressure, psiToKpa(psi)),
          `Regulator: ${rangeShort(RANGES.gaugePressure, "psi")}`,
        ),
    ),
    hid: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Hose ID: inches, e.g. 3/8" })
        .refine((inches) => inRange(RANGES.hoseBore, inToMm(inches)), `Hose ID: ${rangeShort(RANGES.hoseBore, "in")}`),
    ),
    hlen: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Hose length: a number of feet" })
        .refine((ft) => inRange(RANGES.hoseLength, ftToM(ft)), `Hose length: ${rangeShort(RANGES.hoseLength, "ft")}`),
    ),
    cc: z.preprocess(
      (v) => (v === "" || v == null ? 2 : Number(v)),
      z.number({ error: couplers }).int(couplers).min(couplerCount.min, couplers).max(couplerCount.max, couplers),
    ),
    cp: z.preprocess(
      (v) => (v === "" || v == null ? DEFAULT_COUPLER_PROFILE : v),
      z.enum(COUPLER_PROFILES, { error: "Couplers: pick a coupler style" }),
    ),
    bits: z.enum(["", ...SHANKS], { error: "Bits: 0.401 or 0.498 in shank" }).default(""),
  })
  .transform(({ reg, hid, hlen, cc, cp, bits }) => ({
    regulatorKpa: psiToKpa(reg),
    line: { hoseIdMm: inToMm(hid), hoseLengthM: ftToM(hlen), couplerProfile: cp, couplerCount: cc },
    bits: bits || null,
  }));

export type ShopperSupply = z.output<typeof supplySchema>;
