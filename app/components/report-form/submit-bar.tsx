import type { loadEditor } from "~/reports/editor.server";

type Props = {
  submitting: boolean;
  status: Awaited<ReturnType<typeof loadEditor>>["status"];
  reportId: number | null;
};

/** The buttons kept at the bottom of the screen: submit, save the draft, withdraw. */
export function SubmitBar({ submitting, status, reportId }: Props) {
  return (
    <div className="sticky bottom-0 z-10 flex flex-col gap-2 border-t border-stone-200 bg-bay-50 py-3 sm:flex-row">
      <button
        type="submit"
        name="intent"
        value="submit"
        disabled={submitting}
        className="min-h-12 flex-1 rounded bg-bay-700 px-4 py-3 text-lg font-semibold text-white disabled:opacity-60"
      >
        {submitting ? "Sending…" : status === "returned" ? "Resubmit" : "Submit report"}
      </button>
      <div className="flex gap-2">
        <button
          type="submit"
          name="intent"
          value="save-draft"
          formNoValidate
          className="min-h-12 flex-1 rounded border border-stone-400 bg-white px-4 py-3 font-semibold"
        >
          Save draft
        </button>
        {reportId && (
          <button
            type="submit"
            name="intent"
            value="withdraw"
            formNoValidate
            className="min-h-12 flex-1 rounded border border-stone-400 bg-white px-4 py-3 font-semibold"
          >
            Withdraw
          </button>
        )}
      </div>
    </div>
  );
}
