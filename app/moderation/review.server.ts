// The review page: everything a moderator sees about one report, read without changing anything
// (the claim is taken by starting the review, a POST), and the page's two actions.
import type { Db } from "../../db/database";
import { claim, claimState } from "./claims.server";
import { decide, reportLog } from "./decide.server";
import { reviewActionSchemaFor, type ReviewAction } from "./decision-form";
import { changesSinceLastVersion, reviewDetail } from "./queue.server";

const DECISIONS = new Set(["accept", "return", "reject"]);

/** The report, its evidence, the usual figures for the job, the log and who holds it; null when moderators may not see it. */
export async function openReview(db: Db, moderatorId: number, reportId: number) {
  const detail = await reviewDetail(db, reportId);
  if (!detail) return null;
  const own = detail.report.reporter_id === moderatorId;
  const [claimed, log] = await Promise.all([
    own ? null : claimState(db, moderatorId, detail.report),
    reportLog(db, reportId),
  ]);
  return {
    ...detail,
    own,
    claim: claimed,
    log,
    // The decision sends this back, so one taken meanwhile by someone else is noticed.
    seenDecisions: log.filter((d) => DECISIONS.has(d.action)).length,
    changes: changesSinceLastVersion(detail.versions),
  };
}

/** Starts the review or records a decision; refusals throw DecisionError. Returns the message for the page. */
export async function reviewAction(
  db: Db,
  moderatorId: number,
  reportId: number,
  input: ReviewAction,
): Promise<string> {
  if (input.intent === "claim") {
    const { expiresAt } = await claim(db, moderatorId, reportId);
    return `The report is held for you until ${new Date(expiresAt).toISOString().slice(11, 16)} UTC.`;
  }
  const { intent: _, ...decision } = input;
  const result = await decide(db, moderatorId, reportId, decision);
  return result.outcome === "awaiting_second_look"
    ? "Accepted; it now needs a second look from another moderator."
    : `Decision recorded: ${result.outcome}. The reporter is told by mail.`;
}

/** The review form's schema for this report (its flags decide what an accept must acknowledge). */
export async function reviewFormSchema(db: Db, reportId: number) {
  const row = await db.selectFrom("reports").select("flags").where("id", "=", reportId).executeTakeFirst();
  return reviewActionSchemaFor({ flags: row?.flags ?? [] });
}

export type ReviewData = NonNullable<Awaited<ReturnType<typeof openReview>>>;
