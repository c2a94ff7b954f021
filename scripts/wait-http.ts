import type { ChildProcess } from "node:child_process";

/** Resolves once `url` answers below 500; fails if the server process exits first. */
export async function waitForHttp(url: string, server: Pick<ChildProcess, "exitCode">, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode != null) throw new Error(`the server exited with ${server.exitCode}`);
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`nothing answered at ${url}`);
}
