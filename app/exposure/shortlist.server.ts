// The job page's shortlist: the job's stored cells, the catalogue figures the constraints need, and
// the shopper's ask from the address, handed to the pure buildShortlist.
import type { Db } from "../../db/database";
import { toolName, type Units } from "~/domain";
import type { JobStandings } from "~/stats/cells.server";
import { readSupply } from "~/stats/supply-query";
import type { Supply } from "~/stats/which-tool";
import { buildShortlist, type Shortlist, type ShortlistTool } from "./shortlist";
import { type ShortlistAsk, readShortlist } from "./shortlist-form";

interface ModelFigures {
  lengthMm: number;
  ahv: number | null;
  ahvK: number | null;
  lpa: number | null;
  lpaK: number | null;
}

/** The catalogue figures of the job's tools that the cells do not carry. */
async function modelFigures(db: Db, slugs: readonly string[]) {
  if (slugs.length === 0) return new Map<string, ModelFigures>();
  const rows = await db
    .selectFrom("tool_models")
    .select(["slug", "length_mm", "vibration_ahv_ms2", "vibration_k_ms2", "sound_pressure_db", "sound_pressure_k_db"])
    .where("slug", "in", slugs)
    .execute();
  return new Map<string, ModelFigures>(
    rows.map((r) => [
      r.slug,
      {
        lengthMm: r.length_mm,
        ahv: r.vibration_ahv_ms2,
        ahvK: r.vibration_k_ms2,
        lpa: r.sound_pressure_db,
        lpaK: r.sound_pressure_k_db,
      },
    ]),
  );
}

/** Shortlists built lately, by their whole input (most recent last). */
const built = new Map<string, Shortlist>();
const BUILT_KEPT = 200;

/**
 * buildShortlist, remembered by its whole input: the best-pick simulation (4,000 draws per tool) is
 * most of a job page's work, and every signed-in view of the same job and ask would redo it. The
 * key is the input itself (the tools' stored figures, the ask with its seed, the supply, the
 * units), so a stats refresh or a catalogue change makes a new key: nothing is served stale.
 * The result is shared: callers must not change it.
 */
function shortlistOf(tools: ShortlistTool[], ask: ShortlistAsk, supply: Supply | null, units: Units): Shortlist {
  const key = JSON.stringify([tools, ask, supply, units]);
  const hit = built.get(key);
  if (hit) {
    built.delete(key);
    built.set(key, hit);
    return hit;
  }
  const shortlist = buildShortlist(tools, ask, supply, units);
  built.set(key, shortlist);
  if (built.size > BUILT_KEPT) built.delete(built.keys().next().value!);
  return shortlist;
}

/**
 * The shortlist for the address's ask. A supply that does not parse leaves the shortlist without
 * "at your air" figures and says why (`note`); each other field that does not parse has its message.
 */
export async function jobShortlist(db: Db, standings: JobStandings, search: Record<string, string>, units: Units) {
  const asked = readSupply(search);
  const { ask, errors } = readShortlist(search, units.system);
  const cells = standings.rows.map((r) => r.cell);
  const figures = await modelFigures(
    db,
    cells.map((c) => c.model_slug),
  );
  const tools: ShortlistTool[] = cells.map((c) => {
    const f = figures.get(c.model_slug);
    return {
      slug: c.model_slug,
      label: toolName(c.maker_name, c.model_code),
      fitting: c.fitting,
      weightKg: c.weight_kg,
      lengthMm: f?.lengthMm ?? 0,
      priceCents: c.street_price_cents,
      air: {
        ratedLps: c.rated_air_lps,
        runningLps: c.running_air_lps,
        runningSource: c.running_air_source,
        runningFactor: c.running_air_factor,
      },
      fit: c.fit,
      adjReason: c.adj_reason,
      n: c.n,
      successes: c.successes,
      designEffect: c.design_effect,
      rate: { estimate: c.estimate, lower: c.lower, upper: c.upper },
      km: { median: c.km_median_s, lower: c.km_lower_s, upper: c.km_upper_s },
      ahv: f?.ahv ?? null,
      ahvK: f?.ahvK ?? null,
      lpa: f?.lpa ?? null,
      lpaK: f?.lpaK ?? null,
    };
  });
  const supply = asked?.supply ?? null;
  return {
    ask,
    errors,
    supplyNote: asked?.note ?? null,
    hasSupply: supply != null,
    shortlist: shortlistOf(tools, ask, supply, units),
  };
}

export type JobShortlist = Awaited<ReturnType<typeof jobShortlist>>;
