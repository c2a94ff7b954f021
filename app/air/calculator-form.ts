// The "What reaches my tool?" form: one zod schema for the server (GET form without JavaScript)
// and the browser (live results). Values arrive in the reader's units and leave in SI.
import { z } from "zod";
import {
  COUPLER_PROFILES,
  DEFAULT_COUPLER_PROFILE,
  type LengthUnit,
  LENGTH_UNITS,
  RANGES,
  parseMeasure,
  PRESSURE_RANGE_MESSAGE,
  PRESSURE_UNITS,
  pressureToKpa,
  rangeMessage,
  SYSTEM_UNITS,
  toSi,
  inRange,
} from "~/domain";
import type { AirInput } from "./analysis";
import type { ToolAir } from "./line";

const measure = (message: string) => z.preprocess(parseMeasure, z.number({ error: message }).finite(message));
const { couplerCount } = RANGES;

export const calculatorSchema = z
  .object({
    pu: z.enum(PRESSURE_UNITS).default("psi"),
    lu: z.enum(LENGTH_UNITS).default("in"),
    supply: measure("Enter the regulator or tank pressure"),
    hid: measure("Enter the hose inside diameter, e.g. 3/8"),
    hlen: measure("Enter the hose length"),
    wid: z.union([z.literal(""), measure("Enter the whip's inside diameter, e.g. 1/4")]).default(""),
    wlen: z.union([z.literal(""), measure("Enter the whip's length, or leave it empty")]).default(""),
    cp: z.enum(COUPLER_PROFILES).default(DEFAULT_COUPLER_PROFILE),
    cc: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Enter how many couplers" })
        .int("Couplers come in whole numbers")
        .min(couplerCount.min, `${couplerCount.min} or more`)
        .max(couplerCount.max, `At most ${couplerCount.max}`),
    ),
    tool: z.string().max(80).default(""),
    cons: z.union([z.literal(""), measure("Enter the tool's air use")]).default(""),
    run: z.union([z.literal(""), measure("Enter its air use while running, or leave it empty")]).default(""),
    comp: measure("Enter the compressor's delivery"),
    tank: measure("Enter the tank size"),
    cout: measure("Enter the cut-out pressure"),
    cin: measure("Enter the cut-in pressure"),
  })
  .superRefine((v, ctx) => {
    const kpa = (x: number) => pressureToKpa(x, v.pu);
    const units = SYSTEM_UNITS[v.lu];
    const add = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (!inRange(RANGES.gaugePressure, kpa(v.supply))) add("supply", PRESSURE_RANGE_MESSAGE);
    if (!inRange(RANGES.hoseBore, toSi("bore", v.hid, v.lu))) add("hid", rangeMessage(RANGES.hoseBore, units.bore));
    if (!inRange(RANGES.hoseLength, toSi("hose", v.hlen, v.lu)))
      add("hlen", rangeMessage(RANGES.hoseLength, units.hose));
    if (v.wlen !== "" && v.wlen !== 0) {
      if (!inRange(RANGES.hoseLength, toSi("hose", v.wlen, v.lu)))
        add("wlen", rangeMessage(RANGES.hoseLength, units.hose));
      if (v.wid === "") add("wid", "Enter the whip's inside diameter, e.g. 1/4");
      else if (!inRange(RANGES.hoseBore, toSi("bore", v.wid, v.lu)))
        add("wid", rangeMessage(RANGES.hoseBore, units.bore));
    }
    if (!v.tool && v.cons === "") add("cons", "Pick a tool or type its air use");
    if (!v.tool && v.run !== "" && !inRange(RANGES.toolAirUse, toSi("flow", v.run, v.lu)))
      add("run", rangeMessage(RANGES.toolAirUse, units.flow));
    if (v.cons !== "" && !inRange(RANGES.toolAirUse, toSi("flow", v.cons, v.lu)))
      add("cons", rangeMessage(RANGES.toolAirUse, units.flow));
    // 0 is a tank on its own, with no compressor behind it.
    if (v.comp !== 0 && !inRange(RANGES.compressorDelivery, toSi("flow", v.comp, v.lu))) {
      add("comp", `Between 0 and ${RANGES.compressorDelivery.stated[units.flow][1]} ${units.flow}`);
    }
    if (!inRange(RANGES.tankVolume, toSi("volume", v.tank, v.lu)))
      add("tank", rangeMessage(RANGES.tankVolume, units.volume));
    if (!inRange(RANGES.gaugePressure, kpa(v.cout))) add("cout", PRESSURE_RANGE_MESSAGE);
    if (v.cin < 0 || v.cin >= v.cout) add("cin", "Below the cut-out pressure");
  });

export type CalculatorValues = z.input<typeof calculatorSchema>;
export type CalculatorForm = z.output<typeof calculatorSchema>;

export const CALCULATOR_DEFAULTS: Record<LengthUnit, Record<string, string>> = {
  in: {
    pu: "psi",
    lu: "in",
    supply: "100",
    hid: "3/8",
    hlen: "50",
    wid: "1/4",
    wlen: "",
    cp: DEFAULT_COUPLER_PROFILE,
    cc: "2",
    tool: "",
    cons: "4",
    run: "",
    comp: "10",
    tank: "60",
    cout: "150",
    cin: "120",
  },
  mm: {
    pu: "bar",
    lu: "mm",
    supply: "7",
    hid: "9.5",
    hlen: "15",
    wid: "6.35",
    wlen: "",
    cp: DEFAULT_COUPLER_PROFILE,
    cc: "2",
    tool: "",
    cons: "2",
    run: "",
    comp: "5",
    tank: "230",
    cout: "10",
    cin: "8",
  },
};

/** SI inputs for the air analysis; the picked catalogue tool's figures win over typed ones. */
export function toAirInput(f: CalculatorForm, catalogueTool: ToolAir | null): AirInput {
  const kpa = (x: number) => pressureToKpa(x, f.pu);
  const typed = (): ToolAir => {
    const ratedLps = toSi("flow", Number(f.cons), f.lu);
    // A typed running figure is the reader's own reading of a maker sheet or a gauge: counted as measured.
    return f.run === "" ? { ratedLps } : { ratedLps, runningLps: toSi("flow", f.run, f.lu), runningSource: "measured" };
  };
  const whip =
    f.wlen !== "" && f.wlen > 0 && f.wid !== ""
      ? { idMm: toSi("bore", f.wid, f.lu), lengthM: toSi("hose", f.wlen, f.lu) }
      : null;
  return {
    supplyKpa: kpa(f.supply),
    tool: catalogueTool ?? typed(),
    line: {
      hoseIdMm: toSi("bore", f.hid, f.lu),
      hoseLengthM: toSi("hose", f.hlen, f.lu),
      couplerProfile: f.cp,
      couplerCount: f.cc,
      whip,
    },
    tank: { volumeL: toSi("volume", f.tank, f.lu), cutOutKpa: kpa(f.cout), cutInKpa: kpa(f.cin) },
    compressorLps: toSi("flow", f.comp, f.lu),
  };
}
