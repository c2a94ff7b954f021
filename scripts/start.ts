// `npm start`: PostgreSQL, migrations, demo data, fakes, a production build, and the server on
// http://127.0.0.1:3000 (PORT and HOST override). Ctrl-C, SIGTERM or a closed terminal stop
// everything it started; a server or worker that dies on its own is started again alone.
import { spawn } from "node:child_process";
import { buildApp } from "./build-app";
import { ensurePortFree, StartError } from "./processes";
import { log, root, runStartCommand, startServices } from "./services";
import { Supervisor } from "./supervise";
import { waitForHttp } from "./wait-http";

const host = process.env.HOST ?? "127.0.0.1";
const port = process.env.PORT ?? "3000";
let gaveUp = false;
let control: Awaited<ReturnType<typeof runStartCommand>> | undefined;

const supervisor = new Supervisor(log, () => {
  gaveUp = true;
  void control?.exit(1);
});

control = await runStartCommand(
  async () => {
    const services = await startServices();
    log(`Services ready after ${process.uptime().toFixed(1)} s`);
    if (!buildApp(root, log).ok) throw new StartError("The build failed (see above); nothing was started");
    await ensurePortFree(Number(port), "the app", "PORT");
    const record = (name: "server" | "worker", pid: number | undefined) => services.runState.record(name, pid);
    supervisor.run("server", () => {
      const child = spawn(process.execPath, ["server.js"], {
        cwd: root,
        stdio: ["ignore", "inherit", "inherit"],
        env: { ...process.env, ...services.env, HOST: host, PORT: port, NODE_ENV: "production" },
      });
      record("server", child.pid);
      return child;
    });
    supervisor.run("worker", () => {
      const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
        cwd: root,
        stdio: ["ignore", "inherit", "inherit"],
        env: { ...process.env, ...services.env },
      });
      record("worker", child.pid);
      return child;
    });
    await waitForHttp(
      `http://${host}:${port}/`,
      {
        get exitCode() {
          return gaveUp ? 1 : null;
        },
      },
      300_000,
    );
    // From this process's start (npm and tsx add a second or so before it); the goal for a start
    // with nothing to build or load is under 8 s.
    log(`Bayproof is serving on http://${host}:${port} (ready in ${process.uptime().toFixed(1)} s)`);
  },
  () => supervisor.stopAll(),
);
