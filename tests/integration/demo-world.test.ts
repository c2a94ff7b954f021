// The demo world as loaded (issue 17): catalogue running air figures with their source, the
// database's rule for them, report values without float noise, and the world's headline figures.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import * as rounding from "../../migrations/2026-12-02T12.31-round-report-values";
import { testDb } from "../support/db";

const db = testDb();
afterAll(() => db.destroy());
const KPA_PER_PSI = 6.894757; // NIST SP 811
/** Demo reports: submitted before the demo's horizon (other tests add rows of their own). */
const DEMO = sql<boolean>`r.created_at < '2026-11-21' and r.submitted_at > '2025-01-01'`;

/** Runs `work` in a transaction that is always rolled back; returns the error if any. */
async function rolledBack(work: (trx: typeof db) => Promise<unknown>): Promise<Error | null> {
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

describe("running air figures in the catalogue", () => {
  it("carry their source on every demo model, and a factor only where estimated", async () => {
    const rows = await db
      .selectFrom("tool_models")
      .select(["rated_air_lps", "running_air_lps", "running_air_source", "running_air_factor"])
      .execute();
    expect(rows.length).toBeGreaterThanOrEqual(24);
    expect(new Set(rows.map((r) => r.running_air_source))).toEqual(new Set(["maker_sheet", "measured", "estimated"]));
    for (const r of rows) {
      expect(r.running_air_lps).toBeGreaterThan(r.rated_air_lps);
      expect(r.running_air_factor !== null).toBe(r.running_air_source === "estimated");
    }
  });

  it("are refused by the database without a source, or estimated without a factor", async () => {
    const model = await db.selectFrom("tool_models").select("id").orderBy("id").executeTakeFirstOrThrow();
    const set = (values: Record<string, unknown>) =>
      rolledBack((trx) => trx.updateTable("tool_models").set(values).where("id", "=", model.id).execute());
    expect(await set({ running_air_lps: 5, running_air_source: "measured", running_air_factor: null })).toBeNull();
    expect((await set({ running_air_lps: 5, running_air_source: null, running_air_factor: null }))?.message).toMatch(
      /tool_models_running_air_sourced/,
    );
    expect(
      (await set({ running_air_lps: 5, running_air_source: "estimated", running_air_factor: null }))?.message,
    ).toMatch(/tool_models_running_air_sourced/);
    expect(
      (await set({ running_air_lps: 5, running_air_source: "maker_sheet", running_air_factor: 2 }))?.message,
    ).toMatch(/tool_models_running_air_sourced/);
    expect(
      (await set({ running_air_lps: 5, running_air_source: "guessed", running_air_factor: null }))?.message,
    ).toMatch(/check/);
  });
});

describe("declared exposure figures in the catalogue", () => {
  it("are there for every demo model, each with its source", async () => {
    const rows = await db
      .selectFrom("tool_models")
      .select(["vibration_ahv_ms2", "vibration_source", "sound_pressure_db", "sound_pressure_source", "bit_retainer"])
      .execute();
    for (const r of rows) {
      expect(r.vibration_ahv_ms2).not.toBeNull();
      expect(r.vibration_source).not.toBeNull();
      expect(r.sound_pressure_db).not.toBeNull();
      expect(r.sound_pressure_source).not.toBeNull();
      expect(r.bit_retainer).not.toBeNull();
    }
  });

  it("are refused by the database without a source, out of range, or a whip weight below the tool's", async () => {
    const model = await db
      .selectFrom("tool_models")
      .select(["id", "weight_kg"])
      .orderBy("id")
      .executeTakeFirstOrThrow();
    const set = (values: Record<string, unknown>) =>
      rolledBack((trx) => trx.updateTable("tool_models").set(values).where("id", "=", model.id).execute());
    const vibration = { vibration_k_ms2: 2, vibration_iso28927_part: 10, vibration_source: "maker_sheet" };
    expect(await set({ vibration_ahv_ms2: 12, ...vibration })).toBeNull();
    expect((await set({ vibration_ahv_ms2: 12, ...vibration, vibration_source: null }))?.message).toMatch(
      /tool_models_vibration_sourced/,
    );
    expect((await set({ vibration_ahv_ms2: 12, ...vibration, vibration_iso28927_part: null }))?.message).toMatch(
      /tool_models_vibration_sourced/,
    );
    expect((await set({ vibration_ahv_ms2: null, ...vibration }))?.message).toMatch(/tool_models_vibration_sourced/);
    expect((await set({ vibration_ahv_ms2: 120, ...vibration }))?.message).toMatch(/check/);
    expect((await set({ vibration_ahv_ms2: 12, ...vibration, vibration_iso28927_part: 14 }))?.message).toMatch(/check/);
    expect((await set({ sound_pressure_db: 98, sound_pressure_source: null }))?.message).toMatch(
      /tool_models_sound_pressure_sourced/,
    );
    expect((await set({ sound_pressure_db: 150, sound_pressure_source: "measured" }))?.message).toMatch(/check/);
    expect((await set({ sound_power_db: null, sound_power_k_db: 3, sound_power_source: null }))?.message).toMatch(
      /tool_models_sound_power_sourced/,
    );
    expect((await set({ bit_retainer: "tape" }))?.message).toMatch(/check/);
    expect(
      (await set({ weight_with_whip_kg: model.weight_kg - 0.1, weight_with_whip_source: "measured" }))?.message,
    ).toMatch(/tool_models_weight_with_whip_sourced/);
  });
});

describe("report values", () => {
  it("are stored at entry precision in the demo", async () => {
    const noisy = await sql<{ n: number }>`select count(*)::int n from reports r where ${DEMO} and (
      regulator_kpa <> round(regulator_kpa::numeric, 1)::float8 or inlet_kpa <> round(inlet_kpa::numeric, 1)::float8
      or hose_id_mm <> round(hose_id_mm::numeric, 2)::float8 or hose_length_m <> round(hose_length_m::numeric, 2)::float8
      or compressor_lps <> round(compressor_lps::numeric, 2)::float8 or tank_l <> round(tank_l::numeric, 1)::float8)`.execute(
      db,
    );
    expect(noisy.rows[0]!.n).toBe(0);
  });

  it("are rounded by the migration where an older row has float noise", async () => {
    const row = await db
      .selectFrom("reports as r")
      .select(["r.id"])
      .where(DEMO)
      .where("r.status", "=", "accepted")
      .orderBy("r.id")
      .executeTakeFirstOrThrow();
    let after: { regulator_kpa: number | null; hose_length_m: number | null; hose_id_mm: number | null } | undefined;
    expect(
      await rolledBack(async (trx) => {
        await trx
          .updateTable("reports")
          .set({ regulator_kpa: 661.9000000000001, hose_length_m: 7.6000000000000005, hose_id_mm: 9.525 })
          .where("id", "=", row.id)
          .execute();
        await rounding.up(trx);
        after = await trx
          .selectFrom("reports")
          .select(["regulator_kpa", "hose_length_m", "hose_id_mm"])
          .where("id", "=", row.id)
          .executeTakeFirstOrThrow();
      }),
    ).toBeNull();
    expect(after).toEqual({ regulator_kpa: 661.9, hose_length_m: 7.6, hose_id_mm: 9.53 });
  });
});

describe("the demo world's figures (issue 17)", () => {
  it("are believable: median inlet near the 90 psi rating, a small share above the tool's maximum", async () => {
    const q = await sql<{ median: number; above: number; n: number }>`
      select percentile_cont(0.5) within group (order by r.inlet_kpa) median,
             avg((r.inlet_kpa > m.max_inlet_kpa)::int)::float8 above, count(*)::int n
      from reports r join tool_models m on m.id = r.tool_model_id where r.status = 'accepted' and ${DEMO}`.execute(db);
    const { median, above, n } = q.rows[0]!;
    const drops = await sql<{ hose_id_mm: number; drop: number; n: number }>`
      select r.hose_id_mm, avg(r.regulator_kpa - r.inlet_kpa)::float8 drop, count(*)::int n from reports r
      where r.status = 'accepted' and r.inlet_source = 'measured_at_inlet' and ${DEMO} group by 1 order by 1`.execute(
      db,
    );
    const rates = await sql<{ job: string; fitting: string; rate: number; n: number }>`
      select j.slug job, m.fitting, avg((r.outcome = 'freed')::int)::float8 rate, count(*)::int n
      from reports r join tool_models m on m.id = r.tool_model_id join job_types j on j.id = r.job_type_id
      where r.status = 'accepted' and ${DEMO} and m.fitting in ('shank-0.401', 'shank-0.498', 'drive-1/2', 'drive-3/4')
      group by 1, 2 order by 1, 2`.execute(db);
    console.log(
      [
        `accepted demo reports ${n}; median inlet ${(median / KPA_PER_PSI).toFixed(1)} psi; above the tool's maximum ${(100 * above).toFixed(1)} %`,
        ...drops.rows.map(
          (d) =>
            `hose ${d.hose_id_mm} mm: mean regulator-to-inlet drop (measured at inlet) ${(d.drop / KPA_PER_PSI).toFixed(1)} psi, n ${d.n}`,
        ),
        ...rates.rows.map((r) => `${r.job} ${r.fitting}: freed ${(100 * r.rate).toFixed(0)} % of ${r.n}`),
      ].join("\n"),
    );
    expect(median / KPA_PER_PSI).toBeGreaterThan(85);
    expect(median / KPA_PER_PSI).toBeLessThan(100);
    expect(above).toBeLessThan(0.08);
    const drop = (mm: number) => drops.rows.find((d) => Math.abs(d.hose_id_mm - mm) < 0.01)!.drop;
    expect(drop(6.35)).toBeGreaterThan(drop(12.7)); // 1/4 in hose loses more than 1/2 in
  });
});
