// The production HTTP server: Express with compression and the static files of the build, as
// react-router-serve does, handing every other request to React Router. Two things differ from
// react-router-serve and its Express adapter (docs/decisions/005-open-feed.md):
//   - the client's socket address reaches the app, in a header only this server sets (the
//     feed's rate limits need it);
//   - response bodies are written with node's stream.pipeline, which waits for the socket and
//     holds one chunk at a time. The adapter's writer races every read against one long-lived
//     promise, which keeps every chunk of a long stream alive until it ends (a bulk dump of
//     the feed grew the process by the size of the file);
//   - a path that does not percent-decode is a 400 before anything reads it (JSON under /api/),
//     and a cross-site write is refused with the app's own 403 (crossSiteRefusal, exported by
//     app/entry.server.tsx) before React Router's origin check, which would answer a bare 400
//     and log a stack trace for each one;
//   - static files carry nosniff and a CSP that lets them load nothing but our own styles,
//     fonts and images, and HSTS when APP_ORIGIN is https.
//   - request bodies are capped per route before anything parses them (BODY_LIMITS below).
// Plain JavaScript, run by node itself; HOST and PORT (app/config.server.ts) choose where it listens.
// With WEB_CONCURRENCY above 1 (one per core by default in production) this process is a cluster
// primary (server-cluster.js) and each worker runs serve() below on the shared socket.
import { readdirSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { fileURLToPath } from "node:url";
import { constants as zlibConstants } from "node:zlib";
import cluster from "node:cluster";
import compression from "compression";
import express from "express";
import { createRequestHandler } from "react-router";
import { runPrimary, workerCount } from "./server-cluster.js";

/** Must equal CLIENT_ADDRESS_HEADER in app/utils/client-address.server.ts (a unit test checks). */
const CLIENT_ADDRESS_HEADER = "x-bayproof-client-address";
/** Must equal HSTS in app/security.server.ts (a unit test checks). */
const HSTS = "max-age=31536000; includeSubDomains";

const root = path.dirname(fileURLToPath(import.meta.url));

/** A 400 with a reason: the feed's JSON error under /api/v1, JSON under /api/, plain text elsewhere. */
function badPath(req, res) {
  const message = "The address is not valid: it has a broken %-escape.";
  res.status(400).set({
    "Cache-Control": "no-store",
    "Content-Security-Policy": "default-src 'none'",
    "X-Content-Type-Options": "nosniff",
  });
  if (/^\/api\/v1(\/|$)/.test(req.path))
    return res.set("Access-Control-Allow-Origin", "*").json({ error: { code: "invalid_path", message } });
  if (req.path.startsWith("/api/")) return res.json({ error: message });
  return res.type("text/plain").send(message);
}

// Request bodies, by path, refused with 413 before the app parses them: by Content-Length when
// one is sent, else by counting the streamed bytes. Evidence goes from the browser straight to
// object storage, so no route takes more than a form's worth of text.
//
//   path (".data" suffix of React Router's data requests ignored)   limit
//   /reports/new, /reports/:id/edit   160 KiB  the report form: at most ~40 KB (4,000 characters
//                                              of notes at 9 bytes each URL-encoded), about 4×
//   /api/*                             16 KiB  small JSON: an upload's type and size, publish yes/no
//   everything else                    64 KiB  sign-in, account, moderation and admin forms
const KIB = 1024;
const BODY_LIMITS = [
  { pattern: /^\/reports\/(new|[^/]+\/edit)$/, limit: 160 * KIB },
  { pattern: /^\/api\//, limit: 16 * KIB },
  { pattern: /^/, limit: 64 * KIB },
];

function bodyLimit(pathname) {
  const path = pathname.replace(/\.data$/, "");
  return BODY_LIMITS.find((rule) => rule.pattern.test(path)).limit;
}

class BodyTooLarge extends Error {}

/** The whole body, or BodyTooLarge as soon as it passes the limit (nothing more is kept). */
function readBody(req, limit) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let size = 0;
    const done = (error, body) => {
      req.off("data", onData).off("end", onEnd).off("error", onError).off("close", onClose);
      if (error) reject(error);
      else resolve(body);
    };
    const onData = (chunk) => {
      size += chunk.length;
      if (size > limit) done(new BodyTooLarge());
      else chunks.push(chunk);
    };
    const onEnd = () => done(null, Buffer.concat(chunks, size));
    const onError = (error) => done(error);
    const onClose = () => done(new Error("the client closed the request"));
    req.on("data", onData).on("end", onEnd).on("error", onError).on("close", onClose);
  });
}

/** 413 with a reason (JSON under /api/). The rest of the body is read and dropped (never kept)
 *  so the client, still sending, reads this answer rather than a broken pipe; a client that
 *  keeps sending for more than a few seconds is cut off. */
function refuseTooLarge(req, res, limit) {
  const message = `The request body is larger than this address accepts (at most ${limit / KIB} KiB). Evidence files are uploaded to storage directly, not through this form.`;
  res.set({ "Cache-Control": "no-store", "X-Content-Type-Options": "nosniff" });
  if (req.path.startsWith("/api/")) res.status(413).json({ error: { code: "body_too_large", message } });
  else res.status(413).type("text/plain").send(message);
  req.on("data", () => {});
  req.resume();
  const cutOff = setTimeout(() => req.socket.destroy(), 5_000).unref();
  req.once("end", () => clearTimeout(cutOff));
}

/** The Fetch API request React Router takes, from node's; aborted when the client goes away. */
function toRequest(req, res, body) {
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
  if (body !== undefined) init.body = body;
  return new Request(new URL(req.originalUrl, `${req.protocol}://${req.get("host") ?? "localhost"}`), init);
}

/** One process's server: the build, Express and the listening socket (a cluster worker's, or the only one). */
async function serve() {
  const build = await import(path.join(root, "build/server/index.js"));
  const crossSiteRefusal = build.entry.module.crossSiteRefusal;
  if (typeof crossSiteRefusal !== "function") throw new Error("app/entry.server.tsx must export crossSiteRefusal");
  /** The app's configuration (app/config.server.ts), read once from the environment by the build. */
  const config = build.entry.module.config;
  /** The stored bytes of a page-cache hit (app/http-cache/page-cache.server.ts). */
  const storedBodyOf = build.entry.module.storedBodyOf;
  /** A page-cache hit answered before Express (app/http-cache/early-hit.server.ts), or null. */
  const earlyHit = build.entry.module.earlyHit;
  if (typeof earlyHit !== "function") throw new Error("app/entry.server.tsx must export earlyHit");
  if (!config?.listen) throw new Error("app/entry.server.tsx must export config");
  const handle = createRequestHandler(build, config.mode);

  const STATIC_HEADERS = {
    "Content-Security-Policy":
      "default-src 'none'; style-src 'self'; font-src 'self'; img-src 'self'; frame-ancestors 'none'",
    "X-Content-Type-Options": "nosniff",
    ...(config.appOrigin.startsWith("https://") ? { "Strict-Transport-Security": HSTS } : {}),
  };

  const app = express();
  app.disable("x-powered-by");
  // Brotli at quality 1 for what is rendered per request (a browser asks for br first): a 170 kB job
  // page shrinks to ~35 kB, against ~31 kB at the package's default quality 4, for a third of the CPU
  // (docs/decisions/012-page-caching.md). Cached pages carry their own gzip, made once.
  app.use(compression({ brotli: { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 1 } } }));
  app.use((req, res, next) => {
    try {
      decodeURIComponent(req.path);
    } catch {
      return badPath(req, res);
    }
    next();
  });
  const setHeaders = (res) => res.set(STATIC_HEADERS);
  app.use(
    "/assets",
    express.static(path.join(root, "build/client/assets"), { immutable: true, maxAge: "1y", setHeaders }),
  );
  // The other files of build/client (the favicon, and whatever public/ holds) by their top-level
  // names, read once: a page's address then never costs a failed file lookup.
  const clientDir = path.join(root, "build/client");
  const clientFiles = new Set(readdirSync(clientDir).filter((name) => name !== "assets"));
  const clientStatic = express.static(clientDir, { maxAge: "1h", setHeaders });
  app.use((req, res, next) => (clientFiles.has(req.path.split("/")[1]) ? clientStatic(req, res, next) : next()));
  app.all("*", async (req, res, next) => {
    let body;
    if (req.method !== "GET" && req.method !== "HEAD") {
      const limit = bodyLimit(req.path);
      const declared = Number(req.get("content-length"));
      if (declared > limit) return refuseTooLarge(req, res, limit);
      try {
        body = await readBody(req, limit);
      } catch (error) {
        if (error instanceof BodyTooLarge) return refuseTooLarge(req, res, limit);
        return res.destroy(); // the client went away mid-body: nobody to answer
      }
    }
    let response;
    try {
      const request = toRequest(req, res, body);
      response = crossSiteRefusal(request) ?? (await handle(request));
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
    // A page from the page cache: its stored bytes in one write, its stream never read.
    const stored = storedBodyOf?.(response);
    if (stored) return res.end(stored);
    try {
      await pipeline(Readable.fromWeb(response.body), res);
    } catch (error) {
      // A client that leaves mid-stream is normal; anything else is worth a line in the log.
      if (error?.code !== "ERR_STREAM_PREMATURE_CLOSE" && !res.destroyed)
        console.error("[server] response stream failed:", error);
    }
  });

  // Anonymous hits of the page cache are answered before Express: the same bytes and headers the
  // app would send, without its routing, a Fetch Request or React Router's middleware.
  const onRequest = async (req, res) => {
    let hit = null;
    try {
      hit = await earlyHit(req);
    } catch (error) {
      console.error("[server] early cache answer failed; answering the long way:", error);
    }
    if (!hit) return app(req, res);
    res.writeHead(hit.status, hit.headers);
    res.end(hit.body ?? undefined);
  };
  const { host, port } = config.listen;
  const server = http.createServer(onRequest);
  server.listen(port, host, () => console.log(`[server] http://${host}:${port}`));
  // Requests node's parser refuses before any route sees them (an address or headers over 16 KiB,
  // a malformed request line) get a reason too, in JSON since the path is not known.
  server.on("clientError", (error, socket) => {
    if (error.code === "ECONNRESET" || !socket.writable) return socket.destroy();
    const tooLarge = error.code === "HPE_HEADER_OVERFLOW";
    const body = JSON.stringify({
      error: tooLarge
        ? { code: "request_too_large", message: "The address and headers together are larger than 16 KiB." }
        : { code: "bad_request", message: "The request could not be read." },
    });
    socket.end(
      `HTTP/1.1 ${tooLarge ? "431 Request Header Fields Too Large" : "400 Bad Request"}\r\nContent-Type: application/json; charset=utf-8\r\n` +
        `Content-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
    );
  });
  for (const signal of ["SIGTERM", "SIGINT"]) process.once(signal, () => server.close(() => process.exit(0)));
}

// How many processes serve (docs/decisions/013-worker-processes.md). WEB_CONCURRENCY is read here
// and not in app/config.server.ts because the primary decides before any build is loaded: it loads
// none, so nothing of the app (pools, queues) runs twice. Default: one worker per core in
// production (npm start), one process elsewhere. 1 serves from this process, without a primary.
const workers = workerCount(process.env);
if (workers > 1 && cluster.isPrimary) runPrimary(workers);
else await serve();
