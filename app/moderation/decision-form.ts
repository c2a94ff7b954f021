// The review page's two actions, one schema (server and hostile-input tests share it): "claim"
// starts the review (the report is held for the moderator), a decision (no intent, or "decide")
// records accept, return or reject with the checklist and a verdict per evidence file.
import { z } from "zod";
import { idField, MAX_ID } from "~/utils/params";
import { plainText } from "~/utils/text";
import { CHECKLIST, type ChecklistKey } from "./reasons";

/** One checkbox per checklist line, named `check_<key>`; ticked is "on". */
const CHECK_FIELDS = Object.fromEntries(
  Object.keys(CHECKLIST).map((k) => [`check_${k}`, z.string().optional()]),
) as Record<`check_${ChecklistKey}`, z.ZodOptional<z.ZodString>>;

const FILE_VERDICT = "Mark each file verified or failed";
/** One radio group per evidence file, named `evidence_<id>`. */
const evidenceKey = z.templateLiteral(["evidence_", z.string()]);
const evidenceVerdicts = z.looseRecord(evidenceKey, z.enum(["verified", "failed"], { error: FILE_VERDICT }));

export const claimSchema = z.object({ intent: z.literal("claim") });

/** The decision's own fields (named for the hostile-input suite); evidence and checks are read from the same form. */
export const decisionFields = z.looseObject({
  intent: z.literal("decide").optional(),
  action: z.enum(["accept", "return", "reject"], { error: "Pick accept, return or reject" }),
  reasonCode: plainText("Pick a reason").min(1, "Pick a reason").max(40),
  note: plainText().max(4000, "At most 4,000 characters").optional(),
  version: idField("Reload the report: the version sent is not one it has had"),
  seenDecisions: z
    .string()
    .regex(/^(0|[1-9][0-9]{0,9})$/, "Reload the report and decide again")
    .transform(Number)
    .refine((n) => n <= MAX_ID, "Reload the report and decide again"),
  /** Ticked ("on") when the moderator has compared a duplicate-evidence file with the other report. */
  ack_duplicate: z.string().optional(),
  ...CHECK_FIELDS,
});

export const DUPLICATE_ACK_MESSAGE = "Tick that you compared the duplicate file with the other report before accepting";

function toDecision(v: z.output<typeof decisionFields>, ctx: z.RefinementCtx) {
  const files = evidenceVerdicts.safeParse(v);
  const evidence: Record<number, "verified" | "failed"> = {};
  for (const [key, verdict] of Object.entries(files.success ? files.data : {})) {
    if (!evidenceKey.safeParse(key).success) continue; // the record lets the form's other fields through
    const id = idField().safeParse(key.slice("evidence_".length));
    if (id.success) evidence[id.data] = verdict;
    else ctx.addIssue({ code: "custom", path: [key], message: FILE_VERDICT });
  }
  if (!files.success)
    for (const issue of files.error.issues) ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  const checklist = Object.fromEntries(
    (Object.keys(CHECKLIST) as ChecklistKey[]).map((k) => [k, v[`check_${k}`] === "on"]),
  ) as Record<ChecklistKey, boolean>;
  return {
    intent: "decide" as const,
    action: v.action,
    reasonCode: v.reasonCode,
    note: v.note ?? null,
    version: v.version,
    seenDecisions: v.seenDecisions,
    checklist,
    evidence,
  };
}

export const decisionSchema = decisionFields.transform(toDecision);

/** What the review page's form posts: a claim, or a decision. */
export const reviewActionSchema = z.discriminatedUnion("intent", [claimSchema, decisionSchema]);

/**
 * The same, for one report: accepting a report flagged for duplicate evidence needs the moderator's
 * acknowledgement that they compared the file with the other report's.
 */
export function reviewActionSchemaFor(report: { flags: readonly string[] }) {
  if (!report.flags.includes("duplicate_evidence")) return reviewActionSchema;
  return z.discriminatedUnion("intent", [
    claimSchema,
    decisionFields
      .superRefine((v, ctx) => {
        if (v.action === "accept" && v.ack_duplicate !== "on")
          ctx.addIssue({ code: "custom", path: ["ack_duplicate"], message: DUPLICATE_ACK_MESSAGE });
      })
      .transform(toDecision),
  ]);
}
export type ReviewAction = z.output<typeof reviewActionSchema>;
