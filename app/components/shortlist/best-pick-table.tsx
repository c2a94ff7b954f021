// The chance each candidate is the best pick under the shopper's own weights: a probability with its
// simulation error, the number of draws and the seed — never a points total.
import { formatChance } from "~/domain";
import type { Candidate, Shortlist } from "~/exposure/shortlist";
import { CRITERION_LABELS, type ShortlistCriterion, WEIGHT_CHOICES } from "~/exposure/shortlist-form";

export function BestPickTable({
  best,
  passing,
  weighed,
}: {
  best: NonNullable<Shortlist["best"]>;
  passing: Candidate[];
  /** The criteria with their weights, as the shopper set them. */
  weighed: { key: ShortlistCriterion; weight: number }[];
}) {
  const label = new Map(passing.map((c) => [c.slug, c.label]));
  const rows = [...best.chances].sort((a, b) => b.chance - a.chance || a.id.localeCompare(b.id));
  return (
    <section aria-labelledby="best-heading" className="space-y-2">
      <h3 id="best-heading" className="font-semibold">
        How often each would be your best pick
      </h3>
      <table className="w-full text-left text-sm" data-testid="best-pick">
        <caption className="sr-only">Chance each tool comes out first under your weights</caption>
        <thead className="text-xs uppercase text-stone-600">
          <tr>
            <th className="py-1 pr-2">Tool</th>
            <th className="py-1 pr-2">Chance it is the best pick</th>
            <th className="py-1">Simulation error</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-t border-stone-100">
              <td className="py-1 pr-2">{label.get(r.id)}</td>
              <td className="py-1 pr-2">
                <span
                  className="inline-block h-2 rounded bg-bay-600 align-middle"
                  style={{ width: `${r.chance * 6}rem` }}
                />{" "}
                {formatChance(r.chance)}
              </td>
              <td className="py-1">± {(r.standardError * 100).toFixed(1)} points of percent</td>
            </tr>
          ))}
        </tbody>
      </table>
      {
        <p className="text-xs text-stone-600">
          From {best.draws.toLocaleString("en-US")} draws (seed {best.seed}). Each draw takes every tool's figures from
          their uncertainty — chances from the Jeffreys Beta(s + ½, f + ½) posterior of the reports (at the effective
          count, reports ÷ design effect) or from the pressure fit's band on the logit scale, times and vibration shares
          from their 95 % intervals on the log scale, weight and price as they are — ranks the tools on each criterion,
          adds the ranks times your weights, and counts how often each comes first (ties shared). Criteria weighed:{" "}
          {weighed
            .map(
              (w) =>
                `${CRITERION_LABELS[w.key].toLowerCase()} (${WEIGHT_CHOICES.find((c) => c.value === w.weight)?.label})`,
            )
            .join(", ")}
          . The simulation error is √(p(1 − p) / draws); another seed moves a figure by about that.
          {best.leftOut.length > 0 && ` Left out for want of a figure you weighed: ${best.leftOut.join(", ")}.`}
          {best.notes.length > 0 && ` ${best.notes.join(" ")}`}
        </p>
      }
    </section>
  );
}
