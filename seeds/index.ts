// Loads the invented demo scenario into an empty database, all in one transaction.
// Loading into a database that already has a catalogue does nothing.
import { type Kysely, sql } from "kysely";
import type { Database, NewDecision, NewReport } from "../db/schema";
import { categories, jobTypes, makers, models, runningAir } from "./catalogue";
import { DEMO_OIDC_PROVIDER, demoSubject, people, shops } from "./people";
import { loadBench } from "./bench";
import { generateReports, makeRng } from "./reports";

const slugify = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "");
const HOUR = 3_600_000;
export const DEFAULT_MAX_INLET_KPA = 689.5; // 100 psi, a usual maximum on demo tool sheets

export async function isEmpty(db: Kysely<Database>) {
  const row = await db
    .selectFrom("makers")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .executeTakeFirstOrThrow();
  return Number(row.n) === 0;
}

export async function loadDemoScenario(db: Kysely<Database>): Promise<{ loaded: boolean; reports: number }> {
  return db.transaction().execute(async (trx) => {
    // Serialise concurrent loaders; the second finds the catalogue and stops.
    await sql`select pg_advisory_xact_lock(4242001)`.execute(trx);
    if (!(await isEmpty(trx))) return { loaded: false, reports: 0 };

    const shopRows = await trx
      .insertInto("shops")
      .values(shops.map(({ air: _air, ...s }) => s))
      .returning("id")
      .execute();
    const userRows = await trx
      .insertInto("users")
      .values(
        people.map((p) => ({
          email: p.email,
          handle: p.handle,
          shop_id: shopRows[p.shopIndex]!.id,
          pressure_unit: p.pressureUnit,
          length_unit: p.lengthUnit,
          force_unit: p.lengthUnit === "mm" ? ("N" as const) : ("lbf" as const),
          created_at: new Date(Date.UTC(2024, 11, 1)),
        })),
      )
      .returning("id")
      .execute();
    const roleRows = people.flatMap((p, i) => p.roles.map((role) => ({ user_id: userRows[i]!.id, role })));
    await trx.insertInto("user_roles").values(roleRows).execute();
    await trx
      .insertInto("oauth_accounts")
      .values(
        people.map((p, i) => ({
          provider: DEMO_OIDC_PROVIDER,
          subject: demoSubject(p.handle),
          user_id: userRows[i]!.id,
          email_at_link: p.email,
        })),
      )
      .execute();

    const makerRows = await trx
      .insertInto("makers")
      .values(makers.map((m) => ({ ...m })))
      .returning(["id", "slug"])
      .execute();
    const makerId = new Map(makerRows.map((m) => [m.slug, m.id]));
    const categoryRows = await trx.insertInto("tool_categories").values(categories).returning(["id", "slug"]).execute();
    const categoryId = new Map(categoryRows.map((c) => [c.slug, c.id]));

    const modelRows = await trx
      .insertInto("tool_models")
      .values(
        models.map((m, i) => ({
          slug: slugify(`${m.maker} ${m.code}`),
          maker_id: makerId.get(m.maker)!,
          category_id: categoryId.get(m.category)!,
          model_code: m.code,
          name: m.name,
          fitting: m.fitting,
          bore_mm: m.boreMm ?? null,
          stroke_mm: m.strokeMm ?? null,
          blows_per_minute: m.bpm ?? null,
          free_speed_rpm: m.rpm ?? null,
          max_torque_nm: m.torqueNm ?? null,
          weight_kg: m.weightKg,
          length_mm: m.lengthMm,
          street_price_cents: m.priceUsd * 100,
          air_inlet: m.inlet,
          rated_air_lps: m.ratedLps,
          max_inlet_kpa: m.maxInletKpa ?? DEFAULT_MAX_INLET_KPA,
          measured_specs: m.measured ?? [],
          running_air_lps: runningAir[i]!.catalogue.lps,
          running_air_source: runningAir[i]!.catalogue.source,
          running_air_factor: runningAir[i]!.catalogue.factor,
        })),
      )
      .returning(["id", "category_id"])
      .execute();
    const jobRows = await trx
      .insertInto("job_types")
      .values(
        jobTypes.map((j) => ({
          slug: j.slug,
          category_id: categoryId.get(j.category)!,
          name: j.name,
          description: j.description,
          seized: j.seized,
        })),
      )
      .returning("id")
      .execute();

    const generated = generateReports();
    const moderatorIdx = people.flatMap((p, i) => (p.roles.includes("moderator") ? [i] : []));
    const rng = makeRng("bayproof-demo-decisions-v1");
    const BATCH = 400;
    let total = 0;
    for (let start = 0; start < generated.length; start += BATCH) {
      const batch = generated.slice(start, start + BATCH);
      const rows: NewReport[] = batch.map((g) => {
        const decidedAt =
          g.status === "submitted" || g.status === "withdrawn"
            ? null
            : new Date(g.submittedAt.getTime() + (2 + rng() * 70) * HOUR);
        return {
          reporter_id: userRows[g.reporterIndex]!.id,
          tool_model_id: modelRows[g.modelIndex]!.id,
          category_id: modelRows[g.modelIndex]!.category_id,
          job_type_id: jobRows[g.jobIndex]!.id,
          status: g.status,
          vehicle_class: g.vehicleClass,
          component_age_years: g.componentAgeYears,
          corrosion_level: g.corrosion,
          attachment: g.attachment,
          attachment_length_mm: g.attachmentLengthMm,
          regulator_kpa: g.regulatorKpa,
          inlet_kpa: g.inletKpa,
          inlet_source: g.inletSource,
          hose_id_mm: g.hoseIdMm,
          hose_length_m: g.hoseLengthM,
          coupler_profile: g.couplerProfile,
          coupler_count: g.couplerCount,
          compressor_lps: g.compressorLps,
          tank_l: g.tankL,
          outcome: g.outcome,
          time_to_result_s: g.timeS,
          attempts: g.attempts,
          trigger_control: g.triggerControl,
          notes: g.notes,
          flags: g.flags,
          created_at: new Date(g.submittedAt.getTime() - 0.5 * HOUR),
          updated_at: decidedAt ?? g.submittedAt,
          submitted_at: g.submittedAt,
          decided_at: decidedAt,
          accepted_at: g.status === "accepted" ? decidedAt : null,
        };
      });
      const ids = await trx.insertInto("reports").values(rows).returning("id").execute();

      const decisions: NewDecision[] = [];
      const evidence: {
        report_id: number;
        object_key: string;
        kind: "video" | "photo";
        content_type: string;
        size_bytes: number;
        sha256: string;
        status: "verified" | "uploaded" | "failed_verification";
        is_public: boolean;
      }[] = [];
      batch.forEach((g, i) => {
        const reportId = ids[i]!.id;
        const at = rows[i]!.decided_at as Date | null;
        const others = moderatorIdx.filter((m) => m !== g.reporterIndex);
        const first = others[Math.floor(rng() * others.length)]!;
        if (at && g.status === "accepted") {
          decisions.push({
            report_id: reportId,
            moderator_id: userRows[first]!.id,
            action: "accept",
            reason_code: "evidence_clear",
            note: null,
            report_version: 1,
            created_at: at,
          });
          if (g.flags.length > 0) {
            const second = others.find((m) => m !== first)!;
            decisions.push({
              report_id: reportId,
              moderator_id: userRows[second]!.id,
              action: "accept",
              reason_code: "second_look_agrees",
              note: null,
              report_version: 1,
              created_at: at,
            });
          }
        } else if (at && g.status === "returned") {
          decisions.push({
            report_id: reportId,
            moderator_id: userRows[first]!.id,
            action: "return",
            reason_code: rng() < 0.5 ? "gauge_unreadable" : "inlet_pressure_missing",
            note: "Please add a clear shot of the gauge at the tool inlet while the tool runs.",
            report_version: 1,
            created_at: at,
          });
        } else if (at && g.status === "rejected") {
          decisions.push({
            report_id: reportId,
            moderator_id: userRows[first]!.id,
            action: "reject",
            reason_code: rng() < 0.5 ? "tool_not_shown" : "job_not_shown",
            note: null,
            report_version: 1,
            created_at: at,
          });
        }
        const items = 1 + (rng() < 0.4 ? 1 : 0);
        for (let e = 0; e < items; e++) {
          const video = e === 0 && rng() < 0.7;
          const hex = Array.from({ length: 64 }, () => Math.floor(rng() * 16).toString(16)).join("");
          evidence.push({
            report_id: reportId,
            object_key: `reports/${reportId}/${hex.slice(0, 24)}`,
            kind: video ? "video" : "photo",
            content_type: video ? "video/mp4" : "image/jpeg",
            size_bytes: video ? 8_000_000 + Math.floor(rng() * 60_000_000) : 1_500_000 + Math.floor(rng() * 3_000_000),
            sha256: hex,
            status:
              g.status === "accepted"
                ? "verified"
                : g.status === "rejected" && e === 0
                  ? "failed_verification"
                  : "uploaded",
            is_public: rng() < 0.3,
          });
        }
      });
      if (decisions.length) await trx.insertInto("decisions").values(decisions).execute();
      await trx.insertInto("evidence").values(evidence).execute();
      total += ids.length;
    }
    await loadBench(trx, {
      shops: shopRows.map((s) => s.id),
      users: userRows.map((u) => u.id),
      models: modelRows.map((m) => m.id),
      categories: categoryId,
      moderators: moderatorIdx.map((i) => userRows[i]!.id),
    });
    return { loaded: true, reports: total };
  });
}
