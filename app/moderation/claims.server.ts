// Claims: a moderator who starts a review holds the report for CLAIM_MINUTES, so two people do not
// check the same evidence at once. A claim is only ever taken by a POST (starting the review, or
// deciding); opening the page reads who holds it and changes nothing.
import { sql } from "kysely";
import type { Db, Trx } from "../../db/database";
import { DecisionError } from "./decision-error";
import { moderatorsMaySee } from "./visibility";

export const CLAIM_MINUTES = 15;

export interface ClaimState {
  mine: boolean;
  /** The other moderator's handle while their claim is live. */
  holder: string | null;
  expiresAt: Date | string | null;
  /** This moderator accepted this version: the second look is another's. */
  alreadyAccepted: boolean;
}

async function acceptedThisVersion(db: Db, moderatorId: number, reportId: number, version: number) {
  const row = await db
    .selectFrom("decisions")
    .select("id")
    .where("report_id", "=", reportId)
    .where("moderator_id", "=", moderatorId)
    .where("action", "=", "accept")
    .where("report_version", "=", version)
    .executeTakeFirst();
  return row !== undefined;
}

async function liveClaim(db: Db, reportId: number) {
  return db
    .selectFrom("report_claims as c")
    .innerJoin("users as u", "u.id", "c.moderator_id")
    .select(["c.moderator_id", "u.handle", "c.expires_at"])
    .where("c.report_id", "=", reportId)
    .where("c.expires_at", ">", sql<Date>`now()`)
    .executeTakeFirst();
}

/** Who holds the report now, as the review page shows it. Reads only. */
export async function claimState(
  db: Db,
  moderatorId: number,
  report: { id: number; version: number },
): Promise<ClaimState> {
  const [claim, alreadyAccepted] = await Promise.all([
    liveClaim(db, report.id),
    acceptedThisVersion(db, moderatorId, report.id, report.version),
  ]);
  const mine = claim?.moderator_id === moderatorId;
  return { mine, holder: claim && !mine ? claim.handle : null, expiresAt: claim?.expires_at ?? null, alreadyAccepted };
}

/** Takes a free or expired claim, or renews one's own; undefined while someone else's is live. */
async function takeClaim(trx: Trx, moderatorId: number, reportId: number) {
  const taken = await sql<{ moderator_id: number; expires_at: Date; fresh: boolean }>`
    insert into report_claims (report_id, moderator_id, expires_at)
    values (${reportId}, ${moderatorId}, now() + ${`${CLAIM_MINUTES} minutes`}::interval)
    on conflict (report_id) do update set moderator_id = excluded.moderator_id, claimed_at = now(), expires_at = excluded.expires_at
      where report_claims.expires_at < now() or report_claims.moderator_id = excluded.moderator_id
    returning moderator_id, expires_at, (xmax = 0) as fresh`.execute(trx);
  return taken.rows[0];
}

async function refuseHeld(trx: Trx, reportId: number): Promise<never> {
  const holder = await trx
    .selectFrom("report_claims as c")
    .innerJoin("users as u", "u.id", "c.moderator_id")
    .select(["u.handle", "c.expires_at"])
    .where("c.report_id", "=", reportId)
    .executeTakeFirstOrThrow();
  const until = new Date(holder.expires_at).toISOString().slice(11, 16);
  throw new DecisionError(
    `${holder.handle} has this report open until ${until} UTC; deciding waits until they decide or their claim runs out.`,
    409,
  );
}

/**
 * Starts a review: takes a free or expired claim, or renews one's own, in one statement, so two
 * moderators starting at once cannot both win. Own reports, reports not waiting, a version this
 * moderator already accepted and another moderator's live claim are refused (nothing written).
 */
export async function claim(db: Db, moderatorId: number, reportId: number) {
  return db.transaction().execute(async (trx) => {
    const report = await trx
      .selectFrom("reports")
      .select(["id", "status", "reporter_id", "version"])
      .where("id", "=", reportId)
      .executeTakeFirst();
    if (!report || !moderatorsMaySee(report.status)) throw new DecisionError("No such report", 404);
    if (report.reporter_id === moderatorId) throw new DecisionError("Nobody decides on their own report", 403);
    if (report.status !== "submitted")
      throw new DecisionError(`This report is not waiting for a decision (it is ${report.status})`, 409);
    // Whoever gave the first accept leaves the report free for the second look.
    if (await acceptedThisVersion(trx, moderatorId, reportId, report.version)) {
      throw new DecisionError("You accepted this version; the second look is another moderator's.", 409);
    }
    const row = await takeClaim(trx, moderatorId, reportId);
    if (!row) return refuseHeld(trx, reportId);
    if (row.fresh) {
      await trx
        .insertInto("decisions")
        .values({
          report_id: reportId,
          moderator_id: moderatorId,
          action: "claim",
          reason_code: "review_started",
          report_version: report.version,
        })
        .execute();
    }
    return { expiresAt: row.expires_at };
  });
}

/**
 * The rule for deciding: nobody else may hold a live claim. The decider takes the claim (a free or
 * expired one) or renews their own in the decision's transaction, with the same upsert as claim(),
 * so a claim taken a moment ago by another moderator cannot slip in between check and decision. A
 * decision that fails rolls the claim back with everything else; one that ends the review drops it.
 * Another moderator's live claim answers 409 with who holds it and until when.
 */
export async function holdClaimToDecide(trx: Trx, moderatorId: number, reportId: number) {
  if (await takeClaim(trx, moderatorId, reportId)) return;
  await refuseHeld(trx, reportId);
}
