import { getFormProps, type SubmissionResult } from "@conform-to/react";
import { useRef, useState } from "react";
import { Form, useNavigation } from "react-router";
import { EvidenceUploader } from "~/components/report-form/evidence-uploader";
import { AirSupply, Notes, Result, Section, ToolAndJob } from "~/components/report-form/fieldsets";
import { ContinueDrafts, KeptFormOffer } from "~/components/report-form/continue-draft";
import { EditorHeader } from "~/components/report-form/editor-header";
import {
  fillForm,
  formEntries,
  isConformIntent,
  useAutosave,
  useEditedFieldCheck,
  useOfflineDraft,
  useReportConform,
} from "~/components/report-form/hooks";
import { SubmitBar } from "~/components/report-form/submit-bar";
import type { ToolChoice } from "~/components/report-form/tool-picker";
import type { loadEditor } from "~/reports/editor.server";

type Props = {
  loaderData: Awaited<ReturnType<typeof loadEditor>>;
  lastResult: SubmissionResult<string[]> | undefined;
};

/** The report form: a new report, a draft or a returned one, autosaved and kept in the browser while typed. */
export function ReportEditor({ loaderData, lastResult }: Props) {
  const { jobs, pu, lu, supplies, status, evidence, values, drafts } = loaderData;
  const metric = lu === "mm";
  const formRef = useRef<HTMLFormElement>(null);
  const [tool, setTool] = useState<ToolChoice | null>(loaderData.tool);
  const [inletTyped, setInletTyped] = useState<string>(values.inlet ?? "");
  const autosave = useAutosave(loaderData.reportId, formRef);
  const kept = useOfflineDraft(loaderData.reportId, values);
  const [form, fields] = useReportConform(loaderData.reportId, values, lastResult);
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
      <EditorHeader status={status} pu={pu} metric={metric} savedAt={autosave.savedAt} reportId={reportId} />

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

        <SubmitBar submitting={submitting} status={status} reportId={reportId} />
      </Form>
    </div>
  );
}

// A field reached with Tab scrolls clear of the sticky buttons below it, never under them.
const FORM_CLASS =
  "space-y-4 [&_:is(input,select,textarea,summary)]:scroll-mb-40 sm:[&_:is(input,select,textarea,summary)]:scroll-mb-28";
