// The production HTTP server: `node scripts/server.mjs [build/server/index.js]` (npm run serve, npm start, the
// browser tests). It is React Router's own Express adapter (@react-router/express), as in the framework's
// custom-server template, with what an operator needs around it:
//
// - configuration parsed before listening (exit 1 naming every bad variable) and the database checked at start;
// - bounded requests: header size and request time limits, methods outside HTTP's usual set refused (405),
//   malformed requests answered 400/431 problem details by the server itself;
// - security headers on every response (helmet): a Content-Security-Policy whose scripts run by a per-request
//   nonce, frame-ancestors 'none', nosniff, Referrer-Policy; HSTS when the request came over https;
// - pre-compressed static assets (npm run build writes .br and .gz; scripts/compress-assets.mjs);
// - the TCP peer address for throttling and the audit trail, in a header clients cannot forge;
// - one JSON log line per request (pino) and Prometheus metrics (prom-client), shared with the app;
// - graceful shutdown on SIGTERM/SIGINT: stop accepting, finish requests in flight (bounded by
//   SHUTDOWN_TIMEOUT_MS), then close the database pool and exit 0.
import { randomBytes, randomUUID } from "node:crypto";
import { createReadStream, statSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express from "express";
import helmet from "helmet";
import client from "prom-client";
import { matchRoutes } from "react-router";

const PEER_HEADER = "x-isopleth-peer";
const METHODS = new Set([
  "GET",
  "HEAD",
  "POST",
  "PUT",
  "PATCH",
  "DELETE",
  "OPTIONS",
]);

const buildPath = path.resolve(process.argv[2] ?? "build/server/index.js");
const clientDir = path.resolve(path.dirname(buildPath), "..", "client");
const build = await import(pathToFileURL(buildPath).href);
const hooks = build.entry.module.serverHooks;

let env;
try {
  env = hooks.configuration();
} catch (error) {
  if (error?.name !== "EnvError") throw error;
  process.stderr.write(`Isopleth cannot start: ${error.message}\n`);
  process.exit(1);
}
const logger = hooks.logger;
globalThis.__isoplethPeerAddressHook = true;

// ---- metrics ---------------------------------------------------------------------------------------------------
hooks.collectProcessMetrics();
const requestsTotal = new client.Counter({
  name: "http_requests_total",
  help: "HTTP requests answered, by method, route and status.",
  labelNames: ["method", "route", "status"],
});
const requestSeconds = new client.Histogram({
  name: "http_request_duration_seconds",
  help: "Time to answer HTTP requests, by method and route.",
  labelNames: ["method", "route"],
  buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30],
});
const inFlight = new client.Gauge({
  name: "http_requests_in_flight",
  help: "HTTP requests being answered.",
});

// Route patterns (not raw paths) label metrics and log lines: bounded in number, and no reset token in a log.
const routeTree = (() => {
  const byParent = new Map();
  for (const r of Object.values(build.routes)) {
    const list = byParent.get(r.parentId) ?? [];
    list.push(r);
    byParent.set(r.parentId, list);
  }
  const make = (parentId) =>
    (byParent.get(parentId) ?? []).map((r) => ({
      id: r.id,
      path: r.path,
      index: r.index,
      caseSensitive: r.caseSensitive,
      children: r.index ? undefined : make(r.id),
    }));
  return make(undefined);
})();

// matchRoutes flattens and compiles the route table on every call (milliseconds under load), so labels are
// remembered per path; the map is emptied when it grows past a bound (paths with ids are many, routes few).
const routeLabels = new Map();
function routeOf(pathname) {
  let label = routeLabels.get(pathname);
  if (label === undefined) {
    if (routeLabels.size >= 10_000) routeLabels.clear();
    label = matchRouteLabel(pathname);
    routeLabels.set(pathname, label);
  }
  return label;
}

function matchRouteLabel(pathname) {
  if (pathname.startsWith("/assets/")) return "/assets/*";
  let p = pathname;
  let suffix = "";
  if (p === "/_root.data") return "/.data";
  if (p.endsWith(".data")) {
    p = p.slice(0, -".data".length);
    suffix = ".data";
  }
  let matches = null;
  try {
    decodeURIComponent(p);
    matches = matchRoutes(routeTree, p);
  } catch {
    matches = null;
  }
  if (!matches) return "(unmatched)";
  const pattern = matches
    .map((m) => m.route.path)
    .filter(Boolean)
    .join("/")
    .replace(/\/+/g, "/");
  return `/${pattern.replace(/^\//, "")}${suffix}`;
}

// ---- static assets -------------------------------------------------------------------------------------------
const TYPES = {
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".svg": "image/svg+xml",
  ".map": "application/json; charset=utf-8",
};
const sizes = new Map(); // build output never changes while the server runs
function sizeOf(file) {
  let size = sizes.get(file);
  if (size === undefined) {
    try {
      size = statSync(file).size;
    } catch {
      size = -1;
    }
    sizes.set(file, size);
  }
  return size;
}

/** /assets/<name> from its .br or .gz twin when the client accepts it; anything unusual falls through. */
function precompressed(req, res, next) {
  if (req.method !== "GET" && req.method !== "HEAD") return next();
  let name;
  try {
    name = decodeURIComponent(req.path.slice(1));
  } catch {
    return next(); // a malformed escape: express.static and the router answer it
  }
  if (!name || /[/\\\0]/.test(name) || name.startsWith(".")) return next();
  const type = TYPES[path.extname(name)];
  if (!type) return next();
  const accepted = String(req.headers["accept-encoding"] ?? "");
  const file = path.join(clientDir, "assets", name);
  for (const [encoding, ext] of [
    ["br", ".br"],
    ["gzip", ".gz"],
  ]) {
    if (!new RegExp(`\\b${encoding}\\b`).test(accepted)) continue;
    const size = sizeOf(file + ext);
    if (size < 0) continue;
    res.writeHead(200, {
      "Content-Type": type,
      "Content-Encoding": encoding,
      "Content-Length": size,
      "Cache-Control": "public, max-age=31536000, immutable",
      Vary: "Accept-Encoding",
    });
    if (req.method === "HEAD") res.end();
    else
      createReadStream(file + ext)
        .on("error", () => res.destroy())
        .pipe(res);
    return;
  }
  next();
}

// ---- problems answered by the server itself --------------------------------------------------------------------
const TITLES = {
  400: "Invalid request",
  404: "Not found",
  405: "Method not allowed",
  408: "Request timeout",
  413: "Request too large",
  431: "Request headers too large",
  500: "Internal error",
  503: "Unavailable",
};

function problemBody(status, code, detail) {
  return JSON.stringify({
    type: `/api-docs#problem-${code}`,
    title: TITLES[status] ?? "Error",
    status,
    detail,
    code,
  });
}

/** As the app will see the path: dot segments resolved the way the Fetch API's URL parser does. */
function isApiRequest(req) {
  try {
    return new URL(req.url, "http://127.0.0.1").pathname.startsWith("/api/");
  } catch {
    return false;
  }
}

function sendProblem(req, res, status, code, detail, headers = {}) {
  const api =
    isApiRequest(req) ||
    !String(req.headers.accept ?? "").includes("text/html");
  res.status(status).set({ "Cache-Control": "no-store", ...headers });
  if (api)
    return res
      .type("application/problem+json; charset=utf-8")
      .send(problemBody(status, code, detail));
  res
    .type("text/html; charset=utf-8")
    .send(
      `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>${TITLES[status] ?? "Error"} — Isopleth</title></head>` +
        `<body style="font-family: system-ui, sans-serif; max-width: 40rem; margin: 3rem auto; padding: 0 1.5rem">` +
        `<h1 style="font-size: 1.5rem">${TITLES[status] ?? "Error"}</h1><p>${detail}</p><p><a href="/">Back to Isopleth</a></p></body></html>`,
    );
}

// ---- the app ---------------------------------------------------------------------------------------------------
const app = express();
app.disable("x-powered-by");
app.set("trust proxy", env.TRUST_PROXY);
app.set("query parser", "simple");
let draining = false;

app.use((req, res, next) => {
  const started = process.hrtime.bigint();
  const forwardedId = env.TRUST_PROXY ? req.get("x-request-id") : undefined;
  const state = {
    requestId:
      forwardedId && /^[\w.-]{1,64}$/.test(forwardedId)
        ? forwardedId
        : randomUUID(),
    nonce: randomBytes(16).toString("base64"),
    caller: null,
    databaseUnavailable: false,
  };
  res.locals.nonce = state.nonce;
  res.setHeader("X-Request-Id", state.requestId);
  if (draining) res.setHeader("Connection", "close");
  // The peer address, in a header the client cannot set (any copy it sent is removed).
  delete req.headers[PEER_HEADER];
  req.headers[PEER_HEADER] = req.socket.remoteAddress ?? "unknown";
  inFlight.inc();
  let done = false;
  const finish = () => {
    if (done) return;
    done = true;
    inFlight.dec();
    const seconds = Number(process.hrtime.bigint() - started) / 1e9;
    const route = routeOf(req.path);
    const status = res.headersSent ? res.statusCode : 499; // 499: the client went away first
    requestsTotal.inc({ method: req.method, route, status: String(status) });
    requestSeconds.observe({ method: req.method, route }, seconds);
    const level =
      status >= 500
        ? "error"
        : status >= 400 && status !== 404
          ? "warn"
          : "info";
    logger[level](
      {
        requestId: state.requestId,
        method: req.method,
        route,
        status,
        durationMs: Math.round(seconds * 10_000) / 10,
        ...(state.caller ? { caller: state.caller } : {}),
      },
      "request",
    );
  };
  res.on("finish", finish);
  res.on("close", finish);
  hooks.requestStore.run(state, next);
});

app.use((req, res, next) => {
  if (!req.headers.host)
    return sendProblem(
      req,
      res,
      400,
      "bad_request",
      "An HTTP/1.1 request needs a Host header.",
    );
  // One spelling per resource: repeated slashes are folded (a permanent redirect that keeps the method).
  const [pathPart, ...queryParts] = req.url.split("?");
  if (/\/\//.test(pathPart))
    return res.redirect(
      308,
      pathPart.replace(/\/{2,}/g, "/") +
        (queryParts.length ? `?${queryParts.join("?")}` : ""),
    );
  let decoded;
  try {
    decoded = decodeURIComponent(req.path);
  } catch {
    return sendProblem(
      req,
      res,
      400,
      "malformed_path",
      "The address has a malformed percent-escape.",
    );
  }
  // eslint-disable-next-line no-control-regex -- control characters are what this refuses
  if (/[\u0000-\u001f\u007f]/.test(decoded)) {
    return sendProblem(
      req,
      res,
      400,
      "malformed_path",
      "The address contains control characters.",
    );
  }
  if (METHODS.has(req.method)) return next();
  sendProblem(
    req,
    res,
    405,
    "method_not_allowed",
    `The method ${req.method.slice(0, 20)} is not accepted here.`,
    {
      Allow: [...METHODS].join(", "),
    },
  );
});

app.use(
  helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'", (_req, res) => `'nonce-${res.locals.nonce}'`],
        scriptSrcAttr: ["'none'"],
        // React's style attributes and Plotly's injected style sheets need inline styles; scripts never run inline.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", "data:", "blob:"],
        fontSrc: ["'self'", "data:"],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", "blob:"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
    strictTransportSecurity: false, // set below, only for requests that came over https
    crossOriginEmbedderPolicy: false,
    referrerPolicy: { policy: "same-origin" },
    xFrameOptions: { action: "deny" },
  }),
);
app.use((req, res, next) => {
  if (req.secure)
    res.setHeader(
      "Strict-Transport-Security",
      "max-age=31536000; includeSubDomains",
    );
  next();
});

// Large answers (a 100,000-point lookup is ~15 MB of JSON) are compressed in 256 KiB chunks: zlib works off the
// event loop, and fewer, larger chunks keep its callbacks on the loop few.
app.use(compression({ chunkSize: 256 * 1024 }));
app.use(
  "/assets",
  precompressed,
  express.static(path.join(clientDir, "assets"), {
    immutable: true,
    maxAge: "1y",
    fallthrough: false,
  }),
);
// Other files of the build (favicon, fonts): only paths that name a file are looked up on disk.
const staticFiles = express.static(clientDir, { maxAge: "1h", index: false });
app.use((req, res, next) =>
  /\.[a-z0-9]{1,8}$/i.test(req.path) && !req.path.startsWith("/api/")
    ? staticFiles(req, res, next)
    : next(),
);

app.use(createRequestHandler({ build, mode: "production" }));

// Errors that reach Express (a request the Fetch API cannot represent, a failed stream): never the process.
app.use((error, req, res, _next) => {
  const status = Number(error?.status ?? error?.statusCode);
  const clientFault =
    (status >= 400 && status < 500) ||
    error instanceof URIError ||
    error instanceof TypeError;
  if (!clientFault)
    logger.error(
      {
        requestId: res.getHeader("X-Request-Id"),
        error: {
          kind: error?.name,
          message: String(error?.message).slice(0, 200),
        },
      },
      "request failed in the server",
    );
  if (res.headersSent) return res.destroy();
  if (status === 404)
    return sendProblem(req, res, 404, "not_found", "There is no such file.");
  if (clientFault)
    return sendProblem(
      req,
      res,
      status >= 400 && status < 500 ? status : 400,
      "bad_request",
      "This request is malformed (its address, headers or body cannot be read).",
    );
  sendProblem(
    req,
    res,
    500,
    "internal_error",
    "The server failed to answer this request. It has been logged.",
  );
});

// ---- the HTTP server -------------------------------------------------------------------------------------------
const server = http.createServer(
  { maxHeaderSize: 16 * 1024, requireHostHeader: false },
  app,
);
server.requestTimeout = env.REQUEST_TIMEOUT_MS;
server.headersTimeout = Math.min(30_000, env.REQUEST_TIMEOUT_MS);
server.keepAliveTimeout = 5_000;

// Requests Node's parser refuses (bad syntax, oversized headers, timeouts) get a problem-details answer.
server.on("clientError", (error, socket) => {
  if (error.code === "ECONNRESET" || !socket.writable) return socket.destroy();
  const status =
    error.code === "HPE_HEADER_OVERFLOW"
      ? 431
      : error.code === "ERR_HTTP_REQUEST_TIMEOUT"
        ? 408
        : 400;
  const body = problemBody(
    status,
    status === 431
      ? "headers_too_large"
      : status === 408
        ? "timeout"
        : "bad_request",
    status === 431
      ? "The request's headers are larger than 16 KiB."
      : status === 408
        ? "The request took too long to arrive."
        : "The request could not be parsed as HTTP.",
  );
  socket.end(
    `HTTP/1.1 ${status} ${http.STATUS_CODES[status]}\r\nContent-Type: application/problem+json; charset=utf-8\r\n` +
      `Content-Length: ${Buffer.byteLength(body)}\r\nCache-Control: no-store\r\nConnection: close\r\n\r\n${body}`,
  );
});

// CONNECT (tunnels) is not served; without this, Node closes such a connection with no answer at all.
server.on("connect", (_req, socket) => {
  const body = problemBody(
    405,
    "method_not_allowed",
    "The method CONNECT is not accepted here.",
  );
  socket.on("error", () => socket.destroy());
  socket.end(
    `HTTP/1.1 405 Method Not Allowed\r\nContent-Type: application/problem+json; charset=utf-8\r\nAllow: ${[...METHODS].join(", ")}\r\n` +
      `Content-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
  );
});

// A fault in one request must not end the process serving everyone else.
process.on("unhandledRejection", (reason) =>
  logger.error(
    {
      error: {
        kind: reason?.name,
        message: String(reason?.message ?? reason).slice(0, 200),
      },
    },
    "unhandled rejection",
  ),
);
process.on("uncaughtException", (error) =>
  logger.error(
    {
      error: {
        kind: error?.name,
        message: String(error?.message).slice(0, 200),
      },
    },
    "uncaught exception",
  ),
);

function shutdown(signal) {
  if (draining) {
    logger.warn({ signal }, "second signal: closing every connection now");
    server.closeAllConnections();
    return;
  }
  draining = true;
  logger.info(
    { signal, timeoutMs: env.SHUTDOWN_TIMEOUT_MS },
    "shutting down: finishing requests in flight",
  );
  const force = setTimeout(() => {
    logger.warn("requests still in flight at the shutdown bound: closing them");
    server.closeAllConnections();
  }, env.SHUTDOWN_TIMEOUT_MS);
  force.unref();
  server.close(async () => {
    clearTimeout(force);
    try {
      await hooks.close();
      logger.info("stopped");
      process.exit(0);
    } catch (error) {
      logger.error(
        {
          error: {
            kind: error?.name,
            message: String(error?.message).slice(0, 200),
          },
        },
        "shutdown failed",
      );
      process.exit(1);
    }
  });
  server.closeIdleConnections();
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));

server.on("error", (error) => {
  const detail =
    error.code === "EADDRINUSE"
      ? `port ${env.PORT} on ${env.HOST} is already in use`
      : error.message;
  process.stderr.write(`Isopleth cannot start: ${detail}\n`);
  process.exit(1);
});

await hooks.checkDatabaseAtStartup();
server.listen(env.PORT, env.HOST, () => {
  logger.info({ url: `http://${env.HOST}:${env.PORT}` }, "listening");
});
