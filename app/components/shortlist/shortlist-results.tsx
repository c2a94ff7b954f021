// What the shortlist answers: the tools that pass (each can be ticked to compare), why the others do
// not, the trade-off picture, the chance each is the best pick, and a day's exposure with its cautions.
import { Link } from "react-router";
import {
  formatChance,
  formatFlow,
  formatLength,
  formatPressure,
  formatPrice,
  formatWeight,
  type Units,
} from "~/domain";
import type { JobShortlist } from "~/exposure/shortlist.server";
import { buttonClass } from "../ui";
import { BestPickTable } from "./best-pick-table";
import { DayExposure } from "./day-exposure";
import { TradeOffs } from "./trade-off-chart";

export function ShortlistResults({ jobSlug, data, units }: { jobSlug: string; data: JobShortlist; units: Units }) {
  const { shortlist, ask, hasSupply } = data;
  const { passing, excluded } = shortlist;
  return (
    <div className="space-y-5">
      <form method="get" action="/compare" aria-labelledby="shortlist-heading">
        <h3 id="shortlist-heading" className="font-semibold" aria-live="polite">
          {passing.length} of {passing.length + excluded.length} tools pass
        </h3>
        <input type="hidden" name="job" value={jobSlug} />
        {passing.length > 0 && (
          <div className="which-tool-stack sm:overflow-x-auto">
            <table className="w-full text-left text-sm sm:min-w-[40rem]">
              <thead className="bg-stone-100 text-xs uppercase text-stone-600">
                <tr>
                  <th className="px-3 py-2">Tool</th>
                  <th className="px-3 py-2">{hasSupply ? "Reaches the tool" : "Air it draws running"}</th>
                  <th className="px-3 py-2">{hasSupply ? "Chance it frees the job there" : "Rate in the reports"}</th>
                  <th className="px-3 py-2">Price · weight · length</th>
                  <th className="px-3 py-2">Would also need</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-stone-100 align-top" data-testid="shortlist">
                {passing.map((c) => (
                  <tr key={c.slug}>
                    <td className="px-3 py-2">
                      <label className="flex items-start gap-2">
                        <input type="checkbox" name="models" value={c.slug} className="mt-1 h-5 w-5" />
                        <span className="sr-only">Compare </span>
                        <span className="font-semibold">{c.label}</span>
                      </label>
                      <Link to={`/models/${c.slug}`} className="ml-7 text-xs text-bay-700 underline">
                        tool page
                      </Link>
                    </td>
                    <td className="px-3 py-2">
                      {c.inletKpa != null && formatPressure(c.inletKpa, units)}
                      <div className="text-xs text-stone-600">draws {formatFlow(c.demandLps, units)} running</div>
                    </td>
                    <td className="px-3 py-2">
                      {formatChance(c.chance.estimate)}{" "}
                      <span className="text-stone-500">
                        ({formatChance(c.chance.lower)}–{formatChance(c.chance.upper)})
                      </span>
                      {c.chance.basis === "rate" && hasSupply && (
                        <div className="text-xs text-stone-600">
                          reports' rate: {c.chanceNote ?? "no pressure fit for this tool"}
                        </div>
                      )}
                      {c.chance.extrapolating && (
                        <div className="text-xs text-amber-700">
                          outside the pressures reported for it — an extrapolation
                        </div>
                      )}
                    </td>
                    <td className="px-3 py-2">
                      {formatPrice(c.priceCents)} · {formatWeight(c.weightKg, units)} ·{" "}
                      {formatLength(c.lengthMm, units)}
                    </td>
                    <td className="px-3 py-2 text-xs">{c.needs.length ? c.needs.join("; ") : "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-2 text-xs text-stone-600">
              {hasSupply
                ? "Pressure at the tool while it runs, from the air it draws (the catalogue's running figure, or its rated average times a stated factor) through your regulator, couplers and hose (an estimate); chance from the job's pooled logistic fit on inlet pressure, with 95 % bands; tools without a fit show the rate of their reports (clustered Wilson, 95 %)."
                : "Rates of the accepted reports (clustered Wilson, 95 %). Give your regulator, hose and couplers for the chance at the pressure your air leaves each tool."}{" "}
              Ordered by the lower end of the band.
            </p>
            <button type="submit" className={buttonClass("secondary", "sm", "mt-2")}>
              Compare the ticked tools →
            </button>
            <p className="mt-1 text-xs text-stone-600">Tick any two to four; the comparison takes four at a time.</p>
          </div>
        )}
      </form>

      {excluded.length > 0 && (
        <details open={excluded.length <= 6}>
          <summary className="cursor-pointer text-sm font-semibold">
            {excluded.length} {excluded.length === 1 ? "tool does" : "tools do"} not pass
          </summary>
          <ul className="mt-1 space-y-1 text-sm" data-testid="excluded">
            {excluded.map((x) => (
              <li key={x.slug}>
                <Link to={`/models/${x.slug}`} className="text-bay-700 underline">
                  {x.label}
                </Link>
                : {x.reasons.join("; ")}
              </li>
            ))}
          </ul>
        </details>
      )}

      {passing.length > 1 && <TradeOffs shortlist={shortlist} units={units} jobsPerDay={ask.jobsPerDay} />}
      {shortlist.best && (
        <BestPickTable
          best={shortlist.best}
          passing={passing}
          weighed={shortlist.criteria.map((key) => ({ key, weight: ask.weights[key] }))}
        />
      )}
      {passing.length > 0 && <DayExposure shortlist={shortlist} jobsPerDay={ask.jobsPerDay} basis={ask.basis} />}
    </div>
  );
}
