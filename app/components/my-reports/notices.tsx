import { Form } from "react-router";
import { formatDateTime } from "~/domain";
import type { recentNotices } from "~/reports/notices.server";

type Notice = Awaited<ReturnType<typeof recentNotices>>[number];

/** Unread news on the reporter's reports, with a button marking them read. */
export function UnreadNotices({ unread }: { unread: Notice[] }) {
  return (
    <section aria-labelledby="notices-heading" className="rounded-lg border border-signal-500 bg-signal-100 p-3">
      <h2 id="notices-heading" className="font-semibold">
        News on your reports
      </h2>
      <ul className="mt-1 space-y-1 text-sm">
        {unread.map((n) => (
          <li key={n.id}>
            {formatDateTime(n.created_at)}: {n.message}
          </li>
        ))}
      </ul>
      <Form method="post" className="mt-2">
        <button
          type="submit"
          name="intent"
          value="read-notices"
          className="rounded border border-stone-400 px-3 py-1 text-sm"
        >
          Mark as read
        </button>
      </Form>
    </section>
  );
}
