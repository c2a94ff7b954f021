// The queue's rows and its pager. Each row is one link, tall enough for a thumb, that wraps on a phone.
import { Link } from "react-router";
import { formatDate, toolName } from "~/domain";
import { queueQuery, type QueueFilter } from "~/moderation/queue-filter";
import { reporterRecord, type History } from "~/moderation/trust";
import { buttonClass, Card } from "~/components/ui";

interface Row {
  id: number;
  maker: string;
  model_code: string;
  job: string;
  flags: string[];
  accepts: number;
  acceptedByMe: boolean;
  reporter: string;
  history: History;
  submitted_at: Date | string | null;
  claimed_by: string | null;
}

export function QueueList({ rows, filter }: { rows: Row[]; filter: QueueFilter }) {
  const query = queueQuery(filter);
  return (
    <Card as="ul" padding="none" className="divide-y divide-stone-100">
      {rows.map((r) => (
        <li key={r.id}>
          <Link
            to={`/review/${r.id}${query}`}
            className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-3 py-3 hover:bg-bay-50"
            data-testid="queue-row"
          >
            <span className="font-semibold">#{r.id}</span>
            <span>{toolName(r.maker, r.model_code)}</span>
            <span className="text-stone-600">{r.job}</span>
            {r.flags.map((f) => (
              <span key={f} className="rounded bg-amber-100 px-2 text-xs">
                ⚑ {f.replaceAll("_", " ")}
              </span>
            ))}
            {r.accepts > 0 && (
              <span className="rounded bg-bay-100 px-2 text-xs">
                {r.acceptedByMe ? "you accepted: waiting for another moderator" : "needs a second look"}
              </span>
            )}
            <span className="w-full text-xs text-stone-600 sm:ml-auto sm:w-auto">
              {r.reporter}: {reporterRecord(r.history)} · submitted {formatDate(r.submitted_at)}
              {r.claimed_by ? ` · open by ${r.claimed_by}` : ""}
            </span>
          </Link>
        </li>
      ))}
      {rows.length === 0 && <li className="px-3 py-3 text-stone-600">Nothing waiting with these filters.</li>}
    </Card>
  );
}

interface Paging {
  total: number;
  page: number;
  pages: number;
  from: number;
  to: number;
}

/** "41–80 of 202 waiting", with the pages either side; the filters travel with every link. */
export function QueuePager({
  paging,
  filter,
  position,
}: {
  paging: Paging;
  filter: QueueFilter;
  position: "top" | "bottom";
}) {
  const { total, page, pages, from, to } = paging;
  const link = (p: number) => `/review${queueQuery(filter, { page: p })}`;
  const summary = total === 0 ? "0 waiting" : `${from}–${to} of ${total} waiting`;
  if (position === "top")
    return (
      <p className="text-sm font-semibold" data-testid="queue-total">
        {summary}
      </p>
    );
  if (pages <= 1) return null;
  return (
    <nav aria-label="Queue pages" className="flex flex-wrap items-center justify-between gap-2 text-sm">
      <span className="flex gap-2">
        {page > 1 && (
          <Link className={buttonClass("plain", "md", "min-h-11")} to={link(1)} aria-label="First page">
            «
          </Link>
        )}
        {page > 1 && (
          <Link className={buttonClass("plain", "md", "min-h-11")} to={link(page - 1)} rel="prev">
            ← Previous
          </Link>
        )}
      </span>
      <span className="text-stone-600">
        Page {page} of {pages} · {summary}
      </span>
      <span className="flex gap-2">
        {page < pages && (
          <Link className={buttonClass("plain", "md", "min-h-11")} to={link(page + 1)} rel="next">
            Next →
          </Link>
        )}
        {page < pages && (
          <Link className={buttonClass("plain", "md", "min-h-11")} to={link(pages)} aria-label="Last page">
            »
          </Link>
        )}
      </span>
    </nav>
  );
}
