import { formatTime } from "~/domain";
import type { loadEditor } from "~/reports/editor.server";

type Props = {
  status: Awaited<ReturnType<typeof loadEditor>>["status"];
  pu: string;
  metric: boolean;
  savedAt: string | null;
  reportId: number | null;
};

/** The editor's title, the account's units and whether the draft is saved. */
export function EditorHeader({ status, pu, metric, savedAt, reportId }: Props) {
  return (
    <header>
      <h1 className="text-2xl font-bold">
        {status === "returned" ? "Fix and resubmit your report" : "File a report from the bay"}
      </h1>
      <p className="text-sm text-stone-600">
        One job with one tool. Units follow your account ({pu}, {metric ? "mm and m" : "in and ft"}).{" "}
        {savedAt ? (
          <span role="status">Draft saved {formatTime(savedAt)}.</span>
        ) : reportId ? (
          "Saved as a draft."
        ) : (
          "Saved as a draft as soon as the tool and the job are picked."
        )}
      </p>
    </header>
  );
}
