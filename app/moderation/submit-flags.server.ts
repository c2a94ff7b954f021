// Flags that need other reports: computed when a report is submitted, inside its transaction.
import { sql, type Transaction } from "kysely";
import type { Database } from "../../db/schema";
import { type FlagCode, plausibilityFlags, ROBUST_Z_LIMIT, robustZ } from "./flags";

export async function submitFlags(
  trx: Transaction<Database>,
  r: {
    id: number;
    reporterId: number;
    jobTypeId: number;
    inletKpa: number;
    regulatorKpa: number;
    maxInletKpa: number;
    timeS: number;
  },
): Promise<FlagCode[]> {
  const flags = plausibilityFlags({ inletKpa: r.inletKpa, regulatorKpa: r.regulatorKpa, maxInletKpa: r.maxInletKpa });

  const times = await trx
    .selectFrom("reports")
    .select("time_to_result_s")
    .where("job_type_id", "=", r.jobTypeId)
    .where("status", "=", "accepted")
    .execute();
  const z = robustZ(
    r.timeS,
    times.map((t) => t.time_to_result_s!).filter((t) => t != null),
  );
  if (z != null && Math.abs(z) > ROBUST_Z_LIMIT) flags.push("time_outlier");

  const evidence = await trx
    .selectFrom("evidence")
    .select(["sha256"])
    .where("report_id", "=", r.id)
    .where("status", "in", ["uploaded", "verified"])
    .execute();
  if (evidence.length === 0) flags.push("no_evidence");
  const hashes = evidence.map((e) => e.sha256!).filter(Boolean);
  if (hashes.length) {
    const dup = await trx
      .selectFrom("evidence")
      .select("id")
      .where("sha256", "in", hashes)
      .where("report_id", "!=", r.id)
      .limit(1)
      .executeTakeFirst();
    if (dup) flags.push("duplicate_evidence");
  }

  const earlier = await trx
    .selectFrom("reports")
    .select(sql<number>`count(*)::int`.as("n"))
    .where("reporter_id", "=", r.reporterId)
    .where("id", "!=", r.id)
    .where("submitted_at", "is not", null)
    .executeTakeFirstOrThrow();
  if (earlier.n === 0) flags.push("first_report");
  return flags;
}
