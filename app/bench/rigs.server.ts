// Rig reads: the list with each rig's calibration standing, and one rig's calibration fit and
// check-standard chart. The figures come from the pure functions in ./index.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { toolName } from "../domain";
import { calibrationStatus, fitCalibration, individualsChart } from "./index";

/** A date column as its ISO day, read as text so no time zone moves it. */
const day = (column: string) => sql<string>`to_char(${sql.ref(column)}, 'YYYY-MM-DD')`;
const utcDay = (iso: string) => new Date(`${iso}T00:00:00Z`);

function rigsBase(db: Db) {
  return db
    .selectFrom("rigs as r")
    .innerJoin("users as u", "u.id", "r.owner_id")
    .leftJoin("shops as s", "s.id", "r.shop_id")
    .leftJoin("tool_models as cm", "cm.id", "r.check_tool_model_id")
    .leftJoin("makers as cmk", "cmk.id", "cm.maker_id")
    .select([
      "r.id",
      "r.name",
      "r.kind",
      "r.sensor_kind",
      "r.sensor_capacity",
      "r.sample_rate_hz",
      "r.fixture",
      "r.owner_id",
      "r.check_interval_months",
      "u.handle as owner_handle",
      "s.name as shop_name",
      "s.city as shop_city",
      "cm.model_code as check_model_code",
      "cmk.name as check_maker_name",
    ])
    .select((eb) => [
      eb
        .selectFrom("rig_calibrations as c")
        .whereRef("c.rig_id", "=", "r.id")
        .orderBy("c.calibrated_on", "desc")
        .orderBy("c.id", "desc")
        .limit(1)
        .select("c.id")
        .as("calibration_id"),
    ]);
}

export type RigStatus = "current" | "unverified" | "expired" | "uncalibrated";

export interface RigStanding {
  status: RigStatus;
  calibratedOn: string | null;
  verifiedAt: Date | null;
  expiresOn: Date | null;
  /** The latest check-standard session, and whether it fell outside the chart's limits. */
  lastCheckOn: string | null;
  lastCheckInControl: boolean | null;
}

interface CalibrationRow {
  calibrated_on: string;
  verified_at: Date | string | null;
}

function standingOf(
  calibration: CalibrationRow | undefined,
  maxAgeMonths: number,
  now: Date,
): Pick<RigStanding, "status" | "calibratedOn" | "verifiedAt" | "expiresOn"> {
  if (!calibration) return { status: "uncalibrated", calibratedOn: null, verifiedAt: null, expiresOn: null };
  const verifiedAt = calibration.verified_at == null ? null : new Date(calibration.verified_at);
  const standing = calibrationStatus({
    verifiedAt,
    calibratedOn: utcDay(calibration.calibrated_on),
    now,
    maxAgeMonths,
  });
  return {
    status: standing.status,
    calibratedOn: calibration.calibrated_on,
    verifiedAt,
    expiresOn: standing.expiresOn,
  };
}

async function latestCalibrations(db: Db, ids: number[]) {
  if (ids.length === 0) return new Map<number, CalibrationRow>();
  const rows = await db
    .selectFrom("rig_calibrations")
    .select(["id", day("calibrated_on").as("calibrated_on"), "verified_at"])
    .where("id", "in", ids)
    .execute();
  return new Map(rows.map((r) => [r.id, r]));
}

async function lastChecks(db: Db, rigIds: number[]) {
  if (rigIds.length === 0) return new Map<number, { session_on: string; in_control: boolean }>();
  const rows = await db
    .selectFrom("rig_check_readings")
    .distinctOn("rig_id")
    .select(["rig_id", day("session_on").as("session_on"), "in_control"])
    .where("rig_id", "in", rigIds)
    .orderBy("rig_id")
    .orderBy("session_on", "desc")
    .execute();
  return new Map(rows.map((r) => [r.rig_id, r]));
}

/** Every rig with its owner, shop and calibration standing, for the bench page. */
export async function listRigs(db: Db, now = new Date()) {
  const rigs = await rigsBase(db).orderBy("r.name").execute();
  const [calibrations, checks] = await Promise.all([
    latestCalibrations(
      db,
      rigs.flatMap((r) => (r.calibration_id == null ? [] : [r.calibration_id])),
    ),
    lastChecks(
      db,
      rigs.map((r) => r.id),
    ),
  ]);
  return rigs.map((r) => {
    const check = checks.get(r.id);
    return {
      ...r,
      checkTool: r.check_model_code ? toolName(r.check_maker_name ?? "", r.check_model_code) : null,
      standing: {
        ...standingOf(
          r.calibration_id == null ? undefined : calibrations.get(r.calibration_id),
          r.check_interval_months,
          now,
        ),
        lastCheckOn: check?.session_on ?? null,
        lastCheckInControl: check?.in_control ?? null,
      } satisfies RigStanding,
    };
  });
}

export type RigListItem = Awaited<ReturnType<typeof listRigs>>[number];

/** The rigs one user owns (the filing form offers only these). */
export async function rigsOwnedBy(db: Db, userId: number, now = new Date()) {
  return (await listRigs(db, now)).filter((r) => r.owner_id === userId);
}

/** One rig: its calibrations (latest first, the latest refitted with its residuals) and its check-standard chart. */
export async function getRig(db: Db, id: number, now = new Date()) {
  const rig = await rigsBase(db).where("r.id", "=", id).executeTakeFirst();
  if (!rig) return null;
  const [calibrations, readings] = await Promise.all([
    db
      .selectFrom("rig_calibrations as c")
      .leftJoin("users as v", "v.id", "c.verified_by")
      .select([
        "c.id",
        day("c.calibrated_on").as("calibrated_on"),
        "c.points",
        "c.degree",
        "c.coefficients",
        "c.residual_sd",
        "c.r_squared",
        // Whether there is a certificate, never where it is stored (a page sends this to the browser).
        sql<boolean>`c.certificate_key is not null`.as("has_certificate"),
        "c.verified_at",
        "v.handle as verified_by_handle",
      ])
      .where("c.rig_id", "=", id)
      .orderBy("c.calibrated_on", "desc")
      .orderBy("c.id", "desc")
      .execute(),
    db
      .selectFrom("rig_check_readings")
      .select(["id", day("session_on").as("session_on"), "value", "in_control"])
      .where("rig_id", "=", id)
      .orderBy("session_on")
      .execute(),
  ]);
  const latest = calibrations[0];
  const fit = latest ? fitCalibration(latest.points, latest.degree) : null;
  const chart = readings.length >= 2 ? individualsChart(readings.map((r) => r.value)) : null;
  const check = readings.at(-1);
  return {
    rig: {
      ...rig,
      checkTool: rig.check_model_code ? toolName(rig.check_maker_name ?? "", rig.check_model_code) : null,
    },
    standing: {
      ...standingOf(latest, rig.check_interval_months, now),
      lastCheckOn: check?.session_on ?? null,
      lastCheckInControl: check?.in_control ?? null,
    } satisfies RigStanding,
    calibrations: calibrations.map(({ points: _points, ...c }) => c),
    fit,
    checkReadings: readings,
    chart,
  };
}

export type RigDetail = NonNullable<Awaited<ReturnType<typeof getRig>>>;

/**
 * Whether a run may be filed on the rig today: a verified calibration within its age, and the
 * latest check-standard session in control. The reason is for the filer.
 */
export async function rigFilingRefusal(db: Db, rigId: number, now = new Date()): Promise<string | null> {
  const detail = await getRig(db, rigId, now);
  if (!detail) return "No such rig.";
  const { standing } = detail;
  switch (standing.status) {
    case "uncalibrated":
      return "This rig has no calibration on record; upload one before filing runs on it.";
    case "unverified":
      return "This rig's calibration is not yet verified by a moderator; runs on it cannot be filed until it is.";
    case "expired":
      return `This rig's calibration expired${standing.expiresOn ? ` on ${standing.expiresOn.toISOString().slice(0, 10)}` : ""}; recalibrate it before filing runs.`;
    case "current":
      return null;
  }
}
