import { Form } from "react-router";
import { Field, inputClass, RadioChoices, Select } from "~/components/field";
import { CHECKLIST, REASONS } from "~/moderation/reasons";

const ACTION_LABELS = { accept: "Accept", return: "Return for changes", reject: "Reject" } as const;
const GROUP_LABELS = { accept: "Accept", return: "Return", reject: "Reject" } as const;
const REASON_GROUPS = (Object.keys(REASONS) as (keyof typeof REASONS)[]).map((action) => ({ label: GROUP_LABELS[action], options: Object.entries(REASONS[action]) }));

interface Props {
  version: number;
  seenDecisions: number;
  media: { id: number; kind: string; status: string }[];
  note?: string;
  noteError?: string;
  busy: boolean;
}

/** The moderator's decision: the checklist, a verdict per file, accept/return/reject with a reason and a note. */
export function DecisionForm({ version, seenDecisions, media, note, noteError, busy }: Props) {
  return (
    <Form method="post" className="space-y-4 rounded-lg border border-bay-600 bg-white p-4">
      <input type="hidden" name="version" value={version} />
      <input type="hidden" name="seenDecisions" value={seenDecisions} />
      <fieldset>
        <legend className="font-semibold">Evidence checklist</legend>
        {Object.entries(CHECKLIST).map(([k, label]) => (
          <label key={k} className="mt-1 flex items-center gap-3 py-1"><input type="checkbox" name={`check_${k}`} className="h-5 w-5" /> {label}</label>
        ))}
      </fieldset>
      {media.length > 0 && (
        <fieldset>
          <legend className="font-semibold">Each file</legend>
          {media.map((m, i) => (
            <RadioChoices key={m.id} id={`evidence-${m.id}`} name={`evidence_${m.id}`} legend={`File ${i + 1} (${m.kind})`} legendClassName="float-left mr-4"
              choices={{ verified: "verified", failed: "failed verification" }} className="mt-1 flex flex-wrap items-center gap-4 text-sm" choiceClassName="flex items-center gap-2"
              defaultValue={m.status === "verified" ? "verified" : m.status === "failed_verification" ? "failed" : undefined} />
          ))}
        </fieldset>
      )}
      <RadioChoices id="decision-action" name="action" legend="Decision" choices={ACTION_LABELS} className="mt-1 grid gap-3 sm:grid-cols-3"
        choiceClassName="flex items-center gap-2 rounded border border-stone-300 p-2 font-semibold" />
      <Select id="decision-reason" name="reasonCode" label="Reason" defaultValue="" options={[["", "— pick the reason —"], ...REASON_GROUPS]} />
      <Field id="note" label="Note to the reporter" error={noteError}>
        {(control) => <textarea name="note" rows={3} defaultValue={note} {...control} className={inputClass} placeholder="For a return: what to change" />}
      </Field>
      <button type="submit" disabled={busy} className="rounded bg-bay-700 px-5 py-3 font-semibold text-white">Record the decision</button>
    </Form>
  );
}
