// A local stand-in for the hosted search service: the subset of its HTTP API that the meilisearch
// SDK uses here (health, indexes, settings, documents, search with filters and facets, tasks),
// backed by an in-memory index per index uid (search-engine.ts: MiniSearch's tokenizer and radix
// tree, ranked by the service's default rules).
import http from "node:http";
import { type Doc, scalarText, SearchEngine } from "./search-engine";

interface Index {
  uid: string;
  primaryKey: string;
  docs: Map<string, Doc>;
  settings: { searchableAttributes: string[]; filterableAttributes: string[]; sortableAttributes: string[] };
  engine: SearchEngine | null;
}

const now = () => new Date().toISOString();

/** Meilisearch filter subset: `attr = value` / `attr = 'value'`, joined by AND; or an array of those. */
function parseFilter(filter: unknown): [string, string][] {
  const parts = Array.isArray(filter)
    ? filter.flat().map(String)
    : typeof filter === "string" && filter
      ? filter.split(/\s+AND\s+/i)
      : [];
  return parts.map((p) => {
    const m = p.trim().match(/^([A-Za-z_][\w.]*)\s*=\s*(?:'([^']*)'|"([^"]*)"|(\S+))$/);
    if (!m) throw Object.assign(new Error(`invalid filter: ${p}`), { code: "invalid_search_filter" });
    return [m[1]!, m[2] ?? m[3] ?? m[4]!];
  });
}

export async function startSearchService({ port }: { port: number }) {
  const indexes = new Map<string, Index>();
  const tasks = new Map<number, Record<string, unknown>>();
  let nextTask = 0;

  const task = (indexUid: string | null, type: string) => {
    const uid = nextTask++;
    const t = {
      uid,
      taskUid: uid,
      indexUid,
      status: "succeeded",
      type,
      enqueuedAt: now(),
      startedAt: now(),
      finishedAt: now(),
      error: null,
      details: {},
    };
    tasks.set(uid, t);
    return { taskUid: uid, indexUid, status: "enqueued", type, enqueuedAt: t.enqueuedAt };
  };

  const ensure = (uid: string, primaryKey = "id") => {
    let index = indexes.get(uid);
    if (!index) {
      index = {
        uid,
        primaryKey,
        docs: new Map(),
        settings: { searchableAttributes: ["*"], filterableAttributes: [], sortableAttributes: [] },
        engine: null,
      };
      indexes.set(uid, index);
    }
    return index;
  };

  const engineFor = (index: Index) => {
    if (index.engine) return index.engine;
    const sample = index.docs.values().next().value;
    const fields =
      index.settings.searchableAttributes[0] === "*" || index.settings.searchableAttributes.length === 0
        ? Object.keys(sample ?? {}).filter((k) => k !== index.primaryKey)
        : index.settings.searchableAttributes;
    index.engine = new SearchEngine(index.docs.values(), fields);
    return index.engine;
  };

  const answer = async (req: http.IncomingMessage, res: http.ServerResponse) => {
    const url = new URL(req.url ?? "/", `http://127.0.0.1:${port}`);
    const send = (status: number, body: unknown) =>
      res.writeHead(status, { "Content-Type": "application/json" }).end(JSON.stringify(body));
    const fail = (status: number, code: string, message: string) =>
      send(status, { message, code, type: "invalid_request", link: "" });
    let body: unknown = null;
    if (req.method === "POST" || req.method === "PUT" || req.method === "PATCH") {
      const chunks: Buffer[] = [];
      for await (const c of req) chunks.push(c as Buffer);
      try {
        body = chunks.length ? JSON.parse(Buffer.concat(chunks).toString("utf8")) : null;
      } catch {
        return fail(400, "malformed_payload", "invalid JSON");
      }
    }
    const parts = url.pathname.split("/").filter(Boolean);
    try {
      if (parts[0] === "health") return send(200, { status: "available" });
      if (parts[0] === "tasks" && parts[1] && req.method === "GET") {
        const t = tasks.get(Number(parts[1]));
        return t ? send(200, t) : fail(404, "task_not_found", "task not found");
      }
      if (parts[0] === "indexes" && parts.length === 1 && req.method === "POST") {
        const { uid, primaryKey } = body as { uid: string; primaryKey?: string };
        ensure(uid, primaryKey);
        return send(202, task(uid, "indexCreation"));
      }
      if (parts[0] !== "indexes" || !parts[1]) return fail(404, "not_found", "no such route");
      const uid = parts[1];
      if (parts.length === 2 && req.method === "GET") {
        const index = indexes.get(uid);
        return index
          ? send(200, { uid, primaryKey: index.primaryKey, createdAt: now(), updatedAt: now() })
          : fail(404, "index_not_found", `index ${uid} not found`);
      }
      if (parts.length === 2 && req.method === "DELETE") {
        indexes.delete(uid);
        return send(202, task(uid, "indexDeletion"));
      }
      if (parts[2] === "settings" && req.method === "PATCH") {
        const index = ensure(uid);
        Object.assign(index.settings, body as object);
        index.engine = null;
        return send(202, task(uid, "settingsUpdate"));
      }
      if (parts[2] === "documents" && parts[3] && req.method === "GET") {
        const doc = indexes.get(uid)?.docs.get(decodeURIComponent(parts[3]));
        return doc ? send(200, doc) : fail(404, "document_not_found", "document not found");
      }
      if (parts[2] === "documents" && (req.method === "POST" || req.method === "PUT")) {
        const index = ensure(uid, url.searchParams.get("primaryKey") ?? undefined);
        for (const doc of body as Doc[]) {
          const id = String(doc[index.primaryKey]);
          index.docs.set(id, req.method === "PUT" ? { ...(index.docs.get(id) ?? {}), ...doc } : doc);
        }
        index.engine = null;
        return send(202, task(uid, "documentAdditionOrUpdate"));
      }
      if (parts[2] === "documents" && req.method === "DELETE") {
        const index = ensure(uid);
        if (parts[3]) index.docs.delete(parts[3]);
        else index.docs.clear();
        index.engine = null;
        return send(202, task(uid, "documentDeletion"));
      }
      if (parts[2] === "search" && req.method === "POST") {
        const index = indexes.get(uid);
        if (!index) return fail(404, "index_not_found", `index ${uid} not found`);
        const t0 = performance.now();
        const {
          q = "",
          filter,
          facets = [],
          limit = 20,
          offset = 0,
        } = (body ?? {}) as { q?: string; filter?: unknown; facets?: string[]; limit?: number; offset?: number };
        const conditions = parseFilter(filter);
        for (const [attr] of conditions) {
          if (!index.settings.filterableAttributes.includes(attr))
            return fail(400, "invalid_search_filter", `attribute ${attr} is not filterable`);
        }
        const matches = (doc: Doc) =>
          conditions.every(([a, v]) =>
            Array.isArray(doc[a]) ? (doc[a] as unknown[]).map(String).includes(v) : String(doc[a]) === v,
          );
        const hits = engineFor(index).search(q, matches, offset + limit);
        const facetDistribution: Record<string, Record<string, number>> = {};
        for (const f of facets) {
          const dist: Record<string, number> = {};
          for (const h of hits)
            for (const v of [h[f]].flat()) if (v != null) dist[scalarText(v)] = (dist[scalarText(v)] ?? 0) + 1;
          facetDistribution[f] = dist;
        }
        return send(200, {
          hits: hits.slice(offset, offset + limit),
          query: q,
          limit,
          offset,
          estimatedTotalHits: hits.length,
          processingTimeMs: Math.round(performance.now() - t0),
          ...(facets.length ? { facetDistribution } : {}),
        });
      }
      return fail(404, "not_found", "no such route");
    } catch (error) {
      return fail(400, (error as { code?: string }).code ?? "bad_request", (error as Error).message);
    }
  };
  const server = http.createServer((req, res) => void answer(req, res));
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return {
    url: `http://127.0.0.1:${port}`,
    stop: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
