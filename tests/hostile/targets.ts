// What the hostile-input suite sends, and where: every action and API route with the fields of
// its own zod schema (or, for the open feed, the parameters of the published OpenAPI), as each
// kind of caller. Values that look like real ids are only ever this suite's own rows, so a
// request that happens to be valid changes nothing but the suite's own data.
import fc from "fast-check";
import type { z } from "zod";
import { accountSchema, emailSchema, roleSchema, unitsSchema, userSearchSchema } from "../../app/auth/forms";
import { claimSchema, decisionFields } from "../../app/moderation/decision-form";
import { queueFilterSchema } from "../../app/moderation/queue-filter";
import { reportFields } from "../../app/reports/form-schema";
import { validReport } from "../support/reports";

export type Who = "anonymous" | "reporter" | "moderator" | "admin";
export const WHO: Who[] = ["anonymous", "reporter", "moderator", "admin"];

/** This suite's own rows: the only ids a generated request may name for real. */
export interface Own {
  reporterDraft: number;
  submittedReport: number;
  targetUser: number;
}

export interface FormTarget {
  kind: "form";
  path: (own: Own) => string;
  /** The field names, from the route's own schema. */
  fields: string[];
  /** A valid submission to break one piece at a time. */
  base: (own: Own, n: number) => Record<string, string>;
  who: Who[];
}

export interface JsonTarget {
  kind: "json";
  path: (own: Own) => string;
  fields: string[];
  base: () => Record<string, unknown>;
  who: Who[];
}

export interface QueryTarget {
  kind: "query";
  path: (own: Own) => string;
  fields: string[];
  who: Who[];
}

export type Target = FormTarget | JsonTarget | QueryTarget;

/** The field names of a zod object, or of every branch of a discriminated union. */
export function fieldsOf(schema: z.ZodType): string[] {
  const def = (schema as unknown as { def: { type: string; shape?: Record<string, unknown>; options?: z.ZodType[] } })
    .def;
  if (def.type === "object") return Object.keys(def.shape!);
  if (def.type === "union") return [...new Set(def.options!.flatMap(fieldsOf))];
  if (def.type === "pipe") return fieldsOf((def as unknown as { in: z.ZodType }).in);
  throw new Error(`no fields in a ${def.type} schema`);
}

const ALL: Who[] = WHO;
const SIGNED_IN: Who[] = ["reporter", "moderator", "admin"];

export const FORM_TARGETS: FormTarget[] = [
  {
    kind: "form",
    path: () => "/sign-in",
    fields: fieldsOf(emailSchema),
    who: ["anonymous"],
    base: (_, n) => ({ email: `hostile-${process.pid}-${n}@demo.bayproof.test`, redirectTo: "/" }),
  },
  {
    kind: "form",
    path: () => "/sign-in/link",
    fields: ["token", "redirectTo"],
    who: ["anonymous"],
    base: () => ({ token: "A".repeat(43), redirectTo: "/" }),
  },
  { kind: "form", path: () => "/sign-out", fields: [], who: ["anonymous"], base: () => ({}) },
  ...(["profile", "create-key", "revoke-key", "end-session", "end-other-sessions"] as const).map(
    (intent): FormTarget => ({
      kind: "form",
      path: () => "/account",
      fields: fieldsOf(accountSchema),
      who: ALL,
      base: (_, n) => ({
        intent,
        ...(intent === "profile" ? { handle: `hostile-${process.pid % 1e5}-${n}`, units: "us" } : {}),
        ...(intent === "create-key" ? { name: `hostile key ${n}` } : {}),
        ...(intent === "revoke-key" ? { keyId: "1" } : {}),
        ...(intent === "end-session" ? { ref: "0123456789abcdef" } : {}),
      }),
    }),
  ),
  {
    kind: "form",
    path: () => "/units",
    fields: fieldsOf(unitsSchema),
    who: ALL,
    base: () => ({ system: "us", back: "/models" }),
  },
  {
    kind: "form",
    path: () => "/admin/users",
    fields: fieldsOf(roleSchema),
    who: ALL,
    base: (own, n) => ({ intent: n % 2 ? "grant" : "revoke", userId: String(own.targetUser), role: "moderator" }),
  },
  ...(["submit", "save-draft", "autosave"] as const).map((intent): FormTarget => ({
    kind: "form",
    path: () => "/reports/new",
    fields: [...Object.keys(reportFields), "intent", "reportId", "toolQuery"],
    who: ALL,
    base: () => ({ ...validReport(), intent }),
  })),
  ...(["autosave", "withdraw"] as const).map((intent): FormTarget => ({
    kind: "form",
    path: (own) => `/reports/${own.reporterDraft}/edit`,
    fields: [...Object.keys(reportFields), "intent", "reportId"],
    who: ALL,
    base: (own) => ({ ...validReport(), intent, reportId: String(own.reporterDraft) }),
  })),
  {
    kind: "form",
    path: () => "/me/reports",
    fields: ["intent", "evidenceId", "publish"],
    who: ALL,
    base: (_, n): Record<string, string> =>
      n % 2 ? { intent: "publish-evidence", evidenceId: "1", publish: "yes" } : { intent: "read-notices" },
  },
  {
    kind: "form",
    path: (own) => `/review/${own.submittedReport}`,
    fields: fieldsOf(claimSchema),
    who: ALL,
    base: () => ({ intent: "claim" }),
  },
  {
    kind: "form",
    path: (own) => `/review/${own.submittedReport}`,
    fields: [...fieldsOf(decisionFields), "evidence_1", "check_tool"],
    who: ALL,
    base: () => ({
      action: "return",
      reasonCode: "gauge_unreadable",
      note: "Show the gauge",
      version: "1",
      seenDecisions: "0",
    }),
  },
];

export const JSON_TARGETS: JsonTarget[] = [
  {
    kind: "json",
    path: (own) => `/api/reports/${own.reporterDraft}/evidence`,
    fields: ["type", "size"],
    who: ALL,
    base: () => ({ type: "image/jpeg", size: 1000 }),
  },
  { kind: "json", path: () => "/api/evidence/1/complete", fields: [], who: ALL, base: () => ({}) },
  { kind: "json", path: () => "/api/evidence/1/publish", fields: ["public"], who: ALL, base: () => ({ public: true }) },
  // A presigned upload for a bench trace: refused unless the caller owns the rig (none of the suite's callers do).
  {
    kind: "json",
    path: () => "/api/bench/traces",
    fields: ["rigId", "size"],
    who: ALL,
    base: () => ({ rigId: 1, size: 1000 }),
  },
  // The same for a calibration certificate, which also names its type.
  {
    kind: "json",
    path: () => "/api/bench/certificates",
    fields: ["rigId", "type", "size"],
    who: ALL,
    base: () => ({ rigId: 1, type: "application/pdf", size: 1000 }),
  },
];

export const QUERY_TARGETS: QueryTarget[] = [
  {
    kind: "query",
    path: () => "/search",
    fields: ["q", "category", "job", "shank", "kind"],
    who: ["anonymous", "reporter"],
  },
  { kind: "query", path: () => "/api/search", fields: ["q", "category", "kind"], who: ["anonymous"] },
  { kind: "query", path: () => "/api/models/suggest", fields: ["q"], who: ["anonymous"] },
  { kind: "query", path: () => "/api/models", fields: ["category", "shank", "sort", "q"], who: ["anonymous"] },
  { kind: "query", path: () => "/api/stats/cell", fields: ["model", "job", "inlet_kpa"], who: ["anonymous"] },
  { kind: "query", path: () => "/compare", fields: ["job", "models", "psi"], who: ["anonymous"] },
  {
    kind: "query",
    path: () => "/jobs/ball-joint-separation",
    // The air calculator's fields, then the shortlist's (app/exposure/shortlist-form.ts).
    fields: [
      "reg",
      "hid",
      "hlen",
      "cc",
      "cp",
      "bits",
      "page",
      "maxw",
      "maxl",
      "maxp",
      "comp",
      "minc",
      "jobs",
      "maxv",
      "vb",
      "seed",
      "w_chance",
      "w_time",
      "w_weight",
      "w_price",
      "w_vibration",
    ],
    who: ["anonymous"],
  },
  // A day on the tools (app/exposure/day-query.ts): rows of tool, job, count and minutes.
  { kind: "query", path: () => "/day", fields: ["tool", "job", "n", "min", "vib", "perday"], who: ["anonymous"] },
  { kind: "query", path: () => "/bench/runs/new", fields: ["rig", "protocol"], who: SIGNED_IN },
  { kind: "query", path: () => "/admin/users", fields: fieldsOf(userSearchSchema), who: ["admin", "moderator"] },
  { kind: "query", path: () => "/me/reports", fields: ["submitted", "withdrawn"], who: SIGNED_IN },
  {
    kind: "query",
    path: () => "/review",
    fields: [...fieldsOf(queueFilterSchema), "report"],
    who: ["moderator", "admin"],
  },
  {
    kind: "query",
    path: (own) => `/review/${own.submittedReport}`,
    fields: fieldsOf(queueFilterSchema),
    who: ["moderator"],
  },
  { kind: "query", path: () => "/models", fields: ["category", "shank", "page", "sort"], who: ["anonymous"] },
  { kind: "query", path: () => "/sign-in", fields: ["redirectTo"], who: ["anonymous"] },
  { kind: "query", path: () => "/sign-in/link", fields: ["token", "redirectTo"], who: ["anonymous"] },
];

/** Path params: the suite's own ids, and ids no route may take for real. */
export const BAD_IDS = [
  "0",
  "-1",
  "0x10",
  "1e3",
  "2147483648",
  "99999999999999999999",
  "1.5",
  "%00",
  "%20",
  "abc",
  "00012",
];
export const PATH_ID_TARGETS = (own: Own) => [
  ...BAD_IDS.flatMap((id) => [
    `/reports/${id}/edit`,
    `/reports/${id}/history`,
    `/review/${id}`,
    `/api/v1/reports/${id}`,
    `/api/v1/evidence/${id}`,
    `/bench/rigs/1/calibrations/${id}/certificate`,
    `/bench/rigs/${id}/calibrations/1/certificate`,
  ]),
  `/reports/${own.reporterDraft}/edit`,
  `/reports/${own.submittedReport}/history`,
  `/review/${own.submittedReport}`,
];

/** Every value a person or a script might send in place of a good one. */
export const hostileText: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom("", " ", "\u0000", "a\u0000b", "\u0007", "\u001b[31m", "\u007f", "line\nbreak", "tab\there", "\r\n"),
  fc.constantFrom(...BAD_IDS, "2147483647", "1", "NaN", "Infinity", "-0", "true", "null", "[]", "{}"),
  fc.constantFrom(
    "<script>alert(1)</script>",
    "'; drop table reports; --",
    "../../etc/passwd",
    "\uD800",
    "é".repeat(300),
    "🔧".repeat(2100),
  ),
  fc.constantFrom("x".repeat(121), "x".repeat(4001), "y".repeat(20_000)),
  fc.string({ maxLength: 40 }),
  fc
    .string({ unit: fc.integer({ min: 0, max: 0x1f }).map((c) => String.fromCharCode(c)), minLength: 1, maxLength: 4 })
    .map((c) => `typed ${c} text`),
);

export type Transport =
  "urlencoded" | "multipart" | "json" | "text" | "broken-multipart" | "none" | "oversize" | "oversize-chunked";
export const transport: fc.Arbitrary<Transport> = fc.oneof(
  { weight: 10, arbitrary: fc.constant("urlencoded" as const) },
  { weight: 3, arbitrary: fc.constant("multipart" as const) },
  {
    weight: 4,
    arbitrary: fc.constantFrom(
      "json" as const,
      "text" as const,
      "broken-multipart" as const,
      "none" as const,
      "oversize" as const,
      "oversize-chunked" as const,
    ),
  },
);

/** One request's worth of damage to a form: which fields change, vanish or repeat. */
export const damage = (fields: string[]) =>
  fc.record({
    changed: fields.length
      ? fc.uniqueArray(fc.tuple(fc.constantFrom(...fields), hostileText), { maxLength: 3, selector: ([k]) => k })
      : fc.constant([] as [string, string][]),
    missing: fields.length
      ? fc.subarray(fields, { maxLength: Math.min(2, fields.length) })
      : fc.constant([] as string[]),
    repeated: fields.length ? fc.subarray(fields, { maxLength: 1 }) : fc.constant([] as string[]),
    transport,
  });

export const hostileJson: fc.Arbitrary<unknown> = fc.oneof(
  hostileText,
  fc.constantFrom(0, -1, 1.5, 1e20, Number.MAX_SAFE_INTEGER, 2_147_483_648, true, false, null),
  fc.constantFrom([], {}, [1, 2], { nested: { deep: true } }),
);
