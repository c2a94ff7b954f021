// The /models filters and sort, read leniently from the URL: whatever parses is applied, the rest
// is named in a note. Shared by the page, its resource route and the browser.
import { z } from "zod";
import { FITTINGS } from "~/domain";
import { slugField } from "~/domain/slug-field";

export const SORTABLE = ["tool", "price", "weight", "length", "reports", "success"] as const;
export type SortKey = (typeof SORTABLE)[number];

const fields = {
  category: slugField("category"),
  fitting: z.enum(FITTINGS, { error: "fitting" }),
  job: slugField("job"),
  maxPrice: z.coerce.number({ error: "maximum price" }).min(0, "maximum price").max(100_000, "maximum price"),
  maxWeight: z.coerce.number({ error: "maximum weight" }).gt(0, "maximum weight").max(50, "maximum weight"),
  minReports: z.coerce
    .number({ error: "minimum reports" })
    .int("minimum reports")
    .min(0, "minimum reports")
    .max(100_000, "minimum reports"),
  sort: z.enum(SORTABLE, { error: "sort" }),
  dir: z.enum(["asc", "desc"], { error: "direction" }),
};

export type ModelFilters = Partial<{ [K in keyof typeof fields]: z.output<(typeof fields)[K]> }>;

export function parseModelFilters(params: URLSearchParams): { filters: ModelFilters; ignored: string[] } {
  const filters: Record<string, unknown> = {};
  const ignored: string[] = [];
  for (const [key, schema] of Object.entries(fields)) {
    const raw = params.get(key);
    if (raw == null || raw === "") continue;
    const parsed = schema.safeParse(raw.slice(0, 200));
    if (parsed.success) filters[key] = parsed.data;
    else ignored.push(key);
  }
  return { filters, ignored };
}

export function filtersToSearch(f: ModelFilters): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== "") p.set(k, String(v));
  return p.toString();
}
