// The queue page and the review page's place in it: what the route asks for, in one call each.
import type { Db } from "../../db/database";
import { idField } from "~/utils/params";
import { queueCriteria, queueQuery, type QueueFilter } from "./queue-filter";
import { queueCounts, queueNeighbours, reviewQueue } from "./queue.server";
import { HIDDEN_FROM_MODERATORS } from "./visibility";

export const JUMP_MESSAGE = "Give a report number, for example 1042";

/**
 * One page of the queue with its counts; or, when a report number was asked
 * for, the address of that report (kept in the same filtered queue), or why it cannot be opened.
 */
export async function queuePage(db: Db, moderatorId: number, filter: QueueFilter, jump: string | null) {
  let jumpError: string | null = null;
  if (jump !== null && jump.trim() !== "") {
    const id = idField(JUMP_MESSAGE).safeParse(jump.trim().replace(/^#/, ""));
    if (!id.success) jumpError = JUMP_MESSAGE;
    else if (!(await moderatorsCanOpen(db, id.data))) jumpError = `There is no report #${id.data} to review`;
    else return { redirectTo: `/review/${id.data}${queueQuery(filter, { page: undefined })}` } as const;
  }
  const criteria = queueCriteria(filter);
  const [queue, counts] = await Promise.all([
    reviewQueue(db, moderatorId, criteria, filter.page ?? 1),
    queueCounts(db),
  ]);
  // Counted here, once, so the page says the same on the server and in the browser.
  const waitDays = counts.oldest ? Math.floor((Date.now() - new Date(counts.oldest).getTime()) / 86_400_000) : 0;
  return {
    redirectTo: null,
    queue,
    counts,
    waitDays,
    jumpError,
    jump: jumpError ? (jump?.slice(0, 20) ?? null) : null,
  } as const;
}

async function moderatorsCanOpen(db: Db, id: number) {
  const row = await db
    .selectFrom("reports")
    .select("id")
    .where("id", "=", id)
    .where("status", "not in", HIDDEN_FROM_MODERATORS)
    .executeTakeFirst();
  return row !== undefined;
}

/** The review page's place in the filtered queue it was opened from, and the next report there. */
export async function placeInQueue(
  db: Db,
  moderatorId: number,
  filter: QueueFilter,
  report: { id: number; submitted_at: Date | string | null },
) {
  const { total, position, next } = await queueNeighbours(db, moderatorId, queueCriteria(filter), report);
  const query = queueQuery(filter, { page: undefined });
  return {
    total,
    position,
    next: next === null ? null : `/review/${next}${query}`,
    back: `/review${queueQuery(filter)}`,
  };
}
