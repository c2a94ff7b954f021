// The shopper's air supply as the job page's "Which tool, on your air?" form sends it (imperial,
// as the trade in North America reads its gauges and hoses). Read what parses; say what did not.
import { z } from "zod";
import { parseMeasure } from "~/air/calculator-form";
import { COUPLER_PROFILES, type CouplerProfile } from "~/air/couplers";
import { ftToM, inToMm, psiToKpa } from "~/air/units";
import { DEFAULT_COUPLER_PROFILE, type Supply } from "./which-tool";

const profiles = Object.keys(COUPLER_PROFILES) as [CouplerProfile, ...CouplerProfile[]];

const supplySchema = z.object({
  reg: z.preprocess(parseMeasure, z.number({ error: "Regulator: a number of psi" }).min(10, "Regulator: 10–290 psi").max(290, "Regulator: 10–290 psi")),
  hid: z.preprocess(parseMeasure, z.number({ error: "Hose ID: inches, e.g. 3/8" }).min(0.16, "Hose ID: 5/32–1 in").max(1, "Hose ID: 5/32–1 in")),
  hlen: z.preprocess(parseMeasure, z.number({ error: "Hose length: a number of feet" }).gt(0, "Hose length: up to 330 ft").max(330, "Hose length: up to 330 ft")),
  cc: z.preprocess((v) => (v === "" || v == null ? 2 : Number(v)), z.number({ error: "Couplers: 0–10" }).int("Couplers: 0–10").min(0, "Couplers: 0–10").max(10, "Couplers: 0–10")),
  cp: z.preprocess((v) => (v === "" || v == null ? DEFAULT_COUPLER_PROFILE : v), z.enum(profiles, { error: "Couplers: pick a coupler style" })),
  bits: z.enum(["", "shank-0.401", "shank-0.498"], { error: "Bits: 0.401 or 0.498 in shank" }).default(""),
});

/** null when no supply was asked for; otherwise the supply in SI, or a note of what could not be read. */
export function readSupply(search: Record<string, string>): { supply: Supply | null; note: string | null } | null {
  if (search.reg === undefined) return null;
  const parsed = supplySchema.safeParse(search);
  if (!parsed.success) return { supply: null, note: `Could not use your supply: ${parsed.error.issues.map((i) => i.message).join("; ")}.` };
  const d = parsed.data;
  return {
    supply: {
      regulatorKpa: psiToKpa(d.reg),
      line: { hoseIdMm: inToMm(d.hid), hoseLengthM: ftToM(d.hlen), couplerProfile: d.cp, couplerCount: d.cc },
      bits: d.bits || null,
    },
    note: null,
  };
}
