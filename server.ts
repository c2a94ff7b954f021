// The production HTTP server: React Router's Express adapter behind compression and the static
// files of the build, as react-router-serve does, plus the one thing it lacks — the client's
// socket address, handed to the app in a header only this server sets (rate limits need it).
// `npm start` and the tests run it with tsx; HOST and PORT choose where it listens.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express from "express";
import { CLIENT_ADDRESS_HEADER } from "./app/utils/client-address";

const root = path.dirname(fileURLToPath(import.meta.url));
const build = await import(path.join(root, "build/server/index.js"));

const app = express();
app.disable("x-powered-by");
app.use(compression());
app.use("/assets", express.static(path.join(root, "build/client/assets"), { immutable: true, maxAge: "1y" }));
app.use(express.static(path.join(root, "build/client"), { maxAge: "1h" }));
app.use((req, _res, next) => {
  req.headers[CLIENT_ADDRESS_HEADER] = req.socket.remoteAddress ?? "";
  next();
});
app.all("*", createRequestHandler({ build, mode: process.env.NODE_ENV }));

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 3000);
const server = app.listen(port, host, () => console.log(`[server] http://${host}:${port}`));
for (const signal of ["SIGTERM", "SIGINT"] as const) process.once(signal, () => server.close(() => process.exit(0)));
