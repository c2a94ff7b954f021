// The web process's page cache: one per process, listening on the primary (replicas do not relay
// NOTIFY) once the first request arrives.
import { sql } from "kysely";
import type { MiddlewareFunction } from "react-router";
import { config } from "~/config.server";
import { type Units, unitsKey } from "~/domain";
import { db, readDb } from "~/db.server";
import { listenForPageChanges, type PageChangeListener } from "./listener.server";
import { PageCache, pageCacheMiddleware, type PageCacheOptions, pageKey } from "./page-cache.server";

export const pageCache = new PageCache(Math.max(0, config.pageCacheMb) * 1024 * 1024);

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Resolves once the read instance has replayed what the primary has written by now (a notification
 * has arrived, so its transaction is in). A primary read as its own replica, or no replica, is
 * caught up at once: pg_last_wal_replay_lsn() is null outside recovery.
 */
async function replicaCaughtUp(): Promise<void> {
  if (readDb === db) return;
  const primary = await sql<{ lsn: string }>`select pg_current_wal_lsn()::text as lsn`.execute(db);
  const lsn = primary.rows[0]!.lsn;
  for (let waited = 0; waited < 30_000; waited += 20) {
    const replica = await sql<{
      behind: boolean | null;
    }>`select pg_last_wal_replay_lsn() < ${lsn}::pg_lsn as behind`.execute(readDb);
    if (replica.rows[0]?.behind !== true) return;
    await sleep(20);
  }
  throw new Error(`the read replica is still behind ${lsn} after 30 s`);
}

let listener: PageChangeListener | null = null;

/** The root middleware's cache step; `enabled` false (development) leaves only the Cache-Control defaults. */
export function pageCacheStep(options: PageCacheOptions & { enabled: boolean }): MiddlewareFunction<Response> {
  const step = pageCacheMiddleware(pageCache, options);
  const on = options.enabled && config.pageCacheMb > 0;
  return (args, next) => {
    if (on) listener ??= listenForPageChanges(config.databaseUrl, pageCache.events(replicaCaughtUp));
    return step(args, next);
  };
}

/**
 * A public page's loader result shared by its visitors, signed in or not, until the next change
 * (PageCache.remember). Anonymous visitors mostly get the whole page from the cache; this spares a
 * signed-in visitor's render the page's reads. The key is the route, the address and the units:
 * `compute` may read nothing else of the request (never the session).
 */
export function sharedPageRead<T>(route: string, request: Request, units: Units, compute: () => Promise<T>) {
  return pageCache.remember(pageKey(`${route} ${unitsKey(units)}`, new URL(request.url)), compute);
}
