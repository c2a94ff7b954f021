import { z } from "zod";
import { isSlug } from "~/domain";
import { invariantResponse } from "./http";

/** A route's :slug param; anything malformed is simply not found. */
export function parseSlug(value: string | undefined): string {
  invariantResponse(isSlug(value), "Not found", 404);
  return value;
}

const pageSchema = z.coerce.number().int().min(1).max(10_000).default(1);

/** The ?page= search param; a malformed one is a 400 with a reason. */
export function parsePage(request: Request): number {
  const raw = new URL(request.url).searchParams.get("page") ?? undefined;
  const parsed = pageSchema.safeParse(raw);
  invariantResponse(parsed.success, "The page number must be a whole number from 1", 400);
  return parsed.data;
}

/** The largest row id: PostgreSQL's integer. */
export const MAX_ID = 2_147_483_647;
const ID_PATTERN = /^[1-9][0-9]{0,9}$/;

/** A row id as typed in a URL or a form: decimal digits only (no sign, no 0x, no exponent), 1 to MAX_ID. */
export const idField = (message = "Give a number from 1 to 2,147,483,647") =>
  z
    .string({ error: message })
    .regex(ID_PATTERN, message)
    .transform(Number)
    .refine((n) => n <= MAX_ID, message);

const idSchema = idField();

export const isId = (value: unknown): boolean => idSchema.safeParse(value).success;

/** A route's :id param; anything that is not a row id is simply not found. */
export function parseIdParam(value: string | undefined, notFound = "Not found"): number {
  const parsed = idSchema.safeParse(value);
  invariantResponse(parsed.success, notFound, 404);
  return parsed.data;
}

/** An optional id search param (?submitted=12): absent is null, malformed is a 400 with a reason. */
export function parseIdSearchParam(request: Request, name: string): number | null {
  const raw = new URL(request.url).searchParams.get(name);
  if (raw === null) return null;
  const parsed = idSchema.safeParse(raw);
  invariantResponse(parsed.success, `"${name}" must be a report number from 1 to ${MAX_ID}`, 400);
  return parsed.data;
}
