// Query parameters of the feed, each with the message a caller sees when it does not parse.
import { z } from "zod";
import { SLUG_MAX_LENGTH, SLUG_PATTERN } from "~/domain";

/**
 * Requests a minute per anonymous client. An API key's limit is configured (BAYPROOF_FEED_KEY_LIMIT,
 * read by app/config.server.ts, 600 unless set): the server passes it to what shows it.
 */
export const ANONYMOUS_LIMIT = { points: 60, duration: 60 } as const;
/** The window of both limits, in seconds. */
export const KEY_LIMIT_WINDOW = 60;

export const MAX_LIMIT = 500;
export const DEFAULT_LIMIT = 100;

export const slugParam = z
  .string({ error: "is required" })
  .max(SLUG_MAX_LENGTH, { error: "is longer than a slug can be" })
  .regex(new RegExp(SLUG_PATTERN), { error: "must be a slug such as 'ball-joint-separation'" })
  .optional();

/** An RFC 3339 date-time with its offset, or a plain date (midnight UTC). */
export const instantParam = z
  .string()
  .max(40, { error: "is too long" })
  .refine(
    (s) => /^\d{4}-\d{2}-\d{2}$/.test(s) || z.iso.datetime({ offset: true, precision: undefined }).safeParse(s).success,
    { error: "must be a date (2026-12-01) or an RFC 3339 date-time (2026-12-01T08:00:00Z)" },
  )
  .transform((s) => new Date(/^\d{4}-\d{2}-\d{2}$/.test(s) ? `${s}T00:00:00Z` : s))
  .refine((d) => !Number.isNaN(d.getTime()), { error: "is not a real date" })
  .optional();

export const limitParam = z
  .string()
  .regex(/^\d{1,7}$/, { error: `must be a whole number from 1 to ${MAX_LIMIT}` })
  .transform(Number)
  .pipe(
    z
      .number()
      .min(1, { error: `must be at least 1` })
      .max(MAX_LIMIT, { error: `must be at most ${MAX_LIMIT}` }),
  )
  .optional()
  .transform((n) => n ?? DEFAULT_LIMIT);

export const cursorParam = z.string().max(600, { error: "is not a cursor this feed issued" }).optional();

/** A row number: a positive whole number within PostgreSQL's integer. */
export const idParam = z
  .string()
  .regex(/^[1-9]\d{0,9}$/, { error: "must be a positive whole number" })
  .transform(Number)
  .refine((n) => n <= 2_147_483_647, { error: "is larger than any number the feed hands out" });
