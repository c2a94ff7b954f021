// The compare page's address: a job, two to four tools (as "a,b" or as repeated `models`), and
// the inlet pressure to read the pressure fit at. Read what parses; say plainly what did not.
import { z } from "zod";

const slug = z
  .string()
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, "Tools and jobs are named by their address, like bh-260l")
  .max(80);
const schema = z.object({
  job: slug.optional(),
  models: z.array(slug).max(4, "Pick at most four tools"),
  psi: z.coerce
    .number({ error: "Pressure: a number of psi" })
    .min(40, "Pressure: 40–200 psi")
    .max(200, "Pressure: 40–200 psi")
    .default(90),
});

export interface CompareQuery {
  job: string | null;
  models: string[];
  psi: number;
  /** What could not be used, for the page to say; null when all was fine. */
  problem: string | null;
}

export function readCompareQuery(params: URLSearchParams): CompareQuery {
  const models = [
    ...new Set(
      params
        .getAll("models")
        .flatMap((v) => v.split(","))
        .map((x) => x.trim())
        .filter(Boolean),
    ),
  ];
  const raw = { job: params.get("job") || undefined, models, psi: params.get("psi") || undefined };
  const parsed = schema.safeParse(raw);
  if (parsed.success)
    return { job: parsed.data.job ?? null, models: parsed.data.models, psi: parsed.data.psi, problem: null };
  const jobOk = slug.safeParse(raw.job).success;
  return {
    job: jobOk ? raw.job! : null,
    models: models.filter((m) => slug.safeParse(m).success).slice(0, 4),
    psi: 90,
    problem: parsed.error.issues[0]?.message ?? "Could not read the choice",
  };
}
