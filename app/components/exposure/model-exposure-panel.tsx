// The model page's exposure panel: the declared vibration and noise, and a day of N jobs of each job
// type reported with this tool, timed by the job's median time to free it (give-ups counted).
import { Link } from "react-router";
import { formatDuration } from "~/domain";
import type { ModelExposure } from "~/exposure/pages.server";
import { Card } from "../ui";
import { ExposureSettings } from "./basis-fields";
import { ExposureCautions } from "./cautions";
import { DayFigures, DeclaredValues, shareText, TIME_FROM, withInterval } from "./figures";

export function ModelExposurePanel({ exposure, modelSlug }: { exposure: ModelExposure; modelSlug: string }) {
  const { declared, perDay, basis, jobs } = exposure;
  return (
    <Card as="section" aria-labelledby="exposure-heading" className="space-y-3">
      <h2 id="exposure-heading" className="font-semibold">
        Hands and ears: a day with this tool
      </h2>
      {declared ? <DeclaredValues d={declared} /> : <p className="text-sm">No declared figures yet.</p>}
      <ExposureSettings perDay={perDay} basis={basis} id="exposure-perday" />
      {jobs.length === 0 && <p className="text-sm text-stone-600">No accepted reports yet, so no job times.</p>}
      <ul className="space-y-4">
        {jobs.map((j, i) => (
          <li key={j.slug} className="border-t border-stone-100 pt-3">
            <details open={i === 0} className="space-y-2">
              <summary className="cursor-pointer text-sm font-semibold">
                {`${perDay} × ${j.name}`}
                {j.day ? ` — ${shareText(j.day.shareOfActionValue.estimate)} of the action dose` : ""}
              </summary>
              {j.minutes ? (
                <p className="text-xs text-stone-700">
                  {withInterval(j.minutes, (m) => formatDuration(m * 60))} a job: {TIME_FROM[j.minutes.from]}, from{" "}
                  {j.n} reports
                </p>
              ) : (
                <p className="text-xs text-stone-700">No time per job yet from the {j.n} reports.</p>
              )}
              {j.day ? <DayFigures day={j.day} /> : null}
            </details>
          </li>
        ))}
      </ul>
      <p className="text-sm">
        <Link to={`/day?tool=${modelSlug}&job=${jobs[0]?.slug ?? ""}&n=${perDay}`} className="text-bay-700 underline">
          Mix tools and jobs in a whole day →
        </Link>
      </p>
      <ExposureCautions />
    </Card>
  );
}
