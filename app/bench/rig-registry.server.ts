// Registering a rig, filing its calibrations and a moderator's verification of one. The fit is
// worked out here with fitCalibration, shown back before it is saved, and saved unverified.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { toolName } from "../domain";
import { tCritical } from "../stats";
import { MAX_CERTIFICATE_BYTES } from "../storage/certificate-types";
import { copyObject, deleteObject, isStorageOutage, objectSize, readHead } from "../storage/s3.server";
import { sniffCertificateType } from "../storage/sniff.server";
import { AppError } from "../utils/errors";
import { randomToken } from "../utils/tokens.server";
import { fitCalibration, QUADRATIC_SIGNIFICANCE, type CalibrationFit, type CalibrationPoint } from "./calibration";
import { CATEGORY_FOR_KIND, type RigInput } from "./rig-form";

/** Tools a rig may name as its check standard: hammers for a force rig, wrenches for a torque fixture. */
export async function checkToolChoices(db: Db) {
  const rows = await db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select(["m.id", "m.model_code", "mk.name as maker_name", "c.slug as category_slug"])
    .where("c.slug", "in", Object.values(CATEGORY_FOR_KIND))
    .orderBy("mk.name")
    .orderBy("m.model_code")
    .execute();
  return rows.map((r) => ({ id: r.id, name: toolName(r.maker_name, r.model_code), category: r.category_slug }));
}

/** Saves a new rig owned by the user; a check tool of the wrong kind is a field refusal. */
export async function registerRig(db: Db, ownerId: number, input: RigInput) {
  if (input.checkToolModelId != null) {
    const tool = await db
      .selectFrom("tool_models as m")
      .innerJoin("tool_categories as c", "c.id", "m.category_id")
      .select("c.slug")
      .where("m.id", "=", input.checkToolModelId)
      .executeTakeFirst();
    if (!tool) throw new AppError("Choose the check-standard tool from the list", 400, { field: "checkToolModelId" });
    if (tool.slug !== CATEGORY_FOR_KIND[input.kind])
      throw new AppError(
        input.kind === "percussive_force"
          ? "A force rig's check standard is an air hammer"
          : "A torque fixture's check standard is an impact wrench",
        400,
        { field: "checkToolModelId" },
      );
  }
  const { id } = await db
    .insertInto("rigs")
    .values({
      owner_id: ownerId,
      name: input.name,
      kind: input.kind,
      sensor_kind: input.sensorKind,
      sensor_capacity: input.capacitySi,
      sample_rate_hz: input.sampleRateHz,
      fixture: input.fixture,
      check_tool_model_id: input.checkToolModelId,
      check_interval_months: input.checkIntervalMonths,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return id;
}

/** The rig, for its owner only: someone else's is a 403, a missing one a 404. */
export async function rigForOwner(db: Db, userId: number, rigId: number) {
  const rig = await db
    .selectFrom("rigs")
    .select(["id", "owner_id", "name", "kind", "sensor_capacity"])
    .where("id", "=", rigId)
    .executeTakeFirst();
  if (!rig) throw new AppError("No such rig", 404);
  if (rig.owner_id !== userId) throw new AppError("Only the rig's owner files its calibrations", 403);
  return rig;
}

/** Why the fit is a line or a quadratic, in words, with the test behind it. */
export interface FitChoice {
  fit: CalibrationFit;
  quadraticT: number | null;
  critical: number | null;
  reason: string;
}

/** fitCalibration's own choice ("auto"), with the t test of the quadratic term that made it. */
export function explainFit(points: CalibrationPoint[]): FitChoice {
  const fit = fitCalibration(points, "auto");
  const distinct = new Set(points.map((p) => p.reference)).size;
  if (points.length < 4 || distinct < 3)
    return {
      fit,
      quadraticT: null,
      critical: null,
      reason: "A straight line: a quadratic is considered only from four reference loads.",
    };
  const quadratic = fit.degree === 2 ? fit : fitCalibration(points, 2);
  const t = quadratic.coefficients[2]! / quadratic.standardErrors[2]!;
  const critical = tCritical(1 - QUADRATIC_SIGNIFICANCE, points.length - 3);
  const test = `the squared term's t statistic is ${Math.abs(t).toFixed(2)} against ${critical.toFixed(2)}, its 1 % two-sided critical value with ${points.length - 3} degrees of freedom`;
  return {
    fit,
    quadraticT: t,
    critical,
    reason:
      fit.degree === 2
        ? `A quadratic: the straight line's residuals bend — ${test}.`
        : `A straight line: no significant curvature — ${test}.`,
  };
}

const refuseRows = (why: string) => new AppError(`These rows cannot be fitted: ${why}`, 400, { field: "points" });

/** Fits the points (SI); a set that gives no usable calibration is a field refusal, never a stored NaN. */
export function fitOrRefuse(points: CalibrationPoint[]) {
  if (new Set(points.map((p) => p.reading)).size < 2)
    throw refuseRows("every reading is the same, so the rig does not respond to the load");
  let choice: FitChoice;
  try {
    choice = explainFit(points);
  } catch (error) {
    if (error instanceof Error) throw refuseRows(error.message);
    throw error;
  }
  const { fit } = choice;
  if (![...fit.coefficients, fit.residualSD, fit.rSquared].every(Number.isFinite))
    throw refuseRows("the values are too large or too close together to fit in double precision");
  return choice;
}

const refuseCertificate = (message: string, status = 400) => new AppError(message, status, { field: "certificate" });

/** A storage call whose outage is a 503 on the certificate field, not a server error. */
const stored = <T>(work: Promise<T>) =>
  work.catch((error: unknown) => {
    throw isStorageOutage(error)
      ? refuseCertificate("The file store could not be reached; nothing was saved. Try again in a few minutes.", 503)
      : error;
  });

/**
 * Copies the owner's upload to the calibration's own key (no URL is ever signed for it, so what is
 * checked is what stays) and checks the copy: present, at most 10 MB, a PDF, PNG or JPEG by its
 * first bytes. A refused copy is removed; the refusal names the certificate field.
 */
async function copyCertificate(calibrationId: number, upload: string) {
  const size = await stored(objectSize(upload));
  if (size == null) throw refuseCertificate("This certificate has not arrived in storage; choose the file again");
  const key = `certificates/${calibrationId}/${randomToken(18)}`;
  await stored(copyObject(upload, key));
  const refuse = async (message: string) => {
    await stored(Promise.all([deleteObject(key), deleteObject(upload)]));
    return refuseCertificate(message);
  };
  const copied = (await stored(objectSize(key))) ?? 0;
  if (copied > MAX_CERTIFICATE_BYTES)
    throw await refuse(`A certificate may be at most ${MAX_CERTIFICATE_BYTES / 1024 / 1024} MB`);
  const type = copied > 0 ? await sniffCertificateType(await stored(readHead(key))) : null;
  if (!type)
    throw await refuse(
      "This file is not a PDF, PNG or JPEG, whatever its name says; attach the certificate as one of those",
    );
  return key;
}

/**
 * Saves a calibration, unverified. With a certificate upload, the row and the checked copy are
 * written together: a refused certificate saves nothing.
 */
export async function saveCalibration(
  db: Db,
  rigId: number,
  args: { calibratedOn: string; points: CalibrationPoint[]; fit: CalibrationFit; certificateUpload?: string | null },
) {
  const id = await db.transaction().execute(async (trx) => {
    const calibrationId = await insertCalibration(trx, rigId, args);
    if (args.certificateUpload) {
      const key = await copyCertificate(calibrationId, args.certificateUpload);
      await trx.updateTable("rig_calibrations").set({ certificate_key: key }).where("id", "=", calibrationId).execute();
    }
    return calibrationId;
  });
  // Nothing reads the upload again; if this delete fails the object is only clutter.
  if (args.certificateUpload) await deleteObject(args.certificateUpload).catch(() => {});
  return id;
}

async function insertCalibration(
  db: Db,
  rigId: number,
  args: { calibratedOn: string; points: CalibrationPoint[]; fit: CalibrationFit },
) {
  const { id } = await db
    .insertInto("rig_calibrations")
    .values({
      rig_id: rigId,
      calibrated_on: args.calibratedOn,
      points: JSON.stringify(args.points),
      degree: args.fit.degree,
      coefficients: args.fit.coefficients,
      residual_sd: args.fit.residualSD,
      r_squared: Math.min(1, Math.max(0, args.fit.rSquared)),
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return id;
}

/**
 * The stored certificate of a calibration on this rig, for the rig's owner and moderators only:
 * anyone else, like a calibration without one, gets null (the route answers 404 either way).
 */
export async function certificateFor(
  db: Db,
  viewer: { id: number; moderator: boolean } | null,
  rigId: number,
  calibrationId: number,
) {
  if (!viewer) return null;
  const row = await db
    .selectFrom("rig_calibrations as c")
    .innerJoin("rigs as r", "r.id", "c.rig_id")
    .select(["c.certificate_key", "r.owner_id"])
    .where("c.id", "=", calibrationId)
    .where("c.rig_id", "=", rigId)
    .executeTakeFirst();
  if (!row?.certificate_key || (row.owner_id !== viewer.id && !viewer.moderator)) return null;
  return row.certificate_key;
}

/** Calibrations waiting for a moderator, oldest first; a moderator's own rigs are left out. */
export async function unverifiedCalibrations(db: Db, moderatorId: number, rigId?: number) {
  let q = db
    .selectFrom("rig_calibrations as c")
    .innerJoin("rigs as r", "r.id", "c.rig_id")
    .innerJoin("users as u", "u.id", "r.owner_id")
    .select([
      "c.id",
      "c.rig_id",
      "r.name as rig_name",
      "u.handle as owner_handle",
      "c.degree",
      "c.residual_sd",
      "c.created_at",
      sql<string>`to_char(c.calibrated_on, 'YYYY-MM-DD')`.as("calibrated_on"),
    ])
    .where("c.verified_at", "is", null)
    .where("r.owner_id", "!=", moderatorId)
    .orderBy("c.created_at")
    .orderBy("c.id")
    .limit(50);
  if (rigId != null) q = q.where("c.rig_id", "=", rigId);
  return q.execute();
}

export type PendingCalibration = Awaited<ReturnType<typeof unverifiedCalibrations>>[number];

/**
 * A moderator verifies a calibration: once only, never on their own rig. The row keeps who and
 * when (verified_by, verified_at), and a verified calibration is never changed again.
 */
export async function verifyCalibration(db: Db, calibrationId: number, rigId: number, moderatorId: number) {
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .selectFrom("rig_calibrations as c")
      .innerJoin("rigs as r", "r.id", "c.rig_id")
      .select(["c.id", "c.verified_at", "r.owner_id"])
      .where("c.id", "=", calibrationId)
      .where("c.rig_id", "=", rigId)
      .forUpdate()
      .executeTakeFirst();
    if (!row) throw new AppError("No such calibration on this rig", 404);
    if (row.owner_id === moderatorId) throw new AppError("Nobody verifies the calibration of their own rig", 403);
    if (row.verified_at != null) throw new AppError("This calibration is already verified", 409);
    await trx
      .updateTable("rig_calibrations")
      .set({ verified_by: moderatorId, verified_at: new Date() })
      .where("id", "=", calibrationId)
      .execute();
  });
}
