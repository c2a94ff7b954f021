// Moderation rules: decisions with their second look, evidence verdicts. Everything that
// changes a report happens in one transaction with the report row locked, and every step writes
// a row to the append-only decisions log.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import { enqueue, MAIL_RETRY, QUEUES } from "~/jobs/queue.server";
import { holdClaimToDecide } from "./claims.server";
import { DecisionError } from "./decision-error";
import { moderatorsMaySee } from "./visibility";
import { type ChecklistKey, type DecisionKind, isReason, reasonLabel } from "./reasons";
import { needsSecondLook, trustLevel, type History } from "./trust";

export { DecisionError };

/** Reporter histories for trust levels, for one or many reporters. */
export async function histories(db: Db, reporterIds: number[]): Promise<Map<number, History>> {
  if (reporterIds.length === 0) return new Map();
  const rows = await db
    .selectFrom("reports")
    .select(["reporter_id", "status", "decided_at"])
    .where("reporter_id", "in", reporterIds)
    .where("status", "in", ["accepted", "returned", "rejected"])
    .orderBy("decided_at", "desc")
    .execute();
  const out = new Map<number, History>();
  for (const id of reporterIds) out.set(id, { accepted: 0, returned: 0, rejected: 0, rejectStreak: 0 });
  const streakOpen = new Set(reporterIds);
  for (const r of rows) {
    const h = out.get(r.reporter_id)!;
    h[r.status as "accepted" | "returned" | "rejected"]++;
    if (streakOpen.has(r.reporter_id)) {
      if (r.status === "rejected") h.rejectStreak++;
      else streakOpen.delete(r.reporter_id);
    }
  }
  return out;
}

export interface DecisionInput {
  action: DecisionKind;
  reasonCode: string;
  note: string | null;
  /** The report version and the number of log rows the moderator saw when the page opened. */
  version: number;
  seenDecisions: number;
  checklist: Record<ChecklistKey, boolean>;
  evidence: Record<number, "verified" | "failed">;
}

export async function decide(db: Db, moderatorId: number, reportId: number, input: DecisionInput) {
  if (!isReason(input.action, input.reasonCode))
    throw new DecisionError("Pick a reason from the list for this decision", 400);
  if (input.action === "return" && !input.note?.trim())
    throw new DecisionError("Say what the reporter should change", 400);

  return db.transaction().execute(async (trx) => {
    const report = await trx
      .selectFrom("reports")
      .selectAll()
      .where("id", "=", reportId)
      .forUpdate()
      .executeTakeFirst();
    if (!report || !moderatorsMaySee(report.status)) throw new DecisionError("No such report", 404);
    if (report.reporter_id === moderatorId) throw new DecisionError("Nobody decides on their own report", 403);
    if (report.status !== "submitted")
      throw new DecisionError(`This report is not waiting for a decision (it is ${report.status})`, 409);
    await holdClaimToDecide(trx, moderatorId, reportId);
    const seen = await trx
      .selectFrom("decisions")
      .select(sql<number>`count(*)::int`.as("n"))
      .where("report_id", "=", reportId)
      .where("action", "in", ["accept", "return", "reject"])
      .executeTakeFirstOrThrow();
    if (report.version !== input.version || seen.n !== input.seenDecisions) {
      throw new DecisionError(
        "Someone decided on this report, or it changed, while you had it open. Reload it and look again.",
        409,
      );
    }

    // Evidence verdicts first: they are part of what is decided.
    const items = await trx
      .selectFrom("evidence")
      .select(["id", "status"])
      .where("report_id", "=", reportId)
      .where("status", "!=", "pending")
      .execute();
    for (const item of items) {
      const verdict = input.evidence[item.id];
      if (!verdict) continue;
      await trx
        .updateTable("evidence")
        .set({ status: verdict === "verified" ? "verified" : "failed_verification" })
        .where("id", "=", item.id)
        .execute();
      await trx
        .insertInto("decisions")
        .values({
          report_id: reportId,
          moderator_id: moderatorId,
          action: verdict === "verified" ? "verify_evidence" : "fail_evidence",
          reason_code: verdict === "verified" ? "evidence_checked" : "evidence_failed",
          report_version: report.version,
          evidence_id: item.id,
        })
        .execute();
    }
    const failed = items.some(
      (i) => (input.evidence[i.id] ?? (i.status === "failed_verification" ? "failed" : null)) === "failed",
    );
    if (input.action === "accept" && failed)
      throw new DecisionError("A report with failed evidence cannot be accepted", 409);
    if (input.action === "accept" && !Object.values(input.checklist).every(Boolean)) {
      throw new DecisionError("Tick every line of the evidence checklist before accepting", 400);
    }

    const priorAccepts = await trx
      .selectFrom("decisions")
      .select(["moderator_id"])
      .where("report_id", "=", reportId)
      .where("action", "=", "accept")
      .where("report_version", "=", report.version)
      .execute();
    if (input.action === "accept" && priorAccepts.some((d) => d.moderator_id === moderatorId)) {
      throw new DecisionError(
        "You already accepted this version; the second look must come from another moderator",
        409,
      );
    }
    const history = (await histories(trx, [report.reporter_id])).get(report.reporter_id)!;
    const twoNeeded = needsSecondLook(report.flags, trustLevel(history));

    const logged = await trx
      .insertInto("decisions")
      .values({
        report_id: reportId,
        moderator_id: moderatorId,
        action: input.action,
        reason_code: input.reasonCode,
        note: input.note?.trim() || null,
        report_version: report.version,
        checklist: JSON.stringify(input.checklist),
      })
      .returning("id")
      .executeTakeFirstOrThrow();

    const completes = input.action !== "accept" || !twoNeeded || priorAccepts.length >= 1;
    if (!completes) {
      await trx.deleteFrom("report_claims").where("report_id", "=", reportId).execute();
      return { outcome: "awaiting_second_look" as const, decisionId: logged.id };
    }
    const status = input.action === "accept" ? "accepted" : input.action === "return" ? "returned" : "rejected";
    await trx
      .updateTable("reports")
      .set({
        status,
        decided_at: sql`now()`,
        updated_at: sql`now()`,
        ...(status === "accepted" ? { accepted_at: sql`now()` } : {}),
      })
      .where("id", "=", reportId)
      .execute();
    await trx.deleteFrom("report_claims").where("report_id", "=", reportId).execute();
    await trx
      .insertInto("notices")
      .values({
        user_id: report.reporter_id,
        report_id: reportId,
        message: `Report #${reportId} was ${status === "returned" ? "returned for changes" : status}: ${reasonLabel(input.reasonCode)}.${input.note ? ` ${input.note.trim()}` : ""}`,
      })
      .execute();
    await enqueue(trx, QUEUES.decisionMail, { decisionId: logged.id }, MAIL_RETRY);
    if (status === "accepted") {
      await enqueue(trx, QUEUES.statsRefresh, { modelId: report.tool_model_id, jobTypeId: report.job_type_id });
      await enqueue(trx, QUEUES.searchIndex, { reportId });
      await notifyPagesChanged(trx, "report");
    }
    return { outcome: status, decisionId: logged.id };
  });
}

/** The log of one report, oldest first, for its reporter and for moderators. */
export async function reportLog(db: Db, reportId: number) {
  return db
    .selectFrom("decisions as d")
    .innerJoin("users as u", "u.id", "d.moderator_id")
    .select([
      "d.id",
      "d.action",
      "d.reason_code",
      "d.note",
      "d.report_version",
      "d.created_at",
      "d.evidence_id",
      "u.handle as moderator",
    ])
    .where("d.report_id", "=", reportId)
    .orderBy("d.created_at")
    .orderBy("d.id")
    .execute();
}
