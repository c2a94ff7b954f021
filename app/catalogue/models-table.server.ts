// The /models table: one row per tool model with its stored-cell figures, filtered and sorted in SQL.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import type { ModelFilters } from "./model-filters";

export async function modelsTable(db: Db, f: ModelFilters) {
  let q = db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select([
      "m.slug",
      "m.model_code",
      "m.name",
      "m.fitting",
      "m.weight_kg",
      "m.length_mm",
      "m.street_price_cents",
      "mk.name as maker_name",
      "c.name as category_name",
      "c.slug as category_slug",
      sql<number>`coalesce((select sum(s.n + s.set_aside)::int from stats_cells s where s.tool_model_id = m.id), 0)`.as(
        "reports",
      ),
      sql<number>`(select count(*)::int from stats_cells s where s.tool_model_id = m.id)`.as("jobs_with_reports"),
    ])
    // The chosen job's cell (none when no job is chosen: the join then matches nothing).
    .leftJoin("job_types as jf", (j) => j.on("jf.slug", "=", f.job ?? ""))
    .leftJoin("stats_cells as sc", (j) =>
      j.onRef("sc.tool_model_id", "=", "m.id").onRef("sc.job_type_id", "=", "jf.id"),
    )
    .select(["sc.n as job_n", "sc.estimate as job_estimate", "sc.lower as job_lower", "sc.upper as job_upper"]);
  if (f.job) q = q.where("c.id", "=", sql<number>`(select category_id from job_types where slug = ${f.job})`);
  if (f.category) q = q.where("c.slug", "=", f.category);
  if (f.fitting) q = q.where("m.fitting", "=", f.fitting);
  if (f.maxPrice != null) q = q.where("m.street_price_cents", "<=", Math.round(f.maxPrice * 100));
  if (f.maxWeight != null) q = q.where("m.weight_kg", "<=", f.maxWeight);
  if (f.minReports != null)
    q = q.where(
      sql<number>`coalesce((select sum(s.n + s.set_aside) from stats_cells s where s.tool_model_id = m.id), 0)`,
      ">=",
      f.minReports,
    );
  const dir = f.dir === "desc" ? sql`desc` : sql`asc`;
  const order = {
    tool: sql`mk.name ${dir}, m.model_code ${dir}`,
    price: sql`m.street_price_cents ${dir} nulls last`,
    weight: sql`m.weight_kg ${dir}`,
    length: sql`m.length_mm ${dir}`,
    reports: sql`reports ${dir}`,
    // The interval's lower bound, as everywhere a list must be ordered by success.
    success: f.job ? sql`sc.lower ${dir} nulls last` : sql`reports ${dir}`,
  }[f.sort ?? "tool"];
  return q.orderBy(order).orderBy("m.slug").limit(500).execute();
}

export type ModelTableRow = Awaited<ReturnType<typeof modelsTable>>[number];

export async function filterOptions(db: Db) {
  const [categories, jobs] = await Promise.all([
    db.selectFrom("tool_categories").select(["slug", "name"]).orderBy("name").execute(),
    db
      .selectFrom("job_types as j")
      .innerJoin("tool_categories as c", "c.id", "j.category_id")
      .select(["j.slug", "j.name", "c.name as category"])
      .orderBy("c.name")
      .orderBy("j.name")
      .execute(),
  ]);
  return { categories, jobs };
}
