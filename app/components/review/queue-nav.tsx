import { Link } from "react-router";
import { buttonClass } from "~/components/ui";
import type { placeInQueue } from "~/moderation/queue-page.server";

export type Queue = Awaited<ReturnType<typeof placeInQueue>>;

/** Back to the queue it came from, where it stands there, and the next report. */
export function QueueNav({ queue }: { queue: Queue }) {
  return (
    <nav aria-label="Queue" className="flex flex-wrap items-center gap-x-4 text-sm">
      <Link to={queue.back} className="inline-flex min-h-11 items-center text-bay-700 underline">
        ← Queue
      </Link>
      {queue.position && (
        <span className="text-stone-600">
          {queue.position} of {queue.total} in this queue
        </span>
      )}
      {queue.next && (
        <Link to={queue.next} className="inline-flex min-h-11 items-center text-bay-700 underline sm:ml-auto">
          Skip to the next report →
        </Link>
      )}
    </nav>
  );
}

export function NextReport({ queue }: { queue: Queue }) {
  if (!queue.next)
    return (
      <Link to={queue.back} className={buttonClass("primary", "md", "min-h-11")}>
        Nothing further in this queue: back to it
      </Link>
    );
  return (
    <Link to={queue.next} className={buttonClass("primary", "md", "min-h-11")}>
      Next report →
    </Link>
  );
}
