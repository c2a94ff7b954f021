// What holds a port, whether a process is alive, and stopping processes that an earlier start
// left behind. Linux only (reads /proc), like the rest of the start scripts.
import { readdirSync, readFileSync, readlinkSync } from "node:fs";
import { createServer } from "node:net";

/** True while `pid` runs (a zombie, dead but not yet reaped, counts as gone). */
export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3) !== "Z";
  } catch {
    return false;
  }
}

/**
 * When `pid` started (clock ticks since boot), or null if it is gone: with a pid and its start
 * time a process is told from a later one that got the same number (numbers run to 32768 here).
 */
export function startTime(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2).split(" ")[19] ?? null;
  } catch {
    return null;
  }
}

/** The command line of `pid`, spaces between arguments; "" when it cannot be read. */
export function commandLine(pid: number): string {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").filter(Boolean).join(" ");
  } catch {
    return "";
  }
}

/** Whether something already listens on 127.0.0.1:`port`. */
export function portInUse(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = createServer();
    s.once("error", () => resolve(true));
    s.listen(port, "127.0.0.1", () => s.close(() => resolve(false)));
  });
}

/** The process listening on TCP `port` (any address), from /proc; null when none or unreadable. */
export function portHolder(port: number): { pid: number; command: string } | null {
  const inodes = new Set<string>();
  for (const table of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    let text: string;
    try {
      text = readFileSync(table, "utf8");
    } catch {
      continue;
    }
    for (const line of text.split("\n").slice(1)) {
      const cols = line.trim().split(/\s+/);
      // local_address is HEXIP:HEXPORT; state 0A is LISTEN; column 9 is the socket's inode.
      if (cols.length > 9 && cols[3] === "0A" && parseInt(cols[1]!.split(":")[1]!, 16) === port) inodes.add(cols[9]!);
    }
  }
  if (inodes.size === 0) return null;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    let fds: string[];
    try {
      fds = readdirSync(`/proc/${entry}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      let target: string;
      try {
        target = readlinkSync(`/proc/${entry}/fd/${fd}`);
      } catch {
        continue;
      }
      const m = /^socket:\[(\d+)\]$/.exec(target);
      if (m && inodes.has(m[1]!)) return { pid: Number(entry), command: commandLine(Number(entry)) };
    }
  }
  return null;
}

/** A reason the start command cannot go on, said in one line (no stack trace). */
export class StartError extends Error {}

/** Throws a StartError naming the process that holds `port`, and the variable that moves it. */
export async function ensurePortFree(port: number, what: string, variable: string) {
  if (!(await portInUse(port))) return;
  const holder = portHolder(port);
  const who = holder
    ? `process ${holder.pid} (${holder.command.slice(0, 120) || "command line unreadable"})`
    : "another process";
  throw new StartError(
    `Port ${port}, wanted for ${what}, is taken by ${who}. Stop it, or set ${variable} to another port.`,
  );
}

/** SIGTERM, then SIGKILL if `pid` is still there after `graceMs`; resolves once it is gone. */
export async function stopProcess(pid: number, graceMs = 10_000) {
  if (!isAlive(pid)) return;
  try {
    process.kill(pid, "SIGTERM");
  } catch {
    return;
  }
  const deadline = Date.now() + graceMs;
  while (isAlive(pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  if (isAlive(pid)) {
    try {
      process.kill(pid, "SIGKILL");
    } catch {
      // gone in between
    }
    while (isAlive(pid)) await new Promise((r) => setTimeout(r, 50));
  }
}
