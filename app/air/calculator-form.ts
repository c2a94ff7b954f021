// The "What reaches my tool?" form: one zod schema for the server (GET form without JavaScript)
// and the browser (live results). Values arrive in the reader's units and leave in SI.
import { z } from "zod";
import type { CouplerProfile } from "./couplers";
import type { SupplyInput } from "./supply";
import { ftToM, galToL, inToMm, pressureToKpa, scfmToLps, type PressureUnit } from "./units";

export const COMMON_HOSE_IDS_IN = [0.25, 0.3125, 0.375, 0.5];

/** "3/8", "1 1/4", "0.375" or "9,5" → a number; anything else → NaN. */
export function parseMeasure(raw: unknown): number {
  if (typeof raw !== "string") return typeof raw === "number" ? raw : NaN;
  const s = raw.trim().replace(",", ".");
  if (s === "") return NaN;
  const mixed = s.match(/^(\d+)\s+(\d+)\/(\d+)$/);
  if (mixed) return Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  const frac = s.match(/^(\d+)\/(\d+)$/);
  if (frac) return Number(frac[1]) / Number(frac[2]);
  return /^-?\d*\.?\d+$/.test(s) ? Number(s) : NaN;
}

const measure = (message: string) => z.preprocess(parseMeasure, z.number({ error: message }).finite(message));

export const calculatorSchema = z
  .object({
    pu: z.enum(["psi", "bar", "kPa"]).default("psi"),
    lu: z.enum(["in", "mm"]).default("in"),
    supply: measure("Enter the regulator or tank pressure"),
    hid: measure("Enter the hose inside diameter, e.g. 3/8"),
    hlen: measure("Enter the hose length"),
    cp: z.enum(["industrial_m", "automotive_t", "high_flow_v", "iso_6150_b", "other"]).default("industrial_m"),
    cc: z.preprocess(parseMeasure, z.number({ error: "Enter how many couplers" }).int("Couplers come in whole numbers").min(0, "0 or more").max(10, "At most 10")),
    tool: z.string().max(80).default(""),
    cons: z.union([z.literal(""), measure("Enter the tool's air use")]).default(""),
    comp: measure("Enter the compressor's delivery"),
    tank: measure("Enter the tank size"),
    cout: measure("Enter the cut-out pressure"),
    cin: measure("Enter the cut-in pressure"),
  })
  .superRefine((v, ctx) => {
    const kpa = (x: number) => pressureToKpa(x, v.pu as PressureUnit);
    const metric = v.lu === "mm";
    const hoseMm = metric ? v.hid : inToMm(v.hid);
    const add = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (kpa(v.supply) <= 0 || kpa(v.supply) > 2000) add("supply", "Between 0 and 2,000 kPa (290 psi)");
    if (hoseMm < 4 || hoseMm > 25) add("hid", metric ? "Between 4 and 25 mm" : "Between 5/32 and 1 in");
    const lengthM = metric ? v.hlen : ftToM(v.hlen);
    if (lengthM <= 0 || lengthM > 100) add("hlen", metric ? "More than 0, at most 100 m" : "More than 0, at most 330 ft");
    const flow = (x: number) => (metric ? x : scfmToLps(x));
    if (!v.tool && v.cons === "") add("cons", "Pick a tool or type its air use");
    if (v.cons !== "" && (flow(v.cons) < 0.1 || flow(v.cons) > 50)) add("cons", metric ? "Between 0.1 and 50 l/s" : "Between 0.2 and 100 SCFM");
    if (flow(v.comp) < 0 || flow(v.comp) > 500) add("comp", metric ? "Between 0 and 500 l/s" : "Between 0 and 1,000 SCFM");
    const tankL = metric ? v.tank : galToL(v.tank);
    if (tankL < 1 || tankL > 5000) add("tank", metric ? "Between 1 and 5,000 l" : "Between 1 and 1,300 gal");
    if (kpa(v.cout) <= 0 || kpa(v.cout) > 2000) add("cout", "Between 0 and 2,000 kPa (290 psi)");
    if (v.cin < 0 || v.cin >= v.cout) add("cin", "Below the cut-out pressure");
  });

export type CalculatorValues = z.input<typeof calculatorSchema>;
export type CalculatorForm = z.output<typeof calculatorSchema>;

export const CALCULATOR_DEFAULTS: Record<"in" | "mm", Record<string, string>> = {
  in: { pu: "psi", lu: "in", supply: "100", hid: "3/8", hlen: "50", cp: "industrial_m", cc: "2", tool: "", cons: "4", comp: "10", tank: "60", cout: "150", cin: "120" },
  mm: { pu: "bar", lu: "mm", supply: "7", hid: "9.5", hlen: "15", cp: "industrial_m", cc: "2", tool: "", cons: "2", comp: "5", tank: "230", cout: "10", cin: "8" },
};

/** SI inputs for the supply analysis; `ratedLps` of the picked tool wins over a typed figure. */
export function toSupplyInput(f: CalculatorForm, toolRatedLps: number | null): SupplyInput {
  const metric = f.lu === "mm";
  const kpa = (x: number) => pressureToKpa(x, f.pu);
  const flow = (x: number) => (metric ? x : scfmToLps(x));
  return {
    supplyKpa: kpa(f.supply),
    ratedLps: toolRatedLps ?? flow(Number(f.cons)),
    line: {
      hoseIdMm: metric ? f.hid : inToMm(f.hid),
      hoseLengthM: metric ? f.hlen : ftToM(f.hlen),
      couplerProfile: f.cp as CouplerProfile,
      couplerCount: f.cc,
    },
    tank: { volumeL: metric ? f.tank : galToL(f.tank), cutOutKpa: kpa(f.cout), cutInKpa: kpa(f.cin), compressorLps: flow(f.comp) },
  };
}
