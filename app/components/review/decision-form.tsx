import { Form, Link } from "react-router";
import { Field, FieldError, inputClass, RadioChoices, Select } from "~/components/field";
import { buttonClass } from "~/components/ui";
import { CHECKLIST, REASONS } from "~/moderation/reasons";

const ACTION_LABELS = { accept: "Accept", return: "Return for changes", reject: "Reject" } as const;
const GROUP_LABELS = { accept: "Accept", return: "Return", reject: "Reject" } as const;
const REASON_GROUPS = (Object.keys(REASONS) as (keyof typeof REASONS)[]).map((action) => ({
  label: GROUP_LABELS[action],
  options: Object.entries(REASONS[action]),
}));

interface Props {
  version: number;
  seenDecisions: number;
  media: { id: number; kind: string; status: string }[];
  note?: string;
  noteError?: string;
  busy: boolean;
  /** Set when the report carries the duplicate-evidence flag: the reports with the same file, and the acknowledgement's error. */
  duplicate?: { reports: number[]; error?: string };
}

/** The moderator's decision: the checklist, a verdict per file, accept/return/reject with a reason and a note. */
export function DecisionForm({ version, seenDecisions, media, note, noteError, busy, duplicate }: Props) {
  return (
    <Form
      method="post"
      id="decide"
      className="scroll-mt-4 space-y-4 rounded-lg border border-bay-600 bg-white p-3 sm:p-4"
    >
      <h2 className="text-lg font-semibold">Your decision</h2>
      <input type="hidden" name="version" value={version} />
      <input type="hidden" name="seenDecisions" value={seenDecisions} />
      <fieldset>
        <legend className="font-semibold">Evidence checklist</legend>
        {Object.entries(CHECKLIST).map(([k, label]) => (
          <label key={k} className="mt-1 flex min-h-11 items-center gap-3 py-1">
            <input type="checkbox" name={`check_${k}`} className="h-5 w-5" /> {label}
          </label>
        ))}
      </fieldset>
      {media.length > 0 && (
        <fieldset>
          <legend className="font-semibold">Each file</legend>
          {media.map((m, i) => (
            <RadioChoices
              key={m.id}
              id={`evidence-${m.id}`}
              name={`evidence_${m.id}`}
              legend={`File ${i + 1} (${m.kind})`}
              legendClassName="float-left mr-4"
              choices={{ verified: "verified", failed: "failed verification" }}
              className="mt-1 flex flex-wrap items-center gap-x-4 text-sm"
              choiceClassName="flex min-h-11 items-center gap-2"
              defaultValue={
                m.status === "verified" ? "verified" : m.status === "failed_verification" ? "failed" : undefined
              }
            />
          ))}
        </fieldset>
      )}
      <RadioChoices
        id="decision-action"
        name="action"
        legend="Decision"
        choices={ACTION_LABELS}
        className="mt-1 grid gap-3 sm:grid-cols-3"
        choiceClassName="flex min-h-11 items-center gap-2 rounded border border-stone-300 p-2 font-semibold"
      />
      {duplicate && <DuplicateAcknowledgement {...duplicate} />}
      <Select
        id="decision-reason"
        name="reasonCode"
        label="Reason"
        defaultValue=""
        options={[["", "— pick the reason —"], ...REASON_GROUPS]}
      />
      <Field id="note" label="Note to the reporter" error={noteError}>
        {(control) => (
          <textarea
            name="note"
            rows={3}
            defaultValue={note}
            {...control}
            className={inputClass}
            placeholder="For a return: what to change"
          />
        )}
      </Field>
      <button type="submit" disabled={busy} className={buttonClass("primary", "md", "min-h-11 w-full sm:w-auto")}>
        Record the decision
      </button>
    </Form>
  );
}

/** Accepting a report whose file also sits on another report needs the moderator to say they compared the two. */
function DuplicateAcknowledgement({ reports, error }: { reports: number[]; error?: string }) {
  return (
    <div className="rounded border border-amber-300 bg-amber-50 p-3">
      <p className="text-sm">
        A file of this report is byte-for-byte the same as one on{" "}
        {reports.length === 0
          ? "another report"
          : reports.map((id, i) => (
              <span key={id}>
                {i > 0 && ", "}
                <Link to={`/review/${id}`} className="text-bay-700 underline">
                  report #{id}
                </Link>
              </span>
            ))}
        . Accept only when both can be true (say, the same job filmed once and filed for two tools).
      </p>
      <label className="mt-2 flex min-h-11 items-center gap-3 font-semibold">
        <input
          type="checkbox"
          name="ack_duplicate"
          className="h-5 w-5"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? "ack_duplicate-error" : undefined}
        />
        I compared the file with the other report
      </label>
      <FieldError id="ack_duplicate" message={error} />
    </div>
  );
}
