import { z } from "zod";
import { invariantResponse } from "./http";

const slugSchema = z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/).max(80);

/** A route's :slug param; anything malformed is simply not found. */
export function parseSlug(value: string | undefined): string {
  const parsed = slugSchema.safeParse(value);
  invariantResponse(parsed.success, "Not found", 404);
  return parsed.data;
}

const pageSchema = z.coerce.number().int().min(1).max(10_000).default(1);

/** The ?page= search param; a malformed one is a 400 with a reason. */
export function parsePage(request: Request): number {
  const raw = new URL(request.url).searchParams.get("page") ?? undefined;
  const parsed = pageSchema.safeParse(raw);
  invariantResponse(parsed.success, "The page number must be a whole number from 1", 400);
  return parsed.data;
}
