// Picking up where the reporter left off: drafts saved on the server (shown on /reports/new) and a
// form this device kept but never sent (shown on the page it belongs to).
import { Link } from "react-router";
import { formatDate, formatDateTime } from "~/domain";
import { buttonClass } from "~/components/ui";
import type { OfflineDraft } from "~/reports/offline-draft";

export interface OpenDraft {
  id: number;
  status: string;
  updatedAt: string;
  tool: string;
  job: string;
}

export function ContinueDrafts({ drafts }: { drafts: OpenDraft[] }) {
  if (drafts.length === 0) return null;
  return (
    <section aria-labelledby="continue-heading" className="rounded-lg border border-signal-500 bg-signal-100 p-4">
      <h2 id="continue-heading" className="font-semibold">
        Continue where you left off
      </h2>
      <ul className="mt-2 space-y-3">
        {drafts.map((d) => (
          <li key={d.id} className="flex flex-wrap items-center gap-x-3 gap-y-2">
            <Link
              to={`/reports/${d.id}/edit`}
              className={buttonClass("primary", "md", "inline-flex min-h-12 items-center")}
            >
              {d.status === "returned" ? `Fix and resubmit #${d.id}` : `Continue draft #${d.id}`}
            </Link>
            <span className="text-sm">
              {d.tool} · {d.job}
              <span className="block text-stone-700">
                saved <time dateTime={d.updatedAt}>{formatDate(d.updatedAt)}</time>
              </span>
            </span>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm text-stone-700">Or start a new report below.</p>
    </section>
  );
}

export function KeptFormOffer({
  offer,
  onRestore,
  onDiscard,
}: {
  offer: OfflineDraft;
  onRestore: () => void;
  onDiscard: () => void;
}) {
  return (
    <div role="alert" className="rounded-lg border border-signal-500 bg-signal-100 p-4 text-sm">
      <p>This device kept a form you had not sent ({formatDateTime(offer.at)}).</p>
      <div className="mt-2 flex flex-wrap gap-2">
        <button type="button" className={buttonClass("primary", "md", "min-h-12")} onClick={onRestore}>
          Restore it
        </button>
        <button type="button" className={buttonClass("plain", "md", "min-h-12")} onClick={onDiscard}>
          Discard
        </button>
      </div>
    </div>
  );
}
