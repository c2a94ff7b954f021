// `npm run bench:catalogue`: the /models table and search suggestions at catalogue scale. A
// throwaway database with 400 models and 40 job types (50,000 reports), the local search fake
// filled from it; prints the median time of the /models query over every combination of its
// filters, and of search suggestions. Figures only. The PostgreSQL and search fake it starts are
// stopped, and the cluster's folder deleted, however the run ends.
import { startSearchService } from "../fakes/search";
import { buildBenchData } from "./bench-data";
import { benchCluster } from "./bench-cluster";
import { freePort } from "./free-port";

const medianOf = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;
let searchService: Awaited<ReturnType<typeof startSearchService>> | null = null;

await benchCluster(
  async ({ db }) => {
    searchService = await startSearchService({ port: await freePort() });
    await buildBenchData(db, 50_000);
    const { refreshAll } = await import("../app/stats/refresh.server");
    await refreshAll(db);
    const { modelsTable } = await import("../app/catalogue/models-table.server");
    const { reindexAll, search, searchClient } = await import("../app/search/search.server");

    const choices = {
      category: "bench-cat-1",
      fitting: "shank-0.401" as const,
      job: "bench-job-1",
      maxPrice: 150,
      maxWeight: 2,
      minReports: 10,
    };
    const keys = Object.keys(choices) as (keyof typeof choices)[];
    const sorts = ["tool", "price", "weight", "reports", "success"] as const;
    const times: number[] = [];
    for (let mask = 0; mask < 1 << keys.length; mask++) {
      const f: Record<string, unknown> = { sort: sorts[mask % sorts.length], dir: mask % 2 ? "desc" : "asc" };
      keys.forEach((k, i) => {
        if (mask & (1 << i)) f[k] = choices[k];
      });
      const t0 = performance.now();
      await modelsTable(db, f);
      times.push(performance.now() - t0);
    }

    const client = searchClient(searchService.url);
    const docs = await reindexAll(db, client);
    const queries = ["bench", "bnech mod", "b-12", "bench job 3", "maker 4", "model b-3", "bench cat", "b-399"];
    const suggest: number[] = [];
    for (let i = 0; i < 80; i++) {
      const t0 = performance.now();
      await search(db, queries[i % queries.length]!, {}, 8, client, { facets: false }); // as /api/search asks
      suggest.push(performance.now() - t0);
    }
    console.log(
      `/models query, ${times.length} filter combinations   ${medianOf(times).toFixed(1)} ms median (goal < 50 ms)`,
    );
    console.log(
      `search suggestions, ${docs.toLocaleString("en-US")} documents     ${medianOf(suggest).toFixed(1)} ms median (goal < 30 ms)`,
    );
  },
  { onStop: () => searchService?.stop() },
);
