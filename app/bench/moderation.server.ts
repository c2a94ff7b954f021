// Bench runs in review: the queue of submitted runs, one run's review facts, and the decision, which
// locks the run, checks the version the moderator saw and appends to the run's log in one transaction.
import { enqueueBenchFiguresRefresh } from "./figures.server";
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { toolName } from "../domain";
import { AppError } from "../utils/errors";
import { BLOW_RATE_TOLERANCE } from "./index";
import { getProtocolById } from "./protocols.server";
import { getRig } from "./rigs.server";
import { getRun, runFigures } from "./runs.server";
import type { BenchChecklistItem } from "./review";
import { traceDrawings } from "./traces.server";

/** Submitted runs waiting for a decision, oldest first; a moderator's own runs are left out. */
export async function benchQueue(db: Db, moderatorId: number) {
  const rows = await db
    .selectFrom("bench_runs as br")
    .innerJoin("rigs as r", "r.id", "br.rig_id")
    .innerJoin("tool_models as m", "m.id", "br.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select(["br.id", "br.flags", "br.submitted_at", "r.name as rig_name", "m.model_code", "mk.name as maker_name"])
    .where("br.status", "=", "submitted")
    .where("br.filed_by", "!=", moderatorId)
    .orderBy("br.submitted_at")
    .orderBy("br.id")
    .limit(50)
    .execute();
  return rows.map((r) => ({ ...r, tool: toolName(r.maker_name, r.model_code) }));
}

export type BenchQueueRow = Awaited<ReturnType<typeof benchQueue>>[number];

export async function benchLog(db: Db, runId: number) {
  return db
    .selectFrom("bench_decisions as d")
    .innerJoin("users as u", "u.id", "d.moderator_id")
    .select(["d.id", "d.action", "d.reason_code", "d.note", "d.run_version", "d.created_at", "u.handle"])
    .where("d.run_id", "=", runId)
    .orderBy("d.created_at")
    .orderBy("d.id")
    .execute();
}

/** What the reviewer sees: the run, its figures, the rig's standing and what the data says of each check. */
export async function openBenchReview(db: Db, runId: number, moderatorId: number) {
  const detail = await getRun(db, runId);
  if (!detail || detail.run.status === "draft" || detail.run.status === "withdrawn")
    throw new AppError("No such bench run in review", 404);
  const rig = (await getRig(db, detail.run.rig_id))!;
  const figures = runFigures(detail);
  const traced = detail.series.flatMap((s) => s.trials).filter((t) => t.trace_key);
  const rates = figures.series.filter((s) => s.trigger === "full" && s.rateAgreement?.ratio != null);
  const facts: Record<BenchChecklistItem, string> = {
    calibration_current:
      rig.standing.status === "current" ? "Verified and current." : `Not current: ${rig.standing.status}.`,
    check_standard_in_control: detail.run.flags.includes("check_standard_out_of_control")
      ? "The session's check reading fell outside the limits."
      : "No check reading outside the limits before the run.",
    trace_plausible: `${traced.length} traced trials${detail.run.flags.includes("trace_clipped") ? ", with a clipped blow" : ""}; ${
      rates.length
        ? rates.map((s) => `${Math.round(s.rateAgreement!.ratio! * 100)} % of the stated rate`).join(", ")
        : "no measured blow rate"
    } (tolerance ±${Math.round(BLOW_RATE_TOLERANCE * 100)} %).`,
    video_matches_rig: detail.run.video_key ? "A video is attached." : "No video attached.",
  };
  const protocol = await getProtocolById(db, detail.run.protocol_id);
  const traces = await traceDrawings(traced, {
    capacity: detail.run.sensor_capacity,
    discardBlows: protocol?.blows_discarded ?? 0,
  });
  return {
    detail,
    figures,
    traces,
    rig,
    facts,
    log: await benchLog(db, runId),
    own: detail.run.filed_by === moderatorId,
  };
}

export interface BenchDecision {
  runId: number;
  moderatorId: number;
  action: "accept" | "return" | "reject";
  reason: string;
  note: string | null;
  checklist: Partial<Record<BenchChecklistItem, boolean>>;
  version: number;
}

const STATUS = { accept: "accepted", return: "returned", reject: "rejected" } as const;

export async function decideBenchRun(db: Db, d: BenchDecision) {
  return db.transaction().execute(async (trx) => {
    const run = await trx
      .selectFrom("bench_runs")
      .select(["id", "status", "version", "filed_by"])
      .where("id", "=", d.runId)
      .forUpdate()
      .executeTakeFirst();
    if (!run || run.status === "draft" || run.status === "withdrawn")
      throw new AppError("No such bench run in review", 404);
    if (run.filed_by === d.moderatorId) throw new AppError("Nobody decides on their own run", 403);
    if (run.status !== "submitted") throw new AppError(`This run was already ${run.status}`, 409);
    if (run.version !== d.version)
      throw new AppError("The run changed since you opened it; reload and look again", 409);
    const now = new Date();
    await trx
      .insertInto("bench_decisions")
      .values({
        run_id: run.id,
        moderator_id: d.moderatorId,
        action: d.action,
        reason_code: d.reason,
        note: d.note,
        checklist: JSON.stringify(d.checklist),
        run_version: run.version,
        created_at: now,
      })
      .execute();
    await trx
      .updateTable("bench_runs")
      .set({
        status: STATUS[d.action],
        decided_at: now,
        updated_at: now,
        accepted_at: d.action === "accept" ? now : null,
      })
      .where("id", "=", run.id)
      .execute();
    if (d.action === "accept") await enqueueBenchFiguresRefresh(trx);
    return STATUS[d.action];
  });
}

export const benchWaiting = async (db: Db) =>
  (
    await db
      .selectFrom("bench_runs")
      .select(sql<number>`count(*)::int`.as("n"))
      .where("status", "=", "submitted")
      .executeTakeFirstOrThrow()
  ).n;
