// Preloaded into the app server (`node --import ./scripts/peer-address.mjs …`).
// react-router-serve hands route code a Fetch Request, which has no socket, so the client's address would be
// unknown. This hook copies the TCP peer address into the request header `x-isopleth-peer` before the app sees
// the request, after deleting any copy a client sent, so the value cannot be forged.
import http from "node:http";

const HEADER = "x-isopleth-peer";
const emit = http.Server.prototype.emit;

http.Server.prototype.emit = function patchedEmit(event, req, ...rest) {
  if (event === "request" && req && req.headers) {
    const raw = req.rawHeaders;
    for (let i = raw.length - 2; i >= 0; i -= 2) {
      if (String(raw[i]).toLowerCase() === HEADER) raw.splice(i, 2);
    }
    const address = req.socket?.remoteAddress ?? "unknown";
    req.headers[HEADER] = address;
    raw.push(HEADER, address);
  }
  return emit.call(this, event, req, ...rest);
};

globalThis.__isoplethPeerAddressHook = true;
