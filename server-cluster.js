// The primary of server.js under Node's cluster: forks one worker per core (WEB_CONCURRENCY), hands
// them the listening socket (round-robin), replaces a worker that dies (waiting longer after each
// quick death, so a crash loop does not spin), and on SIGTERM / SIGINT asks every worker to stop and
// exits once they have. It loads nothing of the app. A worker whose primary is killed outright
// exits on its own (node's cluster disconnects it), so no worker outlives its primary.
import cluster from "node:cluster";
import { availableParallelism } from "node:os";

/** A worker that lived this long counts as healthy: the next death starts the back-off afresh. */
const STABLE_MS = 60_000;
const FIRST_DELAY_MS = 250;
const MAX_DELAY_MS = 30_000;
/** Workers still running this long after a stop signal are killed (the start command waits 10 s). */
const STOP_GRACE_MS = 8_000;

/** WEB_CONCURRENCY, or one per core in production and one elsewhere; a bad value stops the start. */
export function workerCount(env) {
  const raw = env.WEB_CONCURRENCY?.trim();
  if (!raw) return env.NODE_ENV === "production" ? availableParallelism() : 1;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 256)
    throw new Error(`WEB_CONCURRENCY must be a whole number from 1 to 256, not "${env.WEB_CONCURRENCY}"`);
  return n;
}

/** The delay before replacing a worker, after `quickDeaths` deaths in a row of workers that did not last. */
export const restartDelay = (quickDeaths) => Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** Math.max(0, quickDeaths - 1));

export function runPrimary(count) {
  const startedAt = new Map();
  const timers = new Set();
  let quickDeaths = 0;
  let stopping = false;

  const fork = () => {
    const worker = cluster.fork();
    startedAt.set(worker.id, Date.now());
  };

  cluster.on("exit", (worker, code, signal) => {
    const lived = Date.now() - (startedAt.get(worker.id) ?? 0);
    startedAt.delete(worker.id);
    if (stopping) {
      if (startedAt.size === 0) process.exit(0);
      return;
    }
    quickDeaths = lived >= STABLE_MS ? 1 : quickDeaths + 1;
    const delay = restartDelay(quickDeaths);
    console.error(
      `[server] worker ${worker.process.pid} stopped (${signal ?? `exit code ${code}`}); starting another in ${delay} ms`,
    );
    const timer = setTimeout(() => {
      timers.delete(timer);
      if (!stopping) fork();
    }, delay);
    timers.add(timer);
  });

  for (const signal of ["SIGTERM", "SIGINT"]) {
    process.on(signal, () => {
      if (stopping) return;
      stopping = true;
      for (const timer of timers) clearTimeout(timer);
      if (startedAt.size === 0) process.exit(0);
      // A Ctrl-C reaches the workers too (one process group); a SIGTERM to the primary reaches only it.
      for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill(signal);
      setTimeout(() => {
        for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill("SIGKILL");
        process.exit(0);
      }, STOP_GRACE_MS).unref();
    });
  }

  console.log(`[server] ${count} workers (WEB_CONCURRENCY), primary process ${process.pid}`);
  for (let i = 0; i < count; i++) fork();
}
