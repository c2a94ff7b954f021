// `npm run dev`: the same services as `npm start`, then Vite's dev server with hot reload.
import { spawn } from "node:child_process";
import path from "node:path";
import { log, root, runStartCommand, startServices } from "./services";
import { Supervisor } from "./supervise";

let control: Awaited<ReturnType<typeof runStartCommand>> | undefined;
const supervisor = new Supervisor(log, () => void control?.exit(1));

control = await runStartCommand(
  async () => {
    const services = await startServices();
    const env = { ...process.env, ...services.env };
    supervisor.run("dev", () => {
      const child = spawn(
        path.join(root, "node_modules/.bin/react-router"),
        ["dev", "--host", process.env.HOST ?? "127.0.0.1", "--port", process.env.PORT ?? "3000"],
        { cwd: root, stdio: "inherit", env },
      );
      services.runState.record("dev", child.pid);
      return child;
    });
    supervisor.run("worker", () => {
      const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
        cwd: root,
        stdio: "inherit",
        env,
      });
      services.runState.record("worker", child.pid);
      return child;
    });
  },
  () => supervisor.stopAll(),
);
