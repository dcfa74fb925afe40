import { getEnv } from "~/.server/env";

declare global {
  // Set by scripts/server.mjs, the production server.
  var __isoplethPeerAddressHook: boolean | undefined;
}

/**
 * The client's network address, for sign-in throttling and the audit trail.
 * Behind a reverse proxy (TRUST_PROXY=true) it is the first X-Forwarded-For entry; otherwise the TCP peer address
 * recorded by scripts/server.mjs, which strips any client-sent copy of its header.
 */
export function clientAddress(request: Request): string {
  if (getEnv().TRUST_PROXY) {
    const forwarded = request.headers
      .get("x-forwarded-for")
      ?.split(",")[0]
      ?.trim();
    if (forwarded) return forwarded.slice(0, 64);
  }
  if (globalThis.__isoplethPeerAddressHook) {
    const peer = request.headers.get("x-isopleth-peer");
    if (peer) return peer.replace(/^::ffff:/, "").slice(0, 64);
  }
  return "unknown";
}
