import { getFormProps } from "@conform-to/react";
import { useRef, useState } from "react";
import { data, Form, redirect, type ShouldRevalidateFunctionArgs, useNavigation } from "react-router";
import { requireUser } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { formatTime } from "~/domain";
import { EvidenceUploader } from "~/components/report-form/evidence-uploader";
import { AirSupply, Notes, Result, Section, ToolAndJob } from "~/components/report-form/fieldsets";
import { ContinueDrafts, KeptFormOffer } from "~/components/report-form/continue-draft";
import {
  fillForm,
  formEntries,
  isConformIntent,
  useAutosave,
  useEditedFieldCheck,
  useOfflineDraft,
  useReportConform,
} from "~/components/report-form/hooks";
import type { ToolChoice } from "~/components/report-form/tool-picker";
import { db } from "~/db.server";
import { editReport, loadEditor } from "~/reports/editor.server";
import { ReportError } from "~/reports/reports.server";
import { readForm } from "~/utils/forms";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/reports.edit";

const NOT_FOUND = "No such report among yours";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const id = params.id === undefined ? null : parseIdParam(params.id, NOT_FOUND);
  return loadEditor(db, user, id).catch(refused);
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const pathId = params.id === undefined ? undefined : parseIdParam(params.id, NOT_FOUND);
  const answer = await editReport(db, user.id, pathId, await readForm(request)).catch(refused);
  switch (answer.kind) {
    case "redirect":
      return redirect(answer.to);
    case "autosaved":
      return { autosaved: true as const, reportId: answer.reportId, savedAt: answer.savedAt };
    case "autosave-failed":
      return data({ autosaved: false as const, error: answer.error }, { status: answer.status });
    case "invalid":
      return data({ result: answer.result }, { status: answer.status });
  }
}

// Autosaves change nothing the page shows; skip reloading its data after each one.
export function shouldRevalidate({ formData, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  return formData?.get("intent") === "autosave" ? false : defaultShouldRevalidate;
}

// One editor per report: going from /reports/new to a draft (or back) starts afresh, not with the
// other report's state.
export default function ReportEditorPage(props: Route.ComponentProps) {
  return <ReportEditor key={props.loaderData.reportId ?? "new"} {...props} />;
}

function ReportEditor({ loaderData, actionData }: Route.ComponentProps) {
  const { jobs, pu, lu, supplies, status, evidence, values, drafts } = loaderData;
  const metric = lu === "mm";
  const formRef = useRef<HTMLFormElement>(null);
  const [tool, setTool] = useState<ToolChoice | null>(loaderData.tool);
  const [inletTyped, setInletTyped] = useState<string>(values.inlet ?? "");
  const autosave = useAutosave(loaderData.reportId, formRef);
  const kept = useOfflineDraft(loaderData.reportId, values);
  const [form, fields] = useReportConform(
    loaderData.reportId,
    values,
    actionData && "result" in actionData ? actionData.result : undefined,
  );
  const checkEdited = useEditedFieldCheck((name) => form.validate({ name }));
  const submitting = useNavigation().state === "submitting";
  const reportId = autosave.reportId;

  function onChange() {
    if (!formRef.current) return;
    const typed = formEntries(formRef.current);
    kept.keep(typed);
    setInletTyped(typed.inlet ?? "");
    autosave.schedule(typed);
  }
  function fill(typed: Record<string, string>) {
    if (formRef.current) fillForm(formRef.current, typed);
    onChange();
  }

  return (
    <div className="mx-auto max-w-xl space-y-4">
      <header>
        <h1 className="text-2xl font-bold">
          {status === "returned" ? "Fix and resubmit your report" : "File a report from the bay"}
        </h1>
        <p className="text-sm text-stone-600">
          One job with one tool. Units follow your account ({pu}, {metric ? "mm and m" : "in and ft"}).{" "}
          {autosave.savedAt ? (
            <span role="status">Draft saved {formatTime(autosave.savedAt)}.</span>
          ) : reportId ? (
            "Saved as a draft."
          ) : (
            "Saved as a draft as soon as the tool and the job are picked."
          )}
        </p>
      </header>

      {!reportId && <ContinueDrafts drafts={drafts} />}
      {kept.offer && (
        <KeptFormOffer
          offer={kept.offer}
          onRestore={() => {
            fill(kept.offer!.values);
            kept.dismiss();
          }}
          onDiscard={kept.discard}
        />
      )}

      <Form
        method="post"
        {...getFormProps(form)}
        ref={formRef}
        onChange={onChange}
        {...checkEdited}
        // A field check is a submit event of conform's own; only sending the form stops the autosave.
        onSubmitCapture={(e) => {
          if (!isConformIntent(e)) autosave.cancel();
        }}
        className={FORM_CLASS}
      >
        <input type="hidden" name="reportId" value={reportId ?? ""} />
        <input type="hidden" name="pu" value={pu} />
        <input type="hidden" name="lu" value={lu} />
        {form.errors && (
          <p role="alert" className="text-sm text-red-700">
            {form.errors[0]}
          </p>
        )}

        <ToolAndJob
          fields={fields}
          tool={tool}
          jobs={jobs}
          metric={metric}
          onPick={(t) => {
            setTool(t);
            setTimeout(onChange, 0);
          }}
        />
        <AirSupply
          fields={fields}
          pu={pu}
          lu={lu}
          supplies={supplies}
          inletTyped={inletTyped}
          tool={tool}
          onReuse={fill}
        />
        <Result fields={fields} />
        <Section legend="Evidence">
          <EvidenceUploader reportId={reportId} initial={evidence} />
        </Section>
        <Notes fields={fields} />

        <div className="sticky bottom-0 z-10 flex flex-col gap-2 border-t border-stone-200 bg-bay-50 py-3 sm:flex-row">
          <button
            type="submit"
            name="intent"
            value="submit"
            disabled={submitting}
            className="min-h-12 flex-1 rounded bg-bay-700 px-4 py-3 text-lg font-semibold text-white disabled:opacity-60"
          >
            {submitting ? "Sending…" : status === "returned" ? "Resubmit" : "Submit report"}
          </button>
          <div className="flex gap-2">
            <button
              type="submit"
              name="intent"
              value="save-draft"
              formNoValidate
              className="min-h-12 flex-1 rounded border border-stone-400 bg-white px-4 py-3 font-semibold"
            >
              Save draft
            </button>
            {reportId && (
              <button
                type="submit"
                name="intent"
                value="withdraw"
                formNoValidate
                className="min-h-12 flex-1 rounded border border-stone-400 bg-white px-4 py-3 font-semibold"
              >
                Withdraw
              </button>
            )}
          </div>
        </div>
      </Form>
    </div>
  );
}

// A field reached with Tab scrolls clear of the sticky buttons below it, never under them.
const FORM_CLASS =
  "space-y-4 [&_:is(input,select,textarea,summary)]:scroll-mb-40 sm:[&_:is(input,select,textarea,summary)]:scroll-mb-28";

/** A refusal the page shows as an error page. */
function refused(error: unknown): never {
  if (error instanceof ReportError) throw data(error.message, { status: error.status });
  throw error;
}

export function meta() {
  return [{ title: "File a report — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
