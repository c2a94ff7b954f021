// One dedicated PostgreSQL connection per process LISTENs for page changes. While it is not
// listening (starting, or lost and reconnecting) a notification could be missed, so the cache is
// neither read nor filled; each (re)connection starts from an empty cache.
import pg from "pg";
import { isConnectionError } from "../../db/connection-loss";
import { PAGES_CHANNEL } from "./notify.server";

export interface ListenerEvents {
  /** A notification arrived: drop what is cached. */
  changed(payload: string): void;
  /** Listening started or stopped; on either, drop what is cached. */
  listening(on: boolean): void;
}

const RECONNECT_DELAYS_MS = [100, 250, 500, 1000, 2000, 5000];

export interface PageChangeListener {
  close(): Promise<void>;
}

export function listenForPageChanges(connectionString: string, events: ListenerEvents): PageChangeListener {
  let client: pg.Client | null = null;
  let closed = false;
  let attempt = 0;
  let timer: NodeJS.Timeout | null = null;

  const lost = (reason: string) => {
    const current = client;
    client = null;
    events.listening(false);
    current?.removeAllListeners();
    // A dead socket may still raise errors; they must not end the process.
    current?.on("error", () => {});
    current?.end().catch(() => {});
    if (closed || timer) return;
    const delay = RECONNECT_DELAYS_MS[Math.min(attempt++, RECONNECT_DELAYS_MS.length - 1)]!;
    if (attempt === 1) console.warn(`[page-cache] not listening (${reason}); trying again`);
    timer = setTimeout(() => {
      timer = null;
      void connect();
    }, delay);
    timer.unref();
  };

  const connect = async () => {
    const next = new pg.Client({ connectionString, application_name: "bayproof-page-cache" });
    client = next;
    next.on("error", (error) => lost(error.message));
    next.on("end", () => {
      if (client === next) lost("connection ended");
    });
    next.on("notification", (message) => {
      if (message.channel === PAGES_CHANNEL) events.changed(message.payload ?? "");
    });
    try {
      await next.connect();
      await next.query(`LISTEN ${PAGES_CHANNEL}`);
      if (client !== next || closed) return;
      // The socket alone must not keep a process alive that is otherwise done.
      (next as unknown as { connection?: { stream?: { unref?: () => void } } }).connection?.stream?.unref?.();
      attempt = 0;
      events.listening(true);
    } catch (error) {
      if (client !== next) return;
      if (!isConnectionError(error)) console.warn(`[page-cache] LISTEN failed: ${(error as Error).message}`);
      lost((error as Error).message);
    }
  };

  void connect();
  return {
    async close() {
      closed = true;
      if (timer) clearTimeout(timer);
      const current = client;
      client = null;
      events.listening(false);
      current?.removeAllListeners();
      current?.on("error", () => {});
      // Not awaited: with its socket unreferenced, the end may never be reported.
      void current?.end().catch(() => {});
    },
  };
}
