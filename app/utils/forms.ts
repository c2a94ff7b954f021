import { data } from "react-router";
import { z } from "zod";
import { refuse } from "./http";

export type FieldErrors = Record<string, string[] | undefined>;

const FORM_TYPES = ["application/x-www-form-urlencoded", "multipart/form-data"];

/** The media type of a request's body, lower case, without parameters ("" when none is named). */
export function mediaType(request: Request): string {
  return (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
}

/** Why a body cannot be a submitted form, or null when its content type is one a form sends. */
export function formContentTypeProblem(request: Request): string | null {
  const type = mediaType(request);
  if (FORM_TYPES.includes(type)) return null;
  const named = /^[a-z0-9!#$&^_.+-]{1,60}\/[a-z0-9!#$&^_.+-]{1,60}$/.test(type) ? type : "";
  return `This address takes a submitted form (application/x-www-form-urlencoded or multipart/form-data)${named ? `, not ${named}` : ""}.`;
}

/**
 * The submitted form of an action: every action reads its body here. Another content type is a
 * 415 and a body that does not parse (a broken multipart) a 400, each with a reason; the size
 * was already capped by the server (server.js, BODY_LIMITS).
 */
export async function readForm(request: Request): Promise<FormData> {
  const problem = formContentTypeProblem(request);
  if (problem) refuse(problem, 415);
  try {
    return await request.formData();
  } catch {
    refuse("The form could not be read: its body is malformed. Send it again from the page.");
  }
}

/** A JSON error of the app's own API (`/api/*`): `{ error: { code, message } }`. */
export function apiError(status: number, code: string, message: string, headers?: HeadersInit) {
  return Response.json(
    { error: { code, message } },
    { status, headers: { "Cache-Control": "no-store", ...Object.fromEntries(new Headers(headers)) } },
  );
}

/** The JSON body of an API action: another content type is a 415, unreadable JSON a 400. */
export async function readJson(request: Request): Promise<unknown> {
  if (mediaType(request) !== "application/json") {
    throw apiError(415, "unsupported_media_type", "Send the body as JSON with Content-Type: application/json.");
  }
  try {
    return await request.json();
  } catch {
    throw apiError(400, "invalid_json", "The body is not valid JSON.");
  }
}

/**
 * Parses a submitted form with its zod schema. On failure the caller returns `invalid(...)`:
 * a 400 with the field errors and every value the user typed, so nothing is lost.
 */
export function parseForm<S extends z.ZodType>(schema: S, formData: FormData) {
  const values = formValues(formData);
  const parsed = schema.safeParse(values);
  if (parsed.success) return { ok: true as const, data: parsed.data, values };
  return { ok: false as const, errors: z.flattenError(parsed.error).fieldErrors as FieldErrors, values };
}

/** A form's text values by name: a repeated name gives an array (which a string field refuses). */
export function formValues(formData: FormData): Record<string, string | string[]> {
  return Object.fromEntries(
    [...new Set(formData.keys())].map((k) => {
      const all = formData.getAll(k).filter((v): v is string => typeof v === "string");
      return [k, all.length > 1 ? all : (all[0] ?? "")];
    }),
  );
}

export function invalid(errors: FieldErrors, values: Record<string, unknown>, formError?: string, status = 400) {
  return data({ ok: false as const, errors, values, formError }, { status });
}
