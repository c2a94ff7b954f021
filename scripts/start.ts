// `npm start`: PostgreSQL, migrations, demo data, fakes, a production build, and the server on
// http://127.0.0.1:3000 (PORT and HOST override). Ctrl-C stops everything it started.
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { log, onExit, root, startServices } from "./services";
import { waitForHttp } from "./wait-http";

const services = await startServices();
let server: ReturnType<typeof spawn> | undefined;
let worker: ReturnType<typeof spawn> | undefined;
onExit(async () => {
  server?.kill("SIGTERM");
  worker?.kill("SIGTERM");
  await services.stop();
});

log("Building the app…");
const build = spawnSync(path.join(root, "node_modules/.bin/react-router"), ["build"], { cwd: root, stdio: "inherit" });
if (build.status !== 0) {
  await services.stop();
  process.exit(build.status ?? 1);
}

const host = process.env.HOST ?? "127.0.0.1";
const port = process.env.PORT ?? "3000";
server = spawn(process.execPath, ["server.js"], {
  cwd: root,
  stdio: ["ignore", "inherit", "inherit"],
  env: { ...process.env, ...services.env, HOST: host, PORT: port, NODE_ENV: "production" },
});
worker = spawn(path.join(root, "node_modules/.bin/tsx"), ["scripts/worker.ts"], {
  cwd: root,
  stdio: ["ignore", "inherit", "inherit"],
  env: { ...process.env, ...services.env },
});
server.on("exit", async (code) => {
  worker?.kill("SIGTERM");
  await services.stop();
  process.exit(code ?? 0);
});
await waitForHttp(`http://${host}:${port}/`, server, 120_000);
log(`Bayproof is serving on http://${host}:${port}`);
