// The trade's vocabulary lives once (app/domain); the feed publishes what the forms enforce. These
// checks work from behaviour: the published JSON Schema's bounds against what the report form
// accepts and refuses, so a change on either side alone fails here.
import { describe, expect, it } from "vitest";
import { CALCULATOR_DEFAULTS, calculatorSchema } from "~/air/calculator-form";
import { supplySchema } from "~/air/supply-form";
import {
  barToKpa,
  CORROSION_LEVELS,
  COUPLER_PROFILES,
  formatPressure,
  ftToM,
  galToL,
  inToMm,
  INLET_SOURCES,
  KG_PER_LB,
  isSlug,
  OUTCOMES,
  parseMeasure,
  psiToKpa,
  RANGES,
  rangeMessage,
  rangeShort,
  scfmToLps,
  toolName,
  VEHICLE_CLASSES,
} from "~/domain";
import { REPORT_FIELDS } from "~/feed/fields";
import { jsonSchema } from "~/feed/schemas";
import { reportFields, reportSchema, toColumns } from "~/reports/form-schema";
import { roundDecimals, STORED_DECIMALS } from "~/domain";

type Json = {
  minimum?: number;
  exclusiveMinimum?: number;
  maximum?: number;
  enum?: unknown[];
  pattern?: string;
  type: unknown;
};
const published = jsonSchema("report", "https://bayproof.test").properties as Record<string, Json>;

/** A whole, valid report in SI units (lu=mm, pu=kPa), so each field can be moved alone. */
const base: Record<string, string> = {
  pu: "kPa",
  lu: "mm",
  toolModel: "brackwater-bh-150",
  jobType: "ball-joint-separation",
  vehicleClass: "light_truck",
  componentAge: "9",
  corrosion: "heavy",
  attachmentLength: "150",
  regulator: "2000",
  inlet: "600",
  inletSource: "measured_at_inlet",
  hoseId: "9.5",
  hoseLength: "15",
  couplerProfile: "industrial_m",
  couplerCount: "2",
  compressor: "5",
  tank: "200",
  outcome: "freed",
  time: "45",
  attempts: "1",
  triggerControl: "4",
};

/** The feed's field → the report form's field, in SI (the form's metric entry is SI). */
const FORM_FIELD: Record<string, string> = {
  component_age_years: "componentAge",
  attachment_length_mm: "attachmentLength",
  regulator_kpa: "regulator",
  inlet_kpa: "inlet",
  hose_id_mm: "hoseId",
  hose_length_m: "hoseLength",
  coupler_count: "couplerCount",
  compressor_lps: "compressor",
  tank_l: "tank",
  time_to_result_s: "time",
  attempts: "attempts",
  trigger_control: "triggerControl",
};

const accepts = (field: string, value: number) => {
  const values = { ...base, [field]: String(value), ...(field === "regulator" ? { inlet: "0" } : {}) };
  const r = reportSchema.safeParse(values);
  return r.success || !r.error.issues.some((i) => i.path[0] === field);
};

describe("the feed's published report constraints", () => {
  it("are the report form's, bound by bound", () => {
    for (const [name, field] of Object.entries(FORM_FIELD)) {
      const s = published[name]!;
      const integer = JSON.stringify(s.type).includes("integer");
      const step = integer ? 1 : 1e-6;
      expect(s.maximum, name).toBeDefined();
      expect(accepts(field, s.maximum!), `${name} at its maximum`).toBe(true);
      expect(accepts(field, s.maximum! + step), `${name} above its maximum`).toBe(false);
      if (s.exclusiveMinimum !== undefined) {
        expect(accepts(field, s.exclusiveMinimum), `${name} at its exclusive minimum`).toBe(false);
        expect(accepts(field, s.exclusiveMinimum + step), `${name} just above it`).toBe(true);
      } else {
        expect(s.minimum, name).toBeDefined();
        expect(accepts(field, s.minimum!), `${name} at its minimum`).toBe(true);
        expect(accepts(field, s.minimum! - step), `${name} below its minimum`).toBe(false);
      }
    }
  });

  it("leave no bounded report field unchecked by the form", () => {
    const bounded = REPORT_FIELDS.filter((f) => f.maximum !== undefined).map((f) => f.name);
    expect(bounded.sort()).toEqual(Object.keys(FORM_FIELD).sort());
  });

  it("publish the form's choices as enums", () => {
    const choices = (name: string) => published[name]!.enum!.filter((v) => v !== null);
    expect(choices("vehicle_class")).toEqual(reportFields.vehicleClass.options);
    expect(choices("corrosion_level")).toEqual(reportFields.corrosion.options);
    expect(choices("inlet_source")).toEqual(reportFields.inletSource.options);
    expect(choices("coupler_profile")).toEqual(reportFields.couplerProfile.unwrap().options);
    expect(choices("outcome")).toEqual(reportFields.outcome.options);
    expect([VEHICLE_CLASSES, CORROSION_LEVELS, INLET_SOURCES, COUPLER_PROFILES, OUTCOMES].map((l) => l.length)).toEqual(
      [7, 5, 3, 5, 3],
    );
  });

  it("publish the slug pattern the forms and routes accept", () => {
    const pattern = new RegExp(published.model!.pattern!);
    for (const slug of [
      "brackwater-bh-150",
      "air-hammer",
      "a",
      "bh-150.2",
      "Air-hammer",
      "a--b",
      "-a",
      "a-",
      "drive-1/2",
    ]) {
      const form = reportFields.toolModel.safeParse(slug).success;
      expect([pattern.test(slug), isSlug(slug)], slug).toEqual([form, form]);
    }
  });
});

describe("ranges and their words", () => {
  // Each stated bound, back in SI, is within a rounding of the SI bound it explains.
  const toSi: Record<string, (x: number) => number> = {
    kPa: (x) => x,
    psi: psiToKpa,
    bar: barToKpa,
    mm: (x) => x,
    in: inToMm,
    m: (x) => x,
    ft: ftToM,
    "l/s": (x) => x,
    SCFM: scfmToLps,
    l: (x) => x,
    gal: galToL,
    kg: (x) => x,
    lb: (x) => x * KG_PER_LB,
    "m/s²": (x) => x,
    dB: (x) => x,
  };
  it("state each bound honestly in every unit they name (within 10 %, from the SI conversions)", () => {
    for (const [name, range] of Object.entries(RANGES)) {
      for (const [unit, [lo, hi]] of Object.entries(range.stated as Record<string, readonly [string, string]>)) {
        const si = (text: string) => toSi[unit]!(parseMeasure(text.replaceAll(",", "")));
        expect(si(hi), `${name} max in ${unit}`).toBeGreaterThan(range.max * 0.9);
        expect(si(hi), `${name} max in ${unit}`).toBeLessThan(range.max * 1.1);
        if (range.min === 0) expect(si(lo), `${name} min in ${unit}`).toBe(0);
        else expect(Math.abs(si(lo) - range.min) / range.min, `${name} min in ${unit}`).toBeLessThan(0.1);
      }
    }
  });

  it("give the same messages the forms always gave", () => {
    expect(rangeMessage(RANGES.hoseBore, "in")).toBe("Between 5/32 and 1 in");
    expect(rangeMessage(RANGES.hoseLength, "ft")).toBe("More than 0, at most 330 ft");
    expect(rangeMessage(RANGES.tankVolume, "l")).toBe("More than 0, at most 5,000 l");
    expect(rangeShort(RANGES.hoseBore, "in")).toBe("5/32–1 in");
    expect(rangeShort(RANGES.hoseLength, "ft")).toBe("up to 330 ft");
  });

  it("refuse the same hose in the calculator, the shopper's supply panel and the report form", () => {
    const longest = 100; // m, RANGES.hoseLength.max
    const feet = (m: number) => String(m / 0.3048);
    const calc = (m: number) => calculatorSchema.safeParse({ ...CALCULATOR_DEFAULTS.mm, hlen: String(m) }).success;
    const panel = (m: number) => supplySchema.safeParse({ reg: "100", hid: "3/8", hlen: feet(m) }).success;
    const report = (m: number) => accepts("hoseLength", m);
    expect([calc(longest), panel(longest), report(longest)]).toEqual([true, true, true]);
    expect([calc(longest + 0.01), panel(longest + 0.01), report(longest + 0.01)]).toEqual([false, false, false]);
    expect([calc(0), panel(0), report(0)]).toEqual([false, false, false]);
  });
});

describe("one way to name and show things", () => {
  it("names a tool by maker and model code", () => {
    expect(toolName("Brackwater Pneumatics", "BH-150")).toBe("Brackwater Pneumatics BH-150");
  });

  it("shows pressures by one rule: whole psi and kPa, bar to a tenth", () => {
    expect(formatPressure(620.5, "psi")).toBe("90 psi");
    expect(formatPressure(620.5, "kPa")).toBe("621 kPa");
    expect(formatPressure(620.5, "bar")).toBe("6.2 bar");
  });
});

describe("stored precision", () => {
  it("rounds on the decimal digits, half away from zero, and keeps trade fractions exact", () => {
    // 9.525 is 3/8 in in mm (1 in = 25.4 mm, NIST SP 811, exact); its binary value is 9.52499…, which toFixed(2) would round down.
    expect(roundDecimals(9.525, 2)).toBe(9.53);
    expect(roundDecimals(9.525, STORED_DECIMALS.hose_id_mm)).toBe(9.525);
    expect(roundDecimals(661.9000000000001, STORED_DECIMALS.regulator_kpa)).toBe(661.9);
    expect(roundDecimals(7.6000000000000005, STORED_DECIMALS.hose_length_m)).toBe(7.6);
    expect(roundDecimals(-1.25, 1)).toBe(-1.3);
  });

  it("a report form's SI columns carry no float noise", () => {
    const columns = toColumns({
      pu: "psi",
      lu: "in",
      regulator: 96,
      inlet: 92,
      hoseId: 0.375,
      hoseLength: 25,
      tank: 60,
    });
    expect(columns.regulator_kpa).toBe(661.9);
    expect(columns.inlet_kpa).toBe(634.3);
    expect(columns.hose_id_mm).toBe(9.525);
    expect(columns.hose_length_m).toBe(7.62);
    expect(columns.tank_l).toBe(227.1);
  });
});
