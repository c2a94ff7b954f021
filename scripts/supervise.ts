// Keeps the start command's long-running children up: a child that dies on its own (a crash, an
// out-of-memory kill) is started again alone, without touching the database or the fakes; one that
// keeps dying is given up on.
import type { ChildProcess } from "node:child_process";
import { stopProcess } from "./processes";

const MAX_RESTARTS_PER_MINUTE = 5;

export class Supervisor {
  private children = new Map<string, ChildProcess>();
  private stopping = false;

  constructor(
    private log: (s: string) => void,
    private onGiveUp: (name: string) => void,
  ) {}

  /** Starts `launch()` now and again whenever its process exits while nobody is stopping. */
  run(name: string, launch: () => ChildProcess) {
    const restarts: number[] = [];
    const start = () => {
      const child = launch();
      this.children.set(name, child);
      child.on("exit", (code, signal) => {
        // A clean exit was asked for (the Ctrl-C that reaches the whole process group reaches the
        // children first): only a crash or a kill is restarted.
        if (this.stopping || code === 0) return;
        const now = Date.now();
        restarts.push(now);
        while (restarts[0]! < now - 60_000) restarts.shift();
        if (restarts.length > MAX_RESTARTS_PER_MINUTE) {
          this.log(`The ${name} stopped ${restarts.length} times within a minute; giving up`);
          this.onGiveUp(name);
          return;
        }
        this.log(`The ${name} stopped (${signal ?? `exit code ${code}`}); starting it again`);
        start();
      });
    };
    start();
  }

  current(name: string) {
    return this.children.get(name);
  }

  /** SIGTERM to every child (SIGKILL after a grace period); resolves once all are gone. */
  async stopAll() {
    this.stopping = true;
    await Promise.all([...this.children.values()].flatMap((c) => (c.pid ? [stopProcess(c.pid)] : [])));
  }
}
