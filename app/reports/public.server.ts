// What anyone may see of the reports: an accepted report's own page, and the evidence files reporters
// published with the open data (only of accepted reports, only files that passed their checks). The
// objects stay private in storage: pages link to the feed's stable address of each file, which
// redirects to a fresh ten-minute signed link, so a page kept in a cache never holds an expired one.
import type { Db } from "../../db/database";

export interface PublishedFile {
  id: number;
  reportId: number;
  kind: "video" | "photo";
  contentType: string | null;
  url: string;
  jobName: string;
}

function publishedFiles(db: Db) {
  return db
    .selectFrom("evidence as e")
    .innerJoin("reports as r", "r.id", "e.report_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .select(["e.id", "e.report_id", "e.kind", "e.content_type", "e.object_key", "j.name as job_name"])
    .where("e.is_public", "=", true)
    .where("e.status", "in", ["uploaded", "verified"])
    .where("r.status", "=", "accepted");
}

function linked(
  rows: {
    id: number;
    report_id: number;
    kind: "video" | "photo";
    content_type: string | null;
    object_key: string;
    job_name: string;
  }[],
): PublishedFile[] {
  return rows.map((e) => ({
    id: e.id,
    reportId: e.report_id,
    kind: e.kind,
    contentType: e.content_type,
    jobName: e.job_name,
    url: `/api/v1/evidence/${e.id}`,
  }));
}

/** The newest published files of a tool model's accepted reports. */
export async function publishedEvidenceForModel(db: Db, modelId: number, limit = 12) {
  const rows = await publishedFiles(db)
    .where("r.tool_model_id", "=", modelId)
    .orderBy("r.accepted_at", "desc")
    .orderBy("e.id")
    .limit(limit)
    .execute();
  return linked(rows);
}

/** An accepted report as its public page shows it, with its published files; null for any other report. */
export async function publicReport(db: Db, id: number) {
  const report = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .innerJoin("tool_categories as c", "c.id", "r.category_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .select([
      "r.id",
      "r.accepted_at",
      "r.vehicle_class",
      "r.component_age_years",
      "r.corrosion_level",
      "r.attachment",
      "r.attachment_length_mm",
      "r.regulator_kpa",
      "r.inlet_kpa",
      "r.inlet_source",
      "r.hose_id_mm",
      "r.hose_length_m",
      "r.coupler_profile",
      "r.coupler_count",
      "r.compressor_lps",
      "r.tank_l",
      "r.outcome",
      "r.time_to_result_s",
      "r.attempts",
      "r.trigger_control",
      "r.notes",
      "r.flags",
      "m.slug as model_slug",
      "m.model_code",
      "mk.name as maker_name",
      "j.slug as job_slug",
      "j.name as job_name",
      "c.action as category_action",
      "u.handle as reporter_handle",
    ])
    .where("r.id", "=", id)
    .where("r.status", "=", "accepted")
    .executeTakeFirst();
  if (!report) return null;
  const files = linked(await publishedFiles(db).where("r.id", "=", id).orderBy("e.id").execute());
  return { report, files };
}

export type PublicReport = NonNullable<Awaited<ReturnType<typeof publicReport>>>;
