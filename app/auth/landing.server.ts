// Where a person lands after signing in: a safe `redirectTo` they came with wins; otherwise the
// page where their role works — the review queue for moderators, their reports for a technician
// who has filed before, and a new report for one who has not.
import type { Db } from "../../db/database";
import { isSafeRedirectPath } from "./redirect-path";

export async function landingPath(db: Db, userId: number, redirectTo: unknown): Promise<string> {
  if (isSafeRedirectPath(redirectTo)) return redirectTo;
  const moderator = await db
    .selectFrom("user_roles")
    .select("role")
    .where("user_id", "=", userId)
    .where("role", "in", ["moderator", "admin"])
    .executeTakeFirst();
  if (moderator) return "/review";
  const filed = await db
    .selectFrom("reports")
    .select("id")
    .where("reporter_id", "=", userId)
    .limit(1)
    .executeTakeFirst();
  return filed ? "/me/reports" : "/reports/new";
}

/** A `redirectTo` worth carrying through a sign-in flow: the safe path, or "" for "where my role works". */
export const carriedRedirect = (value: unknown): string => (isSafeRedirectPath(value) ? value : "");
