// The review queue's filters, sort and page, as they travel in the address (a GET form), so a
// filtered queue can be shared, reloaded and walked back through. Pure: the queue page, the
// review page ("next report") and their tests read the same schema.
import { z } from "zod";
import { slugField } from "~/domain/slug-field";
import { FLAG_EXPLANATIONS, type FlagCode } from "./flags";
import { TRUST_LEVELS, type TrustLevel } from "./trust";

/** Rows on one page of the queue. */
export const QUEUE_PAGE_SIZE = 40;

export const QUEUE_SORTS = { oldest: "Oldest first", newest: "Newest first" } as const;
export type QueueSort = keyof typeof QUEUE_SORTS;

export const QUEUE_AGES = {
  "1": "Waiting over a day",
  "7": "Waiting over a week",
  "30": "Waiting over a month",
} as const;

/** An empty select or box sends ""; that means "any". */
const blank = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === "" ? undefined : v), schema.optional());

export const queueFilterSchema = z.object({
  flag: blank(
    z.enum(Object.keys(FLAG_EXPLANATIONS) as [FlagCode, ...FlagCode[]], { error: "Pick a flag from the list" }),
  ),
  category: blank(slugField("Pick a category from the list")),
  job: blank(slugField("Pick a job from the list")),
  reporter: blank(z.enum(TRUST_LEVELS, { error: "Pick a reporter's record from the list" })),
  age: blank(z.enum(Object.keys(QUEUE_AGES) as ["1", "7", "30"], { error: "Pick a waiting time from the list" })),
  second: blank(z.literal("1", { error: "The second-look box is on (1) or absent" })),
  sort: blank(
    z.enum(Object.keys(QUEUE_SORTS) as [QueueSort, ...QueueSort[]], { error: "Sort oldest or newest first" }),
  ),
  page: blank(
    z.coerce
      .number({ error: "The page is a whole number from 1" })
      .int("The page is a whole number from 1")
      .min(1, "The page is a whole number from 1")
      .max(10_000, "The page is a whole number from 1"),
  ),
});

export type QueueFilter = z.output<typeof queueFilterSchema>;

export interface QueueCriteria {
  flag?: FlagCode;
  category?: string;
  job?: string;
  reporter?: TrustLevel;
  olderThanDays?: number;
  secondLookOnly: boolean;
  sort: QueueSort;
}

/** What the database is asked, from what the address says. */
export function queueCriteria(f: QueueFilter): QueueCriteria {
  return {
    flag: f.flag,
    category: f.category,
    job: f.job,
    reporter: f.reporter,
    olderThanDays: f.age ? Number(f.age) : undefined,
    secondLookOnly: f.second === "1",
    sort: f.sort ?? "oldest",
  };
}

/**
 * The address's query string for these filters ("" when none), leaving out what is the default,
 * so the queue's own links, the pager and "next report" keep one form of each address.
 */
export function queueQuery(f: QueueFilter, change: Partial<QueueFilter> = {}): string {
  const merged: QueueFilter = { ...f, ...change };
  const params = new URLSearchParams();
  for (const key of Object.keys(queueFilterSchema.shape) as (keyof QueueFilter)[]) {
    const value = merged[key];
    if (value === undefined || (key === "sort" && value === "oldest") || (key === "page" && value === 1)) continue;
    params.set(key, String(value));
  }
  const s = params.toString();
  return s ? `?${s}` : "";
}

/** The filters of an address; a malformed one gives the first problem instead. */
export function readQueueFilter(
  search: URLSearchParams,
): { ok: true; filter: QueueFilter } | { ok: false; message: string } {
  const raw: Record<string, string> = {};
  for (const key of Object.keys(queueFilterSchema.shape)) {
    const value = search.get(key);
    if (value !== null) raw[key] = value;
  }
  const parsed = queueFilterSchema.safeParse(raw);
  return parsed.success ? { ok: true, filter: parsed.data } : { ok: false, message: parsed.error.issues[0]!.message };
}
