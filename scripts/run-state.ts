// `<data folder>/run.json`: which start command runs from this folder and which processes it
// started. A second start while one runs is refused; a start after one was killed (kill -9, a
// lost machine session) stops what that one left behind before it begins.
import { existsSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { commandLine, isAlive, StartError, stopProcess } from "./processes";

interface RunState {
  startPid: number;
  /** name → pid of each long-running child (server, worker, dev server). */
  children: Record<string, number>;
}

/** What a child's command line contains, so a recycled process number is never stopped by mistake. */
const MARKS: Record<string, RegExp> = {
  server: /server\.js/,
  worker: /scripts\/worker\.ts/,
  dev: /react-router.* dev/,
};

export async function claimRunState(dataDir: string, log: (s: string) => void) {
  const file = path.join(dataDir, "run.json");
  if (existsSync(file)) {
    let previous: RunState | null = null;
    try {
      previous = JSON.parse(readFileSync(file, "utf8")) as RunState;
    } catch {
      // unreadable: treat as left behind
    }
    if (
      previous &&
      previous.startPid !== process.pid &&
      isAlive(previous.startPid) &&
      /scripts\/(start|dev)\.ts/.test(commandLine(previous.startPid))
    ) {
      throw new StartError(
        `Bayproof is already running from this folder (process ${previous.startPid}). Stop it first (Ctrl-C in its terminal, or kill ${previous.startPid}).`,
      );
    }
    for (const [name, pid] of Object.entries(previous?.children ?? {})) {
      if (isAlive(pid) && MARKS[name]?.test(commandLine(pid))) {
        log(`Stopping the ${name} (process ${pid}) left running by an earlier start that did not stop cleanly`);
        await stopProcess(pid);
      }
    }
  }
  const state: RunState = { startPid: process.pid, children: {} };
  let released = false;
  const save = () => released || writeFileSync(file, `${JSON.stringify(state, null, 2)}\n`);
  save();
  return {
    file,
    record(name: keyof typeof MARKS, pid: number | undefined) {
      if (pid === undefined) return;
      state.children[name] = pid;
      save();
    },
    release() {
      released = true;
      rmSync(file, { force: true });
    },
  };
}
