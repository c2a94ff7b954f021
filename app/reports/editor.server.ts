// The report editor (/reports/new, /reports/:id/edit): what the form opens with, and its four
// intents — autosave, save a draft, submit, withdraw. Refusals the page shows as an error page
// throw ReportError; answers the form shows (field errors, a failed autosave) are returned.
import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { z } from "zod";
import type { Db } from "../../db/database";
import type { LengthUnit, PressureUnit } from "~/domain";
import { hasControlCharacters } from "~/utils/text";
import { idField } from "~/utils/params";
import { listReportEvidence } from "./evidence.server";
import { parseDraft, reportSchema, toFormValues } from "./form-schema";
import {
  findModel,
  getOwnReport,
  jobTypesByCategory,
  listOpenDrafts,
  recentSupplies,
  ReportError,
  saveDraft,
  submitReport,
  suggestModels,
  withdrawReport,
} from "./reports.server";
import { EDITABLE } from "./status";

interface Reporter {
  id: number;
  pressureUnit: PressureUnit;
  lengthUnit: LengthUnit;
}

const NOT_EDITABLE =
  "This report is submitted or decided and can no longer be edited. Withdraw it from your reports first if it is still waiting.";

/** A report of the reporter's own that may still change, as the form shows it. */
async function editableReport(db: Db, reporter: Reporter, reportId: number) {
  const own = await getOwnReport(db, reporter.id, reportId);
  if (!EDITABLE.includes(own.report.status)) throw new ReportError(NOT_EDITABLE, 409);
  const [model, evidence] = await Promise.all([findModel(db, own.modelSlug), listReportEvidence(db, reportId)]);
  const tool = model
    ? {
        slug: model.slug,
        label: own.modelLabel,
        categorySlug: model.category_slug,
        action: model.action,
        maxInletKpa: model.max_inlet_kpa,
      }
    : null;
  const values: Record<string, string> = {
    ...toFormValues(own.report, reporter.pressureUnit, reporter.lengthUnit),
    toolModel: own.modelSlug,
    jobType: own.jobSlug,
  };
  return { reportId: own.report.id, status: own.report.status as string, tool, values, evidence };
}

/** The supply fields a recent supply fills in one tap. */
const SUPPLY_FIELDS = [
  "regulator",
  "hoseId",
  "hoseLength",
  "couplerProfile",
  "couplerCount",
  "compressor",
  "tank",
] as const;

/** What the editor opens with: a new form, or the reporter's draft or returned report (refused otherwise). */
export async function loadEditor(db: Db, reporter: Reporter, reportId: number | null) {
  const { pressureUnit: pu, lengthUnit: lu } = reporter;
  const [report, jobs, supplies, drafts] = await Promise.all([
    reportId === null ? null : editableReport(db, reporter, reportId),
    jobTypesByCategory(db),
    recentSupplies(db, reporter.id),
    // A new form first offers to continue what the reporter already started.
    reportId === null ? listOpenDrafts(db, reporter.id) : [],
  ]);
  const newForm: Record<string, string> = { pu, lu };
  return {
    ...(report ?? { reportId: null, status: "new", tool: null, values: newForm, evidence: [] }),
    jobs,
    pu,
    lu,
    drafts,
    supplies: supplies.map((s) => {
      const v = toFormValues({ ...s }, pu, lu);
      return Object.fromEntries(SUPPLY_FIELDS.map((k) => [k, v[k] ?? ""])) as Record<
        (typeof SUPPLY_FIELDS)[number],
        string
      >;
    }),
  };
}

export type EditorAnswer =
  | { kind: "redirect"; to: string }
  | { kind: "autosaved"; reportId: number; savedAt: string }
  | { kind: "autosave-failed"; error: string; status: number }
  | { kind: "invalid"; result: SubmissionResult<string[]>; status: number };

const editorIntent = z
  .enum(["submit", "autosave", "save-draft", "withdraw"], { error: "Unknown request; reload the page" })
  .default("submit");

/** Runs one of the form's intents for the reporter; `pathId` is the report in the address, if any. */
export async function editReport(
  db: Db,
  userId: number,
  pathId: number | undefined,
  formData: FormData,
): Promise<EditorAnswer> {
  const intentField = editorIntent.safeParse(formData.get("intent") || undefined);
  if (!intentField.success) throw new ReportError(intentField.error.issues[0]!.message, 400);
  const intent = intentField.data;
  const field = formData.get("reportId");
  const reportId = field ? idField().safeParse(field) : null;
  if (reportId && !reportId.success)
    throw new ReportError("The report number sent with the form is not valid; reload the page", 400);
  const id = reportId?.data ?? pathId;

  // Without JavaScript the tool is typed, not picked: accept it when it names exactly one model.
  const toolQuery = formData.get("toolQuery");
  if (!formData.get("toolModel") && typeof toolQuery === "string" && toolQuery && !hasControlCharacters(toolQuery)) {
    const hits = await suggestModels(db, toolQuery.slice(0, 80), 2);
    if (hits.length === 1) formData.set("toolModel", hits[0]!.slug);
  }

  try {
    if (intent === "withdraw") {
      if (!id) throw new ReportError("Nothing to withdraw yet", 400);
      await withdrawReport(db, userId, id);
      return { kind: "redirect", to: "/me/reports?withdrawn=1" };
    }
    if (intent === "autosave" || intent === "save-draft") {
      const saved = await saveDraft(db, userId, id, parseDraft(Object.fromEntries(formData)));
      if (intent === "save-draft") return { kind: "redirect", to: `/reports/${saved}/edit?saved=1` };
      return { kind: "autosaved", reportId: saved, savedAt: new Date().toISOString() };
    }
    const submission = parseWithZod(formData, { schema: reportSchema });
    if (submission.status !== "success") return { kind: "invalid", result: submission.reply(), status: 400 };
    const done = await submitReport(db, userId, id, submission.value);
    return { kind: "redirect", to: `/me/reports?submitted=${done.id}` };
  } catch (error) {
    if (!(error instanceof ReportError)) throw error;
    if (intent === "autosave") return { kind: "autosave-failed", error: error.message, status: error.status };
    if (!error.field) throw error;
    const submission = parseWithZod(formData, { schema: reportSchema });
    return {
      kind: "invalid",
      result: submission.reply({ fieldErrors: { [error.field]: [error.message] } }),
      status: error.status,
    };
  }
}
