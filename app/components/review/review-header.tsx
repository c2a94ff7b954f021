import { Form } from "react-router";
import { formatDate, formatTime, toolName } from "~/domain";
import { QueueNav, type Queue } from "~/components/review/queue-nav";
import { buttonClass } from "~/components/ui";
import type { ReviewData } from "~/moderation/review.server";
import { reporterRecord } from "~/moderation/trust";

type Props = {
  review: Pick<ReviewData, "report" | "history" | "own" | "claim">;
  queue: Queue;
  accepts: number;
  canDecide: boolean;
  free: boolean;
  busy: boolean;
};

/** Which report this is, who holds it, and the button that starts the review. */
export function ReviewHeader({ review, queue, accepts, canDecide, free, busy }: Props) {
  const { report: r, history, own, claim } = review;
  const waiting = r.status === "submitted";
  const until = (at: Date | string | null) => (at ? formatTime(at) : "");
  return (
    <header>
      <QueueNav queue={queue} />
      <h1 className="break-words text-2xl font-bold">
        Report #{r.id} · {toolName(r.maker, r.model_code)} · {r.job}
      </h1>
      <p className="text-sm text-stone-600">
        By {r.reporter} ({reporterRecord(history)}) · submitted {formatDate(r.submitted_at)} · version {r.version} ·
        status {r.status}
        {accepts > 0 && waiting ? ` · accepted once, waiting for a second look` : ""}
      </p>
      {own && (
        <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">
          This is your own report: you cannot decide on it.
        </p>
      )}
      {claim?.holder && (
        <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">
          {claim.holder} has this report open until {until(claim.expiresAt)}. You can read it; deciding waits.
        </p>
      )}
      {claim?.mine && <p className="mt-2 text-sm text-stone-600">Held for you until {until(claim.expiresAt)}.</p>}
      {claim?.alreadyAccepted && waiting && (
        <p className="mt-2 text-sm text-stone-600">
          You accepted this version; the second look is another moderator's.
        </p>
      )}
      {canDecide && (
        <a href="#decide" className="mt-2 inline-flex min-h-11 items-center text-sm text-bay-700 underline lg:hidden">
          Go to the decision ↓
        </a>
      )}
      {waiting && free && (
        <Form method="post" className="mt-2 flex flex-wrap items-center gap-3">
          <button
            type="submit"
            name="intent"
            value="claim"
            disabled={busy}
            className={buttonClass("secondary", "md", "min-h-11")}
          >
            Start this review
          </button>
          <span className="text-sm text-stone-600">
            Holds the report for you for 15 minutes, so nobody else checks it at the same time.
          </span>
        </Form>
      )}
    </header>
  );
}
