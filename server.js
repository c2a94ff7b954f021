// The production HTTP server: Express with compression and the static files of the build, as
// react-router-serve does, handing every other request to React Router. Two things differ from
// react-router-serve and its Express adapter (docs/decisions/005-open-feed.md):
//   - the client's socket address reaches the app, in a header only this server sets (the
//     feed's rate limits need it);
//   - response bodies are written with node's stream.pipeline, which waits for the socket and
//     holds one chunk at a time. The adapter's writer races every read against one long-lived
//     promise, which keeps every chunk of a long stream alive until it ends (a bulk dump of
//     the feed grew the process by the size of the file).
// Plain JavaScript, run by node itself; HOST and PORT choose where it listens.
import path from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { fileURLToPath } from "node:url";
import compression from "compression";
import express from "express";
import { createRequestHandler } from "react-router";

/** Must equal CLIENT_ADDRESS_HEADER in app/utils/client-address.server.ts (a unit test checks). */
const CLIENT_ADDRESS_HEADER = "x-bayproof-client-address";

const root = path.dirname(fileURLToPath(import.meta.url));
const build = await import(path.join(root, "build/server/index.js"));
const handle = createRequestHandler(build, process.env.NODE_ENV);

/** The Fetch API request React Router takes, from node's; aborted when the client goes away. */
function toRequest(req, res) {
  const controller = new AbortController();
  res.on("close", () => {
    if (!res.writableFinished) controller.abort();
  });
  const headers = new Headers();
  for (const [name, value] of Object.entries(req.headers)) {
    if (Array.isArray(value)) for (const v of value) headers.append(name, v);
    else if (value !== undefined) headers.set(name, value);
  }
  headers.set(CLIENT_ADDRESS_HEADER, req.socket.remoteAddress ?? "");
  const init = { method: req.method, headers, signal: controller.signal };
  if (req.method !== "GET" && req.method !== "HEAD") {
    init.body = Readable.toWeb(req);
    init.duplex = "half";
  }
  return new Request(new URL(req.originalUrl, `${req.protocol}://${req.get("host") ?? "localhost"}`), init);
}

const app = express();
app.disable("x-powered-by");
app.use(compression());
app.use("/assets", express.static(path.join(root, "build/client/assets"), { immutable: true, maxAge: "1y" }));
app.use(express.static(path.join(root, "build/client"), { maxAge: "1h" }));
app.all("*", async (req, res, next) => {
  let response;
  try {
    response = await handle(toRequest(req, res));
  } catch (error) {
    return next(error);
  }
  res.statusMessage = response.statusText;
  res.status(response.status);
  for (const [name, value] of response.headers) res.append(name, value);
  if (!response.body || req.method === "HEAD") {
    await response.body?.cancel();
    return res.end();
  }
  try {
    await pipeline(Readable.fromWeb(response.body), res);
  } catch (error) {
    // A client that leaves mid-stream is normal; anything else is worth a line in the log.
    if (error?.code !== "ERR_STREAM_PREMATURE_CLOSE" && !res.destroyed) console.error("[server] response stream failed:", error);
  }
});

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 3000);
const server = app.listen(port, host, () => console.log(`[server] http://${host}:${port}`));
for (const signal of ["SIGTERM", "SIGINT"]) process.once(signal, () => server.close(() => process.exit(0)));
