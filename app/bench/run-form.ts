// The bench run form's one schema, built for a protocol's series and trials: shared by the server
// (authoritative) and the browser. Values are typed in the filer's units and leave here in SI.
import { z } from "zod";
import { pressureToKpa, type Units } from "../domain";
import { plainText } from "../utils/text";
import { benchUnit, type BenchQuantity } from "./terms";

export interface FormProtocol {
  quantity: BenchQuantity;
  trials_per_series: number;
  series: { position: number; label: string }[];
}

/** Field names, one place: a series' inlet pressures and a trial's typed peaks or uploaded trace. */
export const fieldName = {
  staticKpa: (p: number) => `s${p}_static`,
  runningKpa: (p: number) => `s${p}_running`,
  peaks: (p: number, t: number) => `s${p}_t${t}_peaks`,
  trace: (p: number, t: number) => `s${p}_t${t}_trace`,
};

/** The most blows typed for one trial. */
export const MAX_TYPED_BLOWS = 2000;
/** A trace's upload key as the upload route names it: under the filer's own folder. */
export const traceKeyPattern = (userId: number) => new RegExp(`^uploads/bench/${userId}/[A-Za-z0-9_-]{16,40}$`);

const number = (message: string) =>
  z
    .string()
    .trim()
    .min(1, message)
    .regex(/^-?\d+(\.\d+)?$/, message)
    .transform(Number);

/** Peaks typed as numbers separated by spaces, commas or new lines. */
function peaksField(max: number, unit: string) {
  return z
    .string()
    .max(40_000, "Too many characters for one trial")
    .transform((text, ctx) => {
      const parts = text.split(/[\s,;]+/).filter(Boolean);
      const values: number[] = [];
      for (const [i, part] of parts.entries()) {
        const n = /^\d+(\.\d+)?$/.test(part) ? Number(part) : NaN;
        if (!(n > 0)) {
          ctx.addIssue({ code: "custom", message: `Value ${i + 1} ("${part.slice(0, 20)}") is not a positive number` });
          return z.NEVER;
        }
        if (n > max) {
          ctx.addIssue({ code: "custom", message: `Value ${i + 1} (${part} ${unit}) is above the sensor's capacity` });
          return z.NEVER;
        }
        values.push(n);
      }
      if (values.length > MAX_TYPED_BLOWS) {
        ctx.addIssue({ code: "custom", message: `At most ${MAX_TYPED_BLOWS} blows per trial` });
        return z.NEVER;
      }
      return values;
    });
}

/**
 * The schema for one protocol version on one rig, in the filer's units. Every trial needs typed
 * peaks or an uploaded trace; a series' running inlet pressure may not exceed its standing one.
 */
export function benchRunSchema(protocol: FormProtocol, units: Units, capacitySi: number, userId: number) {
  const { label: unit, perSi } = benchUnit(protocol.quantity, units);
  const pressure = units.pressure;
  const toKpa = (v: number) => pressureToKpa(v, pressure);
  const shape: Record<string, z.ZodType> = {
    toolModelId: z
      .string()
      .regex(/^[1-9]\d{0,9}$/, "Choose the tool")
      .transform(Number),
    unitSerial: plainText().trim().min(1, "Give the unit's serial number").max(80, "At most 80 characters"),
    unitCondition: z.enum(["new", "used"], { error: "Say whether the unit is new or used" }),
    unitHours: z
      .string()
      .trim()
      .regex(/^(\d+(\.\d+)?)?$/, "Hours in use as a number, or leave empty")
      .transform((s) => (s === "" ? null : Number(s)))
      .refine((n) => n == null || n <= 100_000, "At most 100,000 hours"),
    runOn: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}$/, "The day of the run, as YYYY-MM-DD")
      .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), "Not a real day")
      .refine((s) => s <= new Date().toISOString().slice(0, 10), "The run cannot be in the future"),
    operator: plainText().trim().min(2, "Who ran the rig").max(120, "At most 120 characters"),
    ambientC: number("The room temperature in °C").refine((n) => n >= -30 && n <= 60, "From -30 to 60 °C"),
    notes: plainText().max(4000, "At most 4,000 characters").optional(),
  };
  const capacity = capacitySi * perSi;
  for (const s of protocol.series) {
    const kpa = number(`The pressure in ${pressure}`)
      .transform(toKpa)
      .refine((k) => k >= 0 && k <= 2000, `Out of range for a shop line`);
    shape[fieldName.staticKpa(s.position)] = kpa;
    shape[fieldName.runningKpa(s.position)] = kpa;
    for (let t = 1; t <= protocol.trials_per_series; t++) {
      shape[fieldName.peaks(s.position, t)] = peaksField(capacity, unit).optional();
      shape[fieldName.trace(s.position, t)] = z
        .string()
        .optional()
        .refine((k) => !k || traceKeyPattern(userId).test(k), "This trace upload is not one of yours; upload it again");
    }
  }
  return z
    .object(shape)
    .superRefine((v, ctx) => {
      for (const s of protocol.series) {
        const stat = v[fieldName.staticKpa(s.position)] as number;
        const run = v[fieldName.runningKpa(s.position)] as number;
        if (run > stat)
          ctx.addIssue({
            code: "custom",
            path: [fieldName.runningKpa(s.position)],
            message: "The running pressure cannot be above the standing pressure",
          });
        for (let t = 1; t <= protocol.trials_per_series; t++) {
          const peaks = v[fieldName.peaks(s.position, t)] as number[] | undefined;
          const trace = v[fieldName.trace(s.position, t)] as string | undefined;
          if ((!peaks || peaks.length === 0) && !trace)
            ctx.addIssue({
              code: "custom",
              path: [fieldName.peaks(s.position, t)],
              message: `Type the peak of each blow (${unit}) or upload this trial's trace`,
            });
        }
      }
    })
    .transform((v) => ({
      toolModelId: v.toolModelId as number,
      unitSerial: v.unitSerial as string,
      unitCondition: v.unitCondition as "new" | "used",
      unitHours: v.unitHours as number | null,
      runOn: v.runOn as string,
      operator: v.operator as string,
      ambientC: v.ambientC as number,
      notes: (v.notes as string | undefined) || null,
      series: protocol.series.map((s) => ({
        position: s.position,
        staticKpa: v[fieldName.staticKpa(s.position)] as number,
        runningKpa: v[fieldName.runningKpa(s.position)] as number,
        trials: Array.from({ length: protocol.trials_per_series }, (_, i) => {
          const t = i + 1;
          const trace = v[fieldName.trace(s.position, t)] as string | undefined;
          const peaks = (v[fieldName.peaks(s.position, t)] as number[] | undefined) ?? [];
          return { trial: t, traceKey: trace || null, peaksSi: peaks.map((p) => p / perSi) };
        }),
      })),
    }));
}

export type BenchRunInput = z.output<ReturnType<typeof benchRunSchema>>;
