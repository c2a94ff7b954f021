import { SafetyCautions } from "~/components/safety-cautions";
import { FLAG_EXPLANATIONS, type FlagCode } from "~/moderation/flags";
import type { ReviewData } from "~/moderation/review.server";

/** The report's flags, with the safety cautions when the inlet ran above the tool's rating. */
export function ReviewFlags({ report: r }: { report: Pick<ReviewData["report"], "flags" | "category_action"> }) {
  return (
    <section className="rounded-lg border border-amber-300 bg-amber-50 p-3">
      <h2 className="font-semibold">Flags</h2>
      <ul className="mt-1 space-y-1 text-sm">
        {r.flags.map((f) => (
          <li key={f}>
            <span className="font-semibold">⚑ {f.replaceAll("_", " ")}</span> — {FLAG_EXPLANATIONS[f as FlagCode] ?? ""}
          </li>
        ))}
      </ul>
      {r.flags.includes("above_rated_inlet") && (
        <div className="mt-2">
          <SafetyCautions action={r.category_action} />
        </div>
      )}
    </section>
  );
}
