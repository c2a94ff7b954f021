// The sign-in, account and admin forms' schemas (server and hostile-input tests share them).
import { z } from "zod";
import { UNIT_SYSTEMS } from "~/domain";
import { idField } from "~/utils/params";
import { plainText } from "~/utils/text";

export const emailSchema = z.object({
  email: plainText().trim().toLowerCase().pipe(z.email("Enter an e-mail address like name@shop.example").max(254)),
  redirectTo: z.string().optional(),
});

export const profileSchema = z.object({
  intent: z.literal("profile"),
  handle: plainText()
    .trim()
    .toLowerCase()
    .regex(/^[a-z0-9][a-z0-9_-]{2,29}$/, "3–30 characters: letters, digits, - and _, starting with a letter or digit"),
  /** One system for every figure; metric readers may keep bar for pressure. */
  units: z.enum(["us", "metric", "metric-bar"], { error: "Choose US customary or metric units" }),
});

/** The footer's unit switch (`/units`): the system, and the page to return to. */
export const unitsSchema = z.object({
  system: z.enum(UNIT_SYSTEMS, { error: "Choose US customary (us) or metric (metric)" }),
  back: plainText().max(2000).optional(),
});
export const endSessionSchema = z.object({ intent: z.literal("end-session"), ref: z.string().regex(/^[0-9a-f]{16}$/) });
export const endOthersSchema = z.object({ intent: z.literal("end-other-sessions") });
export const createKeySchema = z.object({
  intent: z.literal("create-key"),
  name: plainText().trim().min(1, "Give the key a name, e.g. the project it is for").max(60),
});
export const revokeKeySchema = z.object({ intent: z.literal("revoke-key"), keyId: idField("No such key") });
export const accountSchema = z.discriminatedUnion("intent", [
  profileSchema,
  endSessionSchema,
  endOthersSchema,
  createKeySchema,
  revokeKeySchema,
]);

export const userSearchSchema = z.object({
  q: plainText().trim().max(100, "The search must be at most 100 characters").default(""),
});

export const roleSchema = z.object({
  intent: z.enum(["grant", "revoke"]),
  userId: idField("No such user"),
  role: z.enum(["moderator", "admin"]),
});
