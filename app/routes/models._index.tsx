import { Link } from "react-router";
import { groupBy } from "~/utils/group";
import { db } from "~/db.server";
import { listModels } from "~/catalogue/queries.server";
import { FITTING_LABELS, formatPrice } from "~/catalogue/format";
import type { Route } from "./+types/models._index";

export async function loader() {
  return { models: await listModels(db) };
}

export default function Models({ loaderData }: Route.ComponentProps) {
  const byCategory = groupBy(loaderData.models, (m) => m.category_name);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Tools</h1>
      {[...byCategory].map(([category, models]) => (
        <section key={category} aria-labelledby={`cat-${category}`}>
          <h2 id={`cat-${category}`} className="mb-2 text-lg font-semibold text-bay-700">{category}</h2>
          <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
            <table className="w-full min-w-[36rem] text-left text-sm">
              <thead className="bg-stone-100 text-xs uppercase text-stone-600">
                <tr>
                  <th className="px-3 py-2">Tool</th>
                  <th className="px-3 py-2">Fitting</th>
                  <th className="px-3 py-2 text-right">Weight</th>
                  <th className="px-3 py-2 text-right">Price</th>
                  <th className="px-3 py-2 text-right">Accepted reports</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-stone-100">
                {models.map((m) => (
                  <tr key={m.slug}>
                    <td className="px-3 py-2">
                      <Link to={`/models/${m.slug}`} className="font-semibold text-bay-700 hover:underline">
                        {m.maker_name} {m.model_code}
                      </Link>
                      <div className="text-xs text-stone-500">{m.name}</div>
                    </td>
                    <td className="px-3 py-2">{FITTING_LABELS[m.fitting]}</td>
                    <td className="px-3 py-2 text-right">{m.weight_kg.toFixed(2)} kg</td>
                    <td className="px-3 py-2 text-right">{formatPrice(m.street_price_cents)}</td>
                    <td className="px-3 py-2 text-right">{m.accepted_reports}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ))}
    </div>
  );
}

export function meta() {
  return [{ title: "Tools — Bayproof" }];
}
