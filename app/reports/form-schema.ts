// The report form: one zod schema for the server (authoritative) and the browser (conform).
// Values are typed in the reporter's units (named by the hidden `pu` and `lu` fields) and leave
// as the SI columns of the reports table.
import { z } from "zod";
import {
  CORROSION_LEVELS,
  COUPLER_PROFILES,
  INLET_SOURCES,
  LENGTH_UNITS,
  type Range,
  RANGES,
  OUTCOMES,
  parseDuration,
  parseMeasure,
  PRESSURE_RANGE_MESSAGE,
  PRESSURE_UNITS,
  pressureToKpa,
  kpaTo,
  type LengthUnit,
  type PressureUnit,
  rangeMessage,
  SYSTEM_UNITS,
  fromSi,
  toSi,
  VEHICLE_CLASSES,
  inRange,
  roundDecimals,
  STORED_DECIMALS,
} from "~/domain";
import { slugField } from "~/domain/slug-field";
import { GAUGE_ERROR_KPA } from "~/moderation/flags";
import { plainText } from "~/utils/text";
import type { Report } from "../../db/schema";

// An empty field says what is needed; a field typed wrong says how to type it.
const blank = (v: unknown) => v === undefined || (typeof v === "string" && v.trim() === "");
const needed = (required: string, wrong: string) => ({
  error: (issue: { input?: unknown }) => (issue.input === undefined ? required : wrong),
});
const measure = (required: string, wrong = required) =>
  z.preprocess((v) => (blank(v) ? undefined : parseMeasure(v)), z.number(needed(required, wrong)).finite(wrong));
const optionalMeasure = (wrong: string) => measure(wrong).optional();
const int = (wrong: string, { min, max }: Range, required = wrong) =>
  z.preprocess(
    (v) => (blank(v) ? undefined : Number(v)),
    z.number(needed(required, wrong)).int(wrong).min(min, `At least ${min}`).max(max, `At most ${max}`),
  );

const TIME_HINT = "Enter the time, e.g. 45 s, 3 min or 1:30";

/** Each field alone, so a draft can keep whatever is valid so far. */
export const reportFields = {
  pu: z.enum(PRESSURE_UNITS).default("psi"),
  lu: z.enum(LENGTH_UNITS).default("in"),
  toolModel: slugField("Pick the tool from the suggestions"),
  jobType: slugField("Pick the job"),
  vehicleClass: z.enum(VEHICLE_CLASSES, { error: "Pick the vehicle class" }),
  componentAge: int("Age in whole years", RANGES.componentAge).optional(),
  corrosion: z.enum(CORROSION_LEVELS, { error: "Pick how corroded it was" }),
  attachment: plainText().trim().max(120, "At most 120 characters").optional(),
  attachmentLength: optionalMeasure("Enter the bit or socket length as a number"),
  regulator: measure("Enter the regulator reading", "Enter the regulator reading as a number, e.g. 90"),
  inlet: measure("Enter the pressure at the tool inlet", "Enter the pressure at the tool inlet as a number, e.g. 85"),
  inletSource: z.enum(INLET_SOURCES, { error: "Say how you got the inlet pressure" }),
  hoseId: measure("Enter the hose inside diameter", "Enter the hose inside diameter as a number or fraction, e.g. 3/8"),
  hoseLength: measure("Enter the hose length", "Enter the hose length as a number"),
  couplerProfile: z.enum(COUPLER_PROFILES).optional(),
  couplerCount: int("Couplers come in whole numbers", RANGES.couplerCount, "Enter how many couplers, 0 if none"),
  compressor: optionalMeasure("Enter the compressor's delivery as a number"),
  tank: optionalMeasure("Enter the tank size as a number"),
  outcome: z.enum(OUTCOMES, { error: "Say how it ended" }),
  time: z.preprocess(
    (v) => (blank(v) ? undefined : parseDuration(v)),
    z
      .number(needed("Enter the time to result", TIME_HINT))
      .finite(TIME_HINT)
      .min(RANGES.timeToResult.min, "At least 1 second")
      .max(RANGES.timeToResult.max, "At most 8 hours"),
  ),
  attempts: int("Attempts in whole numbers", RANGES.attempts, "Enter how many attempts it took"),
  triggerControl: int("Rate 1 to 5", RANGES.triggerControl).optional(),
  notes: plainText()
    .max(4000, "At most 4,000 characters")
    .refine((t) => !/<\s*[a-z!/]/i.test(t), "Notes are plain text: leave out <tags>")
    .optional(),
};

type Fields = { [K in keyof typeof reportFields]: z.output<(typeof reportFields)[K]> };

/** The fields typed in a system's unit, with the limit each is checked against in SI. */
const MEASURED = {
  attachmentLength: { quantity: "length", limit: RANGES.attachmentLength },
  hoseId: { quantity: "bore", limit: RANGES.hoseBore },
  hoseLength: { quantity: "hose", limit: RANGES.hoseLength },
  compressor: { quantity: "flow", limit: RANGES.compressorDelivery },
  tank: { quantity: "volume", limit: RANGES.tankVolume },
} as const;

/** SI checks that depend on the units chosen, with messages in the reporter's units. */
function checkRanges(v: Partial<Fields>, add: (path: keyof Fields, message: string) => void) {
  const pu = v.pu ?? "psi";
  const lu = v.lu ?? "in";
  const kpa = (x: number) => pressureToKpa(x, pu);
  if (v.regulator != null && !inRange(RANGES.gaugePressure, kpa(v.regulator))) add("regulator", PRESSURE_RANGE_MESSAGE);
  if (v.inlet != null && !inRange(RANGES.gaugePressure, kpa(v.inlet))) add("inlet", PRESSURE_RANGE_MESSAGE);
  if (v.inlet != null && v.regulator != null && kpa(v.inlet) > kpa(v.regulator) + GAUGE_ERROR_KPA) {
    add("inlet", "Higher than the regulator by more than gauge error: check both readings");
  }
  for (const [key, { quantity, limit }] of Object.entries(MEASURED) as [
    keyof typeof MEASURED,
    (typeof MEASURED)[keyof typeof MEASURED],
  ][]) {
    const typed = v[key];
    if (typed != null && !inRange(limit, toSi(quantity, typed, lu)))
      add(key, rangeMessage(limit, SYSTEM_UNITS[lu][quantity]));
  }
}

export const reportSchema = z
  .object(reportFields)
  .superRefine((v, ctx) => checkRanges(v, (path, message) => ctx.addIssue({ code: "custom", path: [path], message })));

export type ReportForm = z.output<typeof reportSchema>;

/** A draft keeps every field that is valid on its own and in range; the rest stay in the browser. */
export function parseDraft(values: Record<string, unknown>): Partial<Fields> {
  const out: Partial<Record<keyof Fields, unknown>> = {};
  for (const key of Object.keys(reportFields) as (keyof Fields)[]) {
    const parsed = reportFields[key].safeParse(values[key] === "" ? undefined : values[key]);
    if (parsed.success && parsed.data !== undefined) out[key] = parsed.data;
  }
  const bad = new Set<keyof Fields>();
  checkRanges(out as Partial<Fields>, (path) => bad.add(path));
  for (const key of bad) delete out[key];
  return out as Partial<Fields>;
}

/** The SI columns a report form fills, typed from the table itself. */
export type ReportColumns = Pick<
  Report,
  | "vehicle_class"
  | "component_age_years"
  | "corrosion_level"
  | "attachment"
  | "attachment_length_mm"
  | "regulator_kpa"
  | "inlet_kpa"
  | "inlet_source"
  | "hose_id_mm"
  | "hose_length_m"
  | "coupler_profile"
  | "coupler_count"
  | "compressor_lps"
  | "tank_l"
  | "outcome"
  | "time_to_result_s"
  | "attempts"
  | "trigger_control"
  | "notes"
>;

/** The form's values (typed units) as the SI columns; missing values become null. */
export function toColumns(v: Partial<Fields>): ReportColumns {
  const lu = v.lu ?? "in";
  const pu = v.pu ?? "psi";
  const stored = (column: keyof typeof STORED_DECIMALS, x: number | null) =>
    x == null ? null : roundDecimals(x, STORED_DECIMALS[column]);
  const kpa = (x: number | undefined) => (x == null ? null : pressureToKpa(x, pu));
  const si = (key: keyof typeof MEASURED) => {
    const x = v[key];
    return x == null ? null : toSi(MEASURED[key].quantity, x, lu);
  };
  return {
    vehicle_class: v.vehicleClass ?? null,
    component_age_years: v.componentAge ?? null,
    corrosion_level: v.corrosion ?? null,
    attachment: v.attachment || null,
    attachment_length_mm: stored("attachment_length_mm", si("attachmentLength")),
    regulator_kpa: stored("regulator_kpa", kpa(v.regulator)),
    inlet_kpa: stored("inlet_kpa", kpa(v.inlet)),
    inlet_source: v.inletSource ?? null,
    hose_id_mm: stored("hose_id_mm", si("hoseId")),
    hose_length_m: stored("hose_length_m", si("hoseLength")),
    coupler_profile: v.couplerProfile ?? null,
    coupler_count: v.couplerCount ?? null,
    compressor_lps: stored("compressor_lps", si("compressor")),
    tank_l: stored("tank_l", si("tank")),
    outcome: v.outcome ?? null,
    time_to_result_s: v.time == null ? null : Math.round(v.time),
    attempts: v.attempts ?? null,
    trigger_control: v.triggerControl ?? null,
    notes: v.notes?.trim() || null,
  };
}

const round = (x: number, digits: number) => String(Number(x.toFixed(digits)));

/** A stored report's columns back as form values in the reporter's units, for editing. */
export function toFormValues(r: Partial<ReportColumns>, pu: PressureUnit, lu: LengthUnit): Record<string, string> {
  const metric = lu === "mm";
  const p = (kpa: number | null | undefined) => (kpa == null ? "" : round(kpaTo(kpa, pu), pu === "bar" ? 2 : 1));
  const l = (x: number | null | undefined, key: keyof typeof MEASURED, digits: number) =>
    x == null ? "" : round(fromSi(MEASURED[key].quantity, x, lu), digits);
  const s = (x: string | number | null | undefined) => (x == null ? "" : String(x));
  return {
    pu,
    lu,
    vehicleClass: s(r.vehicle_class),
    componentAge: s(r.component_age_years),
    corrosion: s(r.corrosion_level),
    attachment: s(r.attachment),
    attachmentLength: l(r.attachment_length_mm, "attachmentLength", metric ? 0 : 2),
    regulator: p(r.regulator_kpa),
    inlet: p(r.inlet_kpa),
    inletSource: s(r.inlet_source),
    hoseId: l(r.hose_id_mm, "hoseId", metric ? 1 : 4),
    hoseLength: l(r.hose_length_m, "hoseLength", metric ? 1 : 0),
    couplerProfile: s(r.coupler_profile),
    couplerCount: s(r.coupler_count),
    compressor: l(r.compressor_lps, "compressor", 1),
    tank: l(r.tank_l, "tank", 0),
    outcome: s(r.outcome),
    time: r.time_to_result_s == null ? "" : durationForForm(r.time_to_result_s),
    attempts: s(r.attempts),
    triggerControl: s(r.trigger_control),
    notes: s(r.notes),
  };
}

/**
 * A stored time as the reporter would type it, exactly (it parses back to the same seconds):
 * "40 s", "3 min", "1:10", "1:02:05".
 */
export function durationForForm(seconds: number): string {
  const s = Math.round(seconds);
  if (s < 90) return `${s} s`;
  if (s % 3600 === 0) return `${s / 3600} h`;
  if (s % 60 === 0) return `${s / 60} min`;
  const two = (n: number) => String(n).padStart(2, "0");
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  return h > 0 ? `${h}:${two(m)}:${two(s % 60)}` : `${m}:${two(s % 60)}`;
}
