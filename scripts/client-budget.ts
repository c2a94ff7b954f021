// `npm run check:client-budget`: the JavaScript each page makes the browser download, from the
// production build's Vite manifest (build/client/.vite/manifest.json, kept by vite.config.ts).
// A page loads the client entry, the root route and its own route module, each with every chunk
// it imports statically (chunks it imports on demand load later, when used, and are listed
// apart). Prints each page's gzipped size and fails above BUDGET_KB, except the report form, which
// carries the upload widget and the form's own checks. Resource routes (no component) ship none.
// Run it after `npm run build`; tests/start/client-budget.test.ts runs it in CI.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { gzipSync } from "node:zlib";

/** Gzipped kilobytes (1 kB = 1,000 bytes) a page may ship. */
export const BUDGET_KB = 130;
/** Route files allowed above the budget, and why. */
export const EXEMPT: Record<string, string> = {
  "reports.edit": "the report form: evidence uploads and the form's checks in the browser",
};
/**
 * Pages still above the budget, each held at a ceiling it may not grow past (gzipped kB) until its
 * own work brings it under. Every one runs what it ships; what would bring it down is noted.
 */
export const CEILINGS: Record<string, { kb: number; why: string }> = {
  air: { kb: 155, why: "the calculator's line model and form schema (zod) run in the browser" },
  "models._index": { kb: 158, why: "the tools table and its filter schema (zod) run in the browser" },
  data: { kb: 150, why: "zod through the feed's documents module (citation, licence): move those down" },
  "review._index": { kb: 149, why: "the queue's filter schema (zod) runs in the browser, with the bench queue" },
  "review.bench.$id": { kb: 153, why: "the bench checklist's decision schema (zod) and the trace preview" },
  "bench.runs.edit": { kb: 150, why: "the run form's schema (zod) and the trace analysis preview run in the browser" },
  "jobs.$slug": { kb: 137, why: "the shortlist's form, the trade-off chart and the force curve: split the charts out" },
  "models.$slug": { kb: 135, why: "the bench, exposure and evidence panels: load the charts on demand" },
  account: { kb: 144, why: "the account forms' schemas (zod) run in the browser" },
  compare: { kb: 133, why: "the pressure curves are computed and drawn in the browser (d3-shape)" },
};

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

export interface RouteWeight {
  /** The route module's file under app/routes, without its extension ("jobs.$slug"). */
  route: string;
  files: number;
  rawKb: number;
  gzipKb: number;
  /** Chunks the page may load later on demand (import()), gzipped, not counted in gzipKb. */
  onDemandKb: number;
  over: boolean;
  exempt: string | null;
}

const ROUTE_KEY = /^app\/routes\/(.+)\.[jt]sx?\?__react-router-build-client-route$/;
const ROOT_KEY = /^app\/root\.[jt]sx?\?__react-router-build-client-route$/;
const ENTRY_KEY = /entry\.client\.[jt]sx?$/;

/** Every chunk `keys` load before the page runs (static imports, followed to the end). */
function closure(manifest: Manifest, keys: string[]) {
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    const chunk = manifest[key];
    if (!chunk) throw new Error(`the manifest names ${key} but has no entry for it`);
    seen.add(key);
    for (const i of chunk.imports ?? []) visit(i);
  };
  keys.forEach(visit);
  return seen;
}

/** Each page's JavaScript, from the build in `clientDir` (build/client). */
export function routeWeights(clientDir: string): RouteWeight[] {
  const manifestFile = path.join(clientDir, ".vite/manifest.json");
  if (!existsSync(manifestFile))
    throw new Error(`${manifestFile} is missing: build the app first (npm run build), with build.manifest on`);
  const manifest = JSON.parse(readFileSync(manifestFile, "utf8")) as Manifest;
  const keys = Object.keys(manifest);
  const entry = keys.find((k) => manifest[k]!.isEntry && ENTRY_KEY.test(k));
  const root = keys.find((k) => ROOT_KEY.test(k));
  if (!entry || !root) throw new Error("the manifest has no client entry or no root route");

  const sizes = new Map<string, { raw: number; gzip: number }>();
  const size = (key: string) => {
    let s = sizes.get(key);
    if (!s) {
      const bytes = readFileSync(path.join(clientDir, manifest[key]!.file));
      s = { raw: bytes.length, gzip: gzipSync(bytes).length };
      sizes.set(key, s);
    }
    return s;
  };
  const kb = (bytes: number) => bytes / 1000;

  return keys
    .flatMap((key) => {
      const m = ROUTE_KEY.exec(key);
      return m ? [{ key, route: m[1]! }] : [];
    })
    .filter(({ key }) => size(key).raw > 0 || (manifest[key]!.imports ?? []).length > 0)
    .map(({ key, route }) => {
      const loaded = closure(manifest, [entry, root, key]);
      const later = new Set<string>();
      for (const k of loaded) for (const d of manifest[k]!.dynamicImports ?? []) later.add(d);
      const onDemand = [...closure(manifest, [...later])].filter((k) => !loaded.has(k));
      const js = [...loaded].filter((k) => manifest[k]!.file.endsWith(".js"));
      const gzip = kb(js.reduce((sum, k) => sum + size(k).gzip, 0));
      const ceiling = CEILINGS[route];
      const exempt =
        EXEMPT[route] ?? (ceiling && gzip <= ceiling.kb ? `held at ${ceiling.kb} kB: ${ceiling.why}` : null);
      return {
        route,
        files: js.length,
        rawKb: kb(js.reduce((sum, k) => sum + size(k).raw, 0)),
        gzipKb: gzip,
        onDemandKb: kb(onDemand.filter((k) => manifest[k]!.file.endsWith(".js")).reduce((s, k) => s + size(k).gzip, 0)),
        over: gzip > BUDGET_KB && !exempt,
        exempt: gzip > BUDGET_KB ? exempt : null,
      };
    })
    .sort((a, b) => b.gzipKb - a.gzipKb || a.route.localeCompare(b.route));
}

export function formatWeights(rows: RouteWeight[]) {
  const lines = [
    `Client JavaScript per page (entry + root + route, with their static imports; budget ${BUDGET_KB} kB gzipped)`,
    "",
    `${"route".padEnd(24)} ${"files".padStart(5)} ${"raw kB".padStart(8)} ${"gzip kB".padStart(8)} ${"on demand".padStart(9)}`,
  ];
  for (const r of rows) {
    const note = r.over ? "  OVER BUDGET" : r.exempt ? `  over, allowed: ${r.exempt}` : "";
    lines.push(
      `${r.route.padEnd(24)} ${String(r.files).padStart(5)} ${r.rawKb.toFixed(1).padStart(8)} ${r.gzipKb.toFixed(1).padStart(8)} ${(r.onDemandKb ? r.onDemandKb.toFixed(1) : "").padStart(9)}${note}`,
    );
  }
  return lines.join("\n");
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const rows = routeWeights(path.resolve(import.meta.dirname, "../build/client"));
  console.log(formatWeights(rows));
  const over = rows.filter((r) => r.over);
  if (over.length) {
    console.error(`\n${over.map((r) => r.route).join(", ")}: over the ${BUDGET_KB} kB budget`);
    process.exitCode = 1;
  }
}
