// The database itself refuses bad bench rows: inserts straight past the app, each rolled back.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import type { Trx } from "../../db/database";
import { testDb } from "../support/db";

const db = testDb();
afterAll(() => db.destroy());

/** Runs `work` in a transaction that is always rolled back; returns the database's error, if any. */
async function attempt(work: (trx: Trx) => Promise<unknown>): Promise<Error | null> {
  try {
    await db.transaction().execute(async (trx) => {
      await work(trx);
      throw new Error("rollback");
    });
  } catch (error) {
    return (error as Error).message === "rollback" ? null : (error as Error);
  }
  return null;
}

const anyRun = () =>
  db
    .selectFrom("bench_runs")
    .select(["id", "rig_id", "protocol_id", "tool_model_id", "filed_by"])
    .orderBy("id")
    .executeTakeFirstOrThrow();

describe("bench tables", () => {
  it("refuses a force rig that reads a torque transducer", async () => {
    const rig = await db
      .selectFrom("rigs")
      .selectAll()
      .where("kind", "=", "percussive_force")
      .executeTakeFirstOrThrow();
    const error = await attempt((trx) =>
      trx
        .insertInto("rigs")
        .values({
          owner_id: rig.owner_id,
          name: "Mismatched rig",
          kind: "percussive_force",
          sensor_kind: "torque_transducer",
          sensor_capacity: 1000,
          sample_rate_hz: 5000,
          fixture: "An anvil",
        })
        .execute(),
    );
    expect(error?.message).toMatch(/rigs_sensor_fits_kind/);
  });

  it("refuses a calibration whose coefficients do not match its degree", async () => {
    const rig = await db.selectFrom("rigs").select("id").executeTakeFirstOrThrow();
    const error = await attempt((trx) =>
      trx
        .insertInto("rig_calibrations")
        .values({
          rig_id: rig.id,
          calibrated_on: "2026-01-01",
          points: JSON.stringify([
            { reference: 1, reading: 1 },
            { reference: 2, reading: 2 },
            { reference: 3, reading: 3 },
          ]),
          degree: 2,
          coefficients: [0, 1],
          residual_sd: 0,
        })
        .execute(),
    );
    expect(error?.message).toMatch(/rig_calibrations_check/);
  });

  it("refuses a protocol version that already exists, and one that counts both blows and seconds", async () => {
    const p = await db.selectFrom("bench_protocols").selectAll().orderBy("id").executeTakeFirstOrThrow();
    const { id: _id, ...copy } = p;
    expect((await attempt((trx) => trx.insertInto("bench_protocols").values(copy).execute()))?.message).toMatch(
      /bench_protocols_slug_version_key/,
    );
    const both = { ...copy, version: 99, blows_per_trial: 40, seconds_per_trial: 5 };
    expect((await attempt((trx) => trx.insertInto("bench_protocols").values(both).execute()))?.message).toMatch(
      /bench_protocols_one_trial_length/,
    );
  });

  it("refuses an open-line series without its hose declared", async () => {
    const p = await db.selectFrom("bench_protocols").select("id").executeTakeFirstOrThrow();
    const error = await attempt((trx) =>
      trx
        .insertInto("bench_protocol_series")
        .values({
          protocol_id: p.id,
          position: 12,
          label: "Open line",
          trigger: "full",
          inlet: "open_line",
          inlet_kpa: 800,
        })
        .execute(),
    );
    expect(error?.message).toMatch(/bench_protocol_series_line_declared/);
  });

  it("refuses a run series taken from another protocol's series", async () => {
    const run = await anyRun();
    const foreign = await db
      .selectFrom("bench_protocol_series")
      .select("id")
      .where("protocol_id", "!=", run.protocol_id)
      .executeTakeFirstOrThrow();
    const error = await attempt((trx) =>
      trx
        .insertInto("bench_run_series")
        .values({
          run_id: run.id,
          protocol_id: run.protocol_id,
          series_id: foreign.id,
          static_inlet_kpa: 620,
          running_inlet_kpa: 600,
        })
        .execute(),
    );
    expect(error?.message).toMatch(/foreign key/);
  });

  it("refuses a trial with a negative peak, and an accepted run without its time", async () => {
    const trial = await db.selectFrom("bench_trials").select(["run_series_id"]).executeTakeFirstOrThrow();
    const error = await attempt((trx) =>
      trx
        .insertInto("bench_trials")
        .values({ run_series_id: trial.run_series_id, trial_number: 19, peaks: [1200, -5] })
        .execute(),
    );
    expect(error?.message).toMatch(/bench_trials_peaks_check/);
    const run = await anyRun();
    const accepted = await attempt((trx) =>
      trx.updateTable("bench_runs").set({ status: "accepted", accepted_at: null }).where("id", "=", run.id).execute(),
    );
    expect(accepted?.message).toMatch(/bench_runs_accepted_has_time/);
  });

  it("keeps the bench decision log append-only", async () => {
    const error = await attempt((trx) => sql`update bench_decisions set note = 'rewritten'`.execute(trx));
    expect(error?.message).toMatch(/append-only/);
  });
});
