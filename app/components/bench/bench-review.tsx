// The bench run review: the facts behind each check, the decision form with the bench checklist,
// and the run's append-only log. The queue section lists submitted runs for the review page.
import { Form, Link } from "react-router";
import type { BenchQueueRow } from "~/bench/moderation.server";
import { BENCH_CHECKLIST, BENCH_REASONS, type BenchChecklistItem } from "~/bench/review";
import { formatDateTime } from "~/domain";
import { Field, FieldError, inputClass, RadioChoices } from "../field";
import { buttonClass, Card } from "../ui";

export function BenchQueue({ rows }: { rows: BenchQueueRow[] }) {
  return (
    <section aria-labelledby="bench-queue-heading" className="space-y-2">
      <h2 id="bench-queue-heading" className="text-lg font-semibold">
        Bench runs waiting ({rows.length})
      </h2>
      {rows.length === 0 ? (
        <p className="text-sm text-stone-600">No bench runs are waiting.</p>
      ) : (
        <Card as="ul" padding="none" className="divide-y divide-stone-100">
          {rows.map((r) => (
            <li key={r.id} className="p-3">
              <Link to={`/review/bench/${r.id}`} className="font-semibold text-bay-700 underline">
                Bench run {r.id}: {r.tool}
              </Link>
              <p className="text-xs text-stone-600">
                {r.rig_name} · submitted {r.submitted_at ? formatDateTime(r.submitted_at) : "—"}
                {r.flags.length > 0 && ` · flagged: ${r.flags.join(", ").replaceAll("_", " ")}`}
              </p>
            </li>
          ))}
        </Card>
      )}
    </section>
  );
}

type Errors = Record<string, string[] | undefined>;

export function BenchDecisionForm({
  facts,
  version,
  errors,
  values,
}: {
  facts: Record<BenchChecklistItem, string>;
  version: number;
  errors: Errors;
  values: Record<string, string>;
}) {
  const err = (name: string) => errors[name]?.[0];
  const reasons = Object.entries(BENCH_REASONS).flatMap(([action, list]) =>
    Object.entries(list).map(([code, label]) => [code, `${action}: ${label}`] as const),
  );
  return (
    <Form method="post" className="space-y-4">
      <input type="hidden" name="version" value={version} />
      <fieldset className="space-y-2" aria-describedby={err("checklist") ? "checklist-error" : undefined}>
        <legend className="font-semibold">Bench checklist</legend>
        {(Object.keys(BENCH_CHECKLIST) as BenchChecklistItem[]).map((k) => (
          <label key={k} className="flex items-start gap-3">
            <input type="checkbox" name={k} defaultChecked={values[k] === "on"} className="mt-1 h-5 w-5" />
            <span>
              {BENCH_CHECKLIST[k]}
              <span className="block text-sm text-stone-600">{facts[k]}</span>
            </span>
          </label>
        ))}
        <FieldError id="checklist" message={err("checklist")} />
      </fieldset>
      <RadioChoices
        id="action"
        name="action"
        legend="Decision"
        choices={{ accept: "Accept", return: "Return for changes", reject: "Reject" }}
        defaultValue={values.action}
        error={err("action")}
      />
      <Field id="reason" label="Reason" error={err("reason")}>
        {(control) => (
          <select name="reason" defaultValue={values.reason ?? ""} className={inputClass} {...control}>
            <option value="">Choose…</option>
            {reasons.map(([code, label]) => (
              <option key={code} value={code}>
                {label}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field id="note" label="Note to the filer" hint="Needed when returning or rejecting." error={err("note")}>
        {(control) => (
          <textarea name="note" rows={3} defaultValue={values.note ?? ""} className={inputClass} {...control} />
        )}
      </Field>
      <button type="submit" className={buttonClass()}>
        Record the decision
      </button>
    </Form>
  );
}

export function BenchLog({
  log,
}: {
  log: {
    id: number;
    action: string;
    reason_code: string;
    note: string | null;
    created_at: Date;
    handle: string;
    run_version: number;
  }[];
}) {
  return (
    <section aria-labelledby="bench-log-heading">
      <h2 id="bench-log-heading" className="font-semibold">
        Decisions (kept as made; nothing here can be edited)
      </h2>
      {log.length === 0 ? (
        <p className="text-sm text-stone-600">No decisions yet.</p>
      ) : (
        <ol className="list-decimal space-y-1 pl-5 text-sm">
          {log.map((d) => (
            <li key={d.id}>
              {formatDateTime(d.created_at)}: {d.handle} chose {d.action} ({d.reason_code.replaceAll("_", " ")}) on
              version {d.run_version}
              {d.note ? ` — “${d.note}”` : ""}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
