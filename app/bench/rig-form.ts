// The rig registration and calibration forms: one schema each, shared by the server (authoritative)
// and the browser. Capacities and calibration loads are typed in the reader's unit and leave in SI.
import { z } from "zod";
import type { Units } from "../domain";
import { plainText } from "../utils/text";
import { isOwnCertificateUpload } from "./certificate";
import { benchUnit, type RigKind } from "./terms";

/** A force rig reads a load cell; a torque fixture, a torque transducer (the table insists on the pair). */
export const SENSOR_FOR_KIND = { percussive_force: "load_cell", impact_torque: "torque_transducer" } as const;
/** The tool category a rig of each kind measures, and so the category of its check standard. */
export const CATEGORY_FOR_KIND = { percussive_force: "air-hammer", impact_torque: "impact-wrench" } as const;

export const quantityOfKind = (kind: RigKind) => (kind === "percussive_force" ? "peak_force_n" : "peak_torque_nm");

/** The unit a rig of this kind is typed in, for this reader, and the factor from SI. */
export const rigUnit = (kind: RigKind, units: Units) => benchUnit(quantityOfKind(kind), units);

/** The table's limits, stated once for the form. */
export const RIG_LIMITS = {
  capacityMaxSi: 2_000_000,
  sampleRateHz: [100, 100_000],
  intervalMonths: [1, 36],
} as const;

const positive = (message: string) =>
  z
    .string()
    .trim()
    .regex(/^\d+(\.\d+)?$/, message)
    .transform(Number)
    .refine((n) => n > 0, message);

export function rigSchema(units: Units) {
  return z
    .object({
      name: plainText().trim().min(2, "Name the rig (2 to 120 characters)").max(120, "At most 120 characters"),
      kind: z.enum(["percussive_force", "impact_torque"], { error: "Choose what the rig measures" }),
      capacity: positive("The sensor's capacity, as a positive number"),
      sampleRateHz: positive("The sample rate in Hz, as a number").refine(
        (n) => n >= RIG_LIMITS.sampleRateHz[0] && n <= RIG_LIMITS.sampleRateHz[1],
        "From 100 to 100,000 Hz",
      ),
      fixture: plainText()
        .trim()
        .min(3, "Describe the anvil or fixture (3 to 500 characters)")
        .max(500, "At most 500 characters"),
      checkToolModelId: z
        .string()
        .regex(/^([1-9]\d{0,9})?$/, "Choose the check-standard tool from the list")
        .transform((s) => (s === "" ? null : Number(s))),
      checkIntervalMonths: z
        .string()
        .trim()
        .regex(/^\d{1,2}$/, "A whole number of months, 1 to 36")
        .transform(Number)
        .refine((n) => n >= 1 && n <= 36, "A whole number of months, 1 to 36"),
    })
    .transform((v, ctx) => {
      const capacitySi = v.capacity / rigUnit(v.kind, units).perSi;
      if (capacitySi > RIG_LIMITS.capacityMaxSi) {
        const max = Math.floor(RIG_LIMITS.capacityMaxSi * rigUnit(v.kind, units).perSi);
        ctx.addIssue({
          code: "custom",
          path: ["capacity"],
          message: `At most ${max.toLocaleString("en-US")} ${rigUnit(v.kind, units).label}`,
        });
        return z.NEVER;
      }
      return { ...v, capacitySi, sensorKind: SENSOR_FOR_KIND[v.kind] };
    });
}

export type RigInput = z.output<ReturnType<typeof rigSchema>>;

export const CALIBRATION_ROWS = { min: 3, max: 200 } as const;

export interface CalibrationRowsResult {
  points: { reference: number; reading: number }[];
  errors: string[];
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Pasted calibration rows, "reference, reading" a line (comma, semicolon, tab or spaces between),
 * in the typed unit. A first line without numbers is a header and skipped; blank lines are skipped.
 * Each problem names its line; the row count is checked once the lines read.
 */
export function parseCalibrationRows(text: string): CalibrationRowsResult {
  const errors: string[] = [];
  const points: { reference: number; reading: number }[] = [];
  const seen = new Map<number, number>();
  const lines = text.replace(/\r\n?/g, "\n").split("\n");
  if (lines.length > CALIBRATION_ROWS.max + 50) {
    return { points: [], errors: [`At most ${CALIBRATION_ROWS.max} rows; this has ${lines.length} lines`] };
  }
  for (const [i, raw] of lines.entries()) {
    const line = i + 1;
    const trimmed = raw.trim();
    if (trimmed === "") continue;
    const cells = trimmed.split(/\s*[,;\t]\s*|\s+/);
    if (points.length === 0 && errors.length === 0 && !cells.some((c) => NUMBER.test(c))) continue; // a header
    if (cells.length !== 2) {
      errors.push(`Line ${line}: two values are needed (reference, reading); found ${cells.length}`);
      continue;
    }
    const [ref, reading] = cells.map((c) => (NUMBER.test(c) ? Number(c) : NaN)) as [number, number];
    if (!Number.isFinite(ref) || !Number.isFinite(reading)) {
      const bad = !Number.isFinite(ref) ? cells[0]! : cells[1]!;
      errors.push(`Line ${line}: "${bad.slice(0, 20)}" is not a number`);
      continue;
    }
    if (ref < 0 || reading < 0) {
      errors.push(`Line ${line}: loads and readings cannot be negative`);
      continue;
    }
    const first = seen.get(ref);
    if (first !== undefined) {
      errors.push(`Line ${line}: the reference ${cells[0]} is already on line ${first}; give each reference once`);
      continue;
    }
    seen.set(ref, line);
    points.push({ reference: ref, reading });
  }
  if (errors.length === 0 && points.length < CALIBRATION_ROWS.min)
    errors.push(`At least ${CALIBRATION_ROWS.min} rows are needed; found ${points.length}`);
  if (errors.length === 0 && points.length > CALIBRATION_ROWS.max)
    errors.push(`At most ${CALIBRATION_ROWS.max} rows; found ${points.length}`);
  return { points, errors };
}

/**
 * The calibration form's schema: the rows (in the reader's unit), the day, not in the future, and
 * the key of the certificate the user uploaded (optional; only one of their own uploads).
 */
export function calibrationSchema(perSi: number, userId: number, today = new Date().toISOString().slice(0, 10)) {
  return z.object({
    points: z
      .string({ error: "Paste the reference loads and the rig's readings" })
      .max(20_000, "Too many characters: at most 200 rows")
      .transform((text, ctx) => {
        const { points, errors } = parseCalibrationRows(text);
        if (errors.length) {
          for (const message of errors.slice(0, 10)) ctx.addIssue({ code: "custom", message });
          return z.NEVER;
        }
        return points.map((p) => ({ reference: p.reference / perSi, reading: p.reading / perSi }));
      }),
    calibratedOn: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}$/, "The day of the calibration, as YYYY-MM-DD")
      .refine((s) => {
        const d = new Date(`${s}T00:00:00Z`);
        return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
      }, "Not a real day")
      .refine((s) => s <= today, "The calibration cannot be in the future")
      .refine((s) => s >= "1990-01-01", "A day from 1990 on"),
    certificate: z
      .string({ error: "Attach one certificate file" })
      .max(200, "This certificate is not one of your uploads; choose the file again")
      .optional()
      .transform((k) => k?.trim() || null)
      .refine(
        (k) => k == null || isOwnCertificateUpload(userId, k),
        "This certificate is not one of your uploads; choose the file again",
      ),
  });
}
