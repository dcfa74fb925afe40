// Preloaded into the app server: `node --import ./scripts/serve-hooks.mjs node_modules/@react-router/serve/bin.js
// ./build/server/index.js`. react-router-serve stays the server; this module adds two things it lacks:
//
// 1. The client's address. react-router-serve hands route code a Fetch Request, which has no socket. The TCP
//    peer address is copied into the header `x-isopleth-peer` before the app sees the request, after deleting
//    any copy a client sent, so the value cannot be forged.
// 2. Pre-compressed static assets. `npm run build` writes .br and .gz beside every compressible file in
//    build/client (scripts/compress-assets.mjs); a GET for /assets/… whose client accepts brotli (or gzip) is
//    answered from that file, with no compression work per request. Everything else goes to react-router-serve.
import { createReadStream, statSync } from "node:fs";
import http from "node:http";
import path from "node:path";

const PEER_HEADER = "x-isopleth-peer";
const serverBuild = process.argv.find((a) => a.endsWith(path.join("server", "index.js")));
const assetsDir = serverBuild ? path.resolve(path.dirname(serverBuild), "..", "client", "assets") : null;
const TYPES = {
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".svg": "image/svg+xml",
  ".map": "application/json; charset=utf-8",
};
const sizes = new Map(); // path → size or -1; build output never changes while the server runs

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

function servePrecompressed(req, res) {
  if (!assetsDir || (req.method !== "GET" && req.method !== "HEAD")) return false;
  const url = req.url ?? "";
  if (!url.startsWith("/assets/")) return false;
  const name = decodeURIComponent(url.slice("/assets/".length).split("?")[0] ?? "");
  if (!name || name.includes("/") || name.includes("\\") || name.startsWith(".")) return false;
  const type = TYPES[path.extname(name)];
  if (!type) return false;
  const accepted = String(req.headers["accept-encoding"] ?? "");
  const file = path.join(assetsDir, name);
  for (const [encoding, ext] of [["br", ".br"], ["gzip", ".gz"]]) {
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
    else createReadStream(file + ext).pipe(res);
    return true;
  }
  return false;
}

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function patchedEmit(event, req, res, ...rest) {
  if (event === "request" && req && req.headers) {
    const raw = req.rawHeaders;
    for (let i = raw.length - 2; i >= 0; i -= 2) {
      if (String(raw[i]).toLowerCase() === PEER_HEADER) raw.splice(i, 2);
    }
    const address = req.socket?.remoteAddress ?? "unknown";
    req.headers[PEER_HEADER] = address;
    raw.push(PEER_HEADER, address);
    if (servePrecompressed(req, res)) return true;
  }
  return emit.call(this, event, req, res, ...rest);
};

globalThis.__isoplethPeerAddressHook = true;
