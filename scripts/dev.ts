// `npm run dev`: the same services as `npm start`, then Vite's dev server with hot reload.
import { spawn } from "node:child_process";
import path from "node:path";
import { onExit, root, startServices } from "./services";

const services = await startServices();
const dev = spawn(path.join(root, "node_modules/.bin/react-router"), ["dev", "--host", process.env.HOST ?? "127.0.0.1", "--port", process.env.PORT ?? "3000"], {
  cwd: root,
  stdio: "inherit",
  env: { ...process.env, ...services.env },
});
const worker = spawn(path.join(root, "node_modules/.bin/tsx"), ["scripts/worker.ts"], { cwd: root, stdio: "inherit", env: { ...process.env, ...services.env } });
onExit(async () => {
  dev.kill("SIGTERM");
  worker.kill("SIGTERM");
  await services.stop();
});
dev.on("exit", async (code) => {
  await services.stop();
  process.exit(code ?? 0);
});
