// The reporter's mail about a decision, sent by the worker from the decision-mail queue. A failed
// delivery throws, and pg-boss retries it.
import type { Db } from "../../db/database";
import { sendMail } from "~/auth/mail.server";
import { config } from "~/config.server";
import { toolName } from "~/domain";
import { reasonLabel } from "./reasons";

const VERBS = { accept: "accepted", return: "returned to you for changes", reject: "rejected" } as const;

export async function sendDecisionMail(db: Db, decisionId: number) {
  const d = await db
    .selectFrom("decisions as d")
    .innerJoin("reports as r", "r.id", "d.report_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .select([
      "d.action",
      "d.reason_code",
      "d.note",
      "r.id as report_id",
      "u.email",
      "u.handle",
      "m.model_code",
      "mk.name as maker",
      "j.name as job",
    ])
    .where("d.id", "=", decisionId)
    .executeTakeFirst();
  if (!d || !(d.action in VERBS)) return; // nothing to tell
  const verb = VERBS[d.action as keyof typeof VERBS];
  const lines = [
    `Hello ${d.handle},`,
    "",
    `Your report #${d.report_id} (${toolName(d.maker, d.model_code)}, ${d.job}) was ${verb}.`,
    `Reason: ${reasonLabel(d.reason_code)}.`,
    ...(d.note ? ["", d.action === "return" ? `What to change: ${d.note}` : `Note: ${d.note}`] : []),
    "",
    d.action === "return"
      ? `Fix it here: ${config.appOrigin}/reports/${d.report_id}/edit`
      : `See it here: ${config.appOrigin}/me/reports`,
  ];
  await sendMail({ to: d.email, subject: `Your Bayproof report #${d.report_id} was ${verb}`, text: lines.join("\n") });
}
