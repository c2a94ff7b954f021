import { formatDateTime } from "~/domain";
import { reasonLabel } from "~/moderation/reasons";

/** A report's moderation log, oldest first: decisions, claims and evidence verdicts. */
export function LogList({
  log,
}: {
  log: {
    id: number;
    action: string;
    reason_code: string;
    note: string | null;
    report_version: number;
    created_at: Date | string;
    moderator: string;
  }[];
}) {
  if (log.length === 0) return <p className="text-stone-600">Nothing logged yet.</p>;
  return (
    <ol className="mt-1 space-y-1 text-sm">
      {log.map((d) => (
        <li key={d.id} className="rounded bg-white px-3 py-1.5">
          {formatDateTime(d.created_at)} · v{d.report_version} · <span className="font-semibold">{d.moderator}</span>{" "}
          {d.action.replaceAll("_", " ")} — {reasonLabel(d.reason_code)}
          {d.note ? `: ${d.note}` : ""}
        </li>
      ))}
    </ol>
  );
}
