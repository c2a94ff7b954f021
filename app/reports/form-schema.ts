// The report form: one zod schema for the server (authoritative) and the browser (conform).
// Values are typed in the reporter's units (named by the hidden `pu` and `lu` fields) and leave
// as the SI columns of the reports table.
import { z } from "zod";
import { parseMeasure } from "~/air/calculator-form";
import { ftToM, galToL, inToMm, kpaTo, lpsToScfm, lToGal, mmToIn, mToFt, pressureToKpa, scfmToLps } from "~/air/units";
import { GAUGE_ERROR_KPA } from "~/moderation/flags";
import { plainText } from "~/utils/text";
import type { Report } from "../../db/schema";

export const VEHICLE_CLASSES = ["passenger_car", "light_truck", "heavy_truck", "bus", "trailer", "agricultural", "construction"] as const;
export const CORROSION_LEVELS = ["none", "light", "moderate", "heavy", "severe"] as const;
export const INLET_SOURCES = ["measured_at_inlet", "read_at_regulator", "estimated"] as const;
export const COUPLER_PROFILE_CODES = ["industrial_m", "automotive_t", "high_flow_v", "iso_6150_b", "other"] as const;
export const OUTCOMES = ["freed", "freed_with_help", "not_freed"] as const;

/** "45", "45 s", "3 min", "1:30", "1:02:00", "2 h" → seconds; anything else → NaN. */
export function parseDuration(raw: unknown): number {
  if (typeof raw === "number") return raw;
  if (typeof raw !== "string") return NaN;
  const s = raw.trim().toLowerCase().replace(",", ".");
  const clock = s.match(/^(?:(\d+):)?(\d{1,2}):(\d{2})$/);
  if (clock) return Number(clock[1] ?? 0) * 3600 + Number(clock[2]) * 60 + Number(clock[3]);
  const unit = s.match(/^(\d*\.?\d+)\s*(s|sec|secs|seconds?|m|min|mins|minutes?|h|hr|hrs|hours?)?$/);
  if (!unit) return NaN;
  const n = Number(unit[1]);
  const u = unit[2] ?? "s";
  return u.startsWith("h") ? n * 3600 : u.startsWith("m") ? n * 60 : n;
}

const measure = (required: string) => z.preprocess((v) => (v === undefined || v === "" ? undefined : parseMeasure(v)), z.number({ error: required }).finite(required));
const optionalMeasure = (message: string) => measure(message).optional();
const slug = (message: string) => z.string({ error: message }).regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, message).max(80);
const int = (message: string, min: number, max: number) =>
  z.preprocess((v) => (v === undefined || v === "" ? undefined : Number(v)), z.number({ error: message }).int(message).min(min, `At least ${min}`).max(max, `At most ${max}`));

/** Each field alone, so a draft can keep whatever is valid so far. */
export const reportFields = {
  pu: z.enum(["psi", "bar", "kPa"]).default("psi"),
  lu: z.enum(["in", "mm"]).default("in"),
  toolModel: slug("Pick the tool from the suggestions"),
  jobType: slug("Pick the job"),
  vehicleClass: z.enum(VEHICLE_CLASSES, { error: "Pick the vehicle class" }),
  componentAge: int("Age in whole years", 0, 80).optional(),
  corrosion: z.enum(CORROSION_LEVELS, { error: "Pick how corroded it was" }),
  attachment: plainText().trim().max(120, "At most 120 characters").optional(),
  attachmentLength: optionalMeasure("Enter the bit or socket length as a number"),
  regulator: measure("Enter the regulator reading"),
  inlet: measure("Enter the pressure at the tool inlet"),
  inletSource: z.enum(INLET_SOURCES, { error: "Say how you got the inlet pressure" }),
  hoseId: measure("Enter the hose inside diameter, e.g. 3/8"),
  hoseLength: measure("Enter the hose length"),
  couplerProfile: z.enum(COUPLER_PROFILE_CODES).optional(),
  couplerCount: int("Couplers come in whole numbers", 0, 10),
  compressor: optionalMeasure("Enter the compressor's delivery as a number"),
  tank: optionalMeasure("Enter the tank size as a number"),
  outcome: z.enum(OUTCOMES, { error: "Say how it ended" }),
  time: z.preprocess((v) => (v === undefined || v === "" ? undefined : parseDuration(v)),
    z.number({ error: "Enter the time, e.g. 45 s, 3 min or 1:30" }).finite("Enter the time, e.g. 45 s, 3 min or 1:30")
      .min(1, "At least 1 second").max(28800, "At most 8 hours")),
  attempts: int("Attempts in whole numbers", 1, 50),
  triggerControl: int("Rate 1 to 5", 1, 5).optional(),
  notes: plainText().max(4000, "At most 4,000 characters")
    .refine((t) => !/<\s*[a-z!/]/i.test(t), "Notes are plain text: leave out <tags>")
    .optional(),
};

type Fields = { [K in keyof typeof reportFields]: z.output<(typeof reportFields)[K]> };

/** SI checks that depend on the units chosen, with messages in the reporter's units. */
function checkRanges(v: Partial<Fields>, add: (path: keyof Fields, message: string) => void) {
  const pu = v.pu ?? "psi";
  const metric = v.lu === "mm";
  const kpa = (x: number) => pressureToKpa(x, pu);
  if (v.regulator != null && (kpa(v.regulator) < 0 || kpa(v.regulator) > 2000)) add("regulator", "Between 0 and 2,000 kPa (290 psi)");
  if (v.inlet != null && (kpa(v.inlet) < 0 || kpa(v.inlet) > 2000)) add("inlet", "Between 0 and 2,000 kPa (290 psi)");
  if (v.inlet != null && v.regulator != null && kpa(v.inlet) > kpa(v.regulator) + GAUGE_ERROR_KPA) {
    add("inlet", "Higher than the regulator by more than gauge error: check both readings");
  }
  if (v.hoseId != null) {
    const mm = metric ? v.hoseId : inToMm(v.hoseId);
    if (mm < 4 || mm > 25) add("hoseId", metric ? "Between 4 and 25 mm" : "Between 5/32 and 1 in");
  }
  if (v.hoseLength != null) {
    const m = metric ? v.hoseLength : ftToM(v.hoseLength);
    if (m <= 0 || m > 100) add("hoseLength", metric ? "More than 0, at most 100 m" : "More than 0, at most 330 ft");
  }
  if (v.attachmentLength != null) {
    const mm = metric ? v.attachmentLength : inToMm(v.attachmentLength);
    if (mm <= 0 || mm > 1000) add("attachmentLength", metric ? "More than 0, at most 1,000 mm" : "More than 0, at most 39 in");
  }
  if (v.compressor != null) {
    const lps = metric ? v.compressor : scfmToLps(v.compressor);
    if (lps <= 0 || lps > 500) add("compressor", metric ? "More than 0, at most 500 l/s" : "More than 0, at most 1,000 SCFM");
  }
  if (v.tank != null) {
    const l = metric ? v.tank : galToL(v.tank);
    if (l <= 0 || l > 5000) add("tank", metric ? "More than 0, at most 5,000 l" : "More than 0, at most 1,300 gal");
  }
}

export const reportSchema = z.object(reportFields).superRefine((v, ctx) =>
  checkRanges(v, (path, message) => ctx.addIssue({ code: "custom", path: [path], message })),
);

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
export type ReportColumns = Pick<Report,
  | "vehicle_class" | "component_age_years" | "corrosion_level" | "attachment" | "attachment_length_mm" | "regulator_kpa"
  | "inlet_kpa" | "inlet_source" | "hose_id_mm" | "hose_length_m" | "coupler_profile" | "coupler_count" | "compressor_lps"
  | "tank_l" | "outcome" | "time_to_result_s" | "attempts" | "trigger_control" | "notes">;

/** The form's values (typed units) as the SI columns; missing values become null. */
export function toColumns(v: Partial<Fields>): ReportColumns {
  const metric = v.lu === "mm";
  const pu = v.pu ?? "psi";
  const kpa = (x: number | undefined) => (x == null ? null : pressureToKpa(x, pu));
  const len = (x: number | undefined, imperial: (n: number) => number) => (x == null ? null : metric ? x : imperial(x));
  return {
    vehicle_class: v.vehicleClass ?? null,
    component_age_years: v.componentAge ?? null,
    corrosion_level: v.corrosion ?? null,
    attachment: v.attachment || null,
    attachment_length_mm: len(v.attachmentLength, inToMm),
    regulator_kpa: kpa(v.regulator),
    inlet_kpa: kpa(v.inlet),
    inlet_source: v.inletSource ?? null,
    hose_id_mm: len(v.hoseId, inToMm),
    hose_length_m: len(v.hoseLength, ftToM),
    coupler_profile: v.couplerProfile ?? null,
    coupler_count: v.couplerCount ?? null,
    compressor_lps: len(v.compressor, scfmToLps),
    tank_l: len(v.tank, galToL),
    outcome: v.outcome ?? null,
    time_to_result_s: v.time == null ? null : Math.round(v.time),
    attempts: v.attempts ?? null,
    trigger_control: v.triggerControl ?? null,
    notes: v.notes?.trim() || null,
  };
}

const round = (x: number, digits: number) => String(Number(x.toFixed(digits)));

/** A stored report's columns back as form values in the reporter's units, for editing. */
export function toFormValues(r: Partial<ReportColumns>, pu: "psi" | "bar" | "kPa", lu: "in" | "mm"): Record<string, string> {
  const metric = lu === "mm";
  const p = (kpa: number | null | undefined) => (kpa == null ? "" : round(kpaTo(kpa, pu), pu === "bar" ? 2 : 1));
  const l = (x: number | null | undefined, toImperial: (si: number) => number, digits: number) => (x == null ? "" : round(metric ? x : toImperial(x), digits));
  const s = (x: string | number | null | undefined) => (x == null ? "" : String(x));
  return {
    pu, lu,
    vehicleClass: s(r.vehicle_class), componentAge: s(r.component_age_years), corrosion: s(r.corrosion_level),
    attachment: s(r.attachment), attachmentLength: l(r.attachment_length_mm, mmToIn, metric ? 0 : 2),
    regulator: p(r.regulator_kpa), inlet: p(r.inlet_kpa), inletSource: s(r.inlet_source),
    hoseId: l(r.hose_id_mm, mmToIn, metric ? 1 : 4), hoseLength: l(r.hose_length_m, mToFt, metric ? 1 : 0),
    couplerProfile: s(r.coupler_profile), couplerCount: s(r.coupler_count),
    compressor: l(r.compressor_lps, lpsToScfm, 1), tank: l(r.tank_l, lToGal, 0),
    outcome: s(r.outcome), time: s(r.time_to_result_s), attempts: s(r.attempts), triggerControl: s(r.trigger_control), notes: s(r.notes),
  };
}
