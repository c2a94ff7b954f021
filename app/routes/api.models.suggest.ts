import { z } from "zod";
import { readDb } from "~/db.server";
import { toolName } from "~/domain";
import { suggestModels } from "~/reports/reports.server";
import type { Route } from "./+types/api.models.suggest";

const query = z.object({ q: z.string().trim().max(80).default("") });

// Public: the catalogue is public. Suggestions for the report form's tool field.
export async function loader({ request }: Route.LoaderArgs) {
  const parsed = query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) return Response.json({ error: "q must be at most 80 characters" }, { status: 400 });
  const models = parsed.data.q.length < 1 ? [] : await suggestModels(readDb, parsed.data.q);
  return Response.json({
    suggestions: models.map((m) => ({
      slug: m.slug,
      label: toolName(m.maker_name, m.model_code),
      detail: `${m.name} · ${m.category_name}`,
      categorySlug: m.category_slug,
      action: m.action,
      maxInletKpa: m.max_inlet_kpa,
    })),
  });
}
