import { z } from "zod";
import { readDb } from "~/db.server";
import { RANGES } from "~/domain";
import { slugField } from "~/domain/slug-field";
import { adjustedAtReference, predictAt } from "~/stats/cells";
import { cellBySlugs } from "~/stats/cells.server";
import type { Route } from "./+types/api.stats.cell";

const query = z.object({
  model: slugField(),
  job: slugField(),
  inlet_kpa: z.coerce.number().min(RANGES.gaugePressure.min).max(RANGES.gaugePressure.max).optional(),
});

// One stored cell as JSON, with the pressure-adjusted success at `inlet_kpa` where a fit exists.
export async function loader({ request }: Route.LoaderArgs) {
  const parsed = query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success)
    return Response.json(
      {
        error: `Give model and job as slugs, and inlet_kpa between ${RANGES.gaugePressure.min} and ${RANGES.gaugePressure.max}`,
      },
      { status: 400 },
    );
  const cell = await cellBySlugs(readDb, parsed.data.model, parsed.data.job);
  if (!cell) return Response.json({ error: "No accepted reports for this tool on this job" }, { status: 404 });
  const at = parsed.data.inlet_kpa;
  return Response.json(
    {
      model: cell.model_slug,
      job: cell.job_slug,
      n: cell.n,
      successes: cell.successes,
      estimate: cell.estimate,
      lower: cell.lower,
      upper: cell.upper,
      method: "Wilson score",
      confidence: cell.confidence,
      reporters: cell.reporters,
      design_effect: cell.design_effect,
      effective_n: cell.effective_n,
      set_aside: cell.set_aside,
      shrunk_estimate: cell.shrunk_estimate,
      pressure_adjusted: adjustedAtReference(cell),
      pressure_adjusted_reason: cell.adj_reason,
      at_inlet: at != null && cell.fit ? { inlet_kpa: at, ...predictAt(cell.fit, at) } : null,
      computed_at: cell.computed_at,
    },
    { headers: { "Cache-Control": "public, max-age=60" } },
  );
}
