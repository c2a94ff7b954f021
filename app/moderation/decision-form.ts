// The moderator's decision form (server and hostile-input tests share it).
import { z } from "zod";
import { idField, MAX_ID } from "~/utils/params";
import { plainText } from "~/utils/text";

export const decisionSchema = z.object({
  action: z.enum(["accept", "return", "reject"], { error: "Pick accept, return or reject" }),
  reasonCode: plainText("Pick a reason").min(1, "Pick a reason").max(40),
  note: plainText().max(4000, "At most 4,000 characters").optional(),
  version: idField("Reload the report: the version sent is not one it has had"),
  seenDecisions: z.string().regex(/^(0|[1-9][0-9]{0,9})$/, "Reload the report and decide again").transform(Number)
    .refine((n) => n <= MAX_ID, "Reload the report and decide again"),
});
