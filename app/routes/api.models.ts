import { modelsTable } from "~/catalogue/models-table.server";
import { parseModelFilters } from "~/catalogue/model-filters";
import { readDb } from "~/db.server";
import type { Route } from "./+types/api.models";

// The /models table's rows as JSON, for the page's client-side updates (and anyone else).
export async function loader({ request }: Route.LoaderArgs) {
  const { filters, ignored } = parseModelFilters(new URL(request.url).searchParams);
  return Response.json({ rows: await modelsTable(readDb, filters), filters, ignored });
}
