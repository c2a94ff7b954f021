// The bench review's own checklist and reason codes (our names), shared by the review form and the server.
import { z } from "zod";
import { plainText } from "../utils/text";

export const BENCH_CHECKLIST = {
  calibration_current: "The rig's calibration is verified by a moderator and not past its age",
  check_standard_in_control: "The check standard's reading that session lies inside its control limits",
  trace_plausible: "Traces are plausible: no blow clipped at the sensor's capacity, blow rate near the stated rate",
  video_matches_rig: "The video shows this rig, this tool and the declared series",
} as const;
export type BenchChecklistItem = keyof typeof BENCH_CHECKLIST;

export const BENCH_REASONS = {
  accept: { bench_checks_pass: "Every check passes" },
  return: {
    trace_missing_for_series: "A series needs its trace or its values again",
    inlet_pressure_unclear: "The inlet pressures need a look",
    video_unclear: "The video does not show the rig or the series clearly",
  },
  reject: {
    rig_not_shown: "The rig shown is not the rig named",
    calibration_not_current: "The rig's calibration does not count",
    values_implausible: "The values cannot come from this tool on this rig",
  },
} as const;

const checklistFields = Object.fromEntries(
  Object.keys(BENCH_CHECKLIST).map((k) => [k, z.literal("on").optional()]),
) as Record<BenchChecklistItem, z.ZodOptional<z.ZodLiteral<"on">>>;

/** The review form: one decision, its reason, an optional note, the checklist and the version seen. */
export const benchDecisionSchema = z
  .object({
    action: z.enum(["accept", "return", "reject"], { error: "Choose a decision" }),
    reason: z.string({ error: "Choose a reason" }).min(1, "Choose a reason"),
    note: plainText().max(4000, "At most 4,000 characters").optional(),
    version: z
      .string()
      .regex(/^[1-9]\d{0,8}$/, "Reload the page and decide again")
      .transform(Number),
    ...checklistFields,
  })
  .superRefine((v, ctx) => {
    if (!(v.reason in BENCH_REASONS[v.action]))
      ctx.addIssue({ code: "custom", path: ["reason"], message: "Choose a reason that fits the decision" });
    if (v.action === "accept" && Object.keys(BENCH_CHECKLIST).some((k) => v[k as BenchChecklistItem] !== "on"))
      ctx.addIssue({ code: "custom", path: ["checklist"], message: "Tick every check before accepting" });
    if (v.action !== "accept" && !v.note?.trim())
      ctx.addIssue({ code: "custom", path: ["note"], message: "Tell the filer what to change or why" });
  });
