import { verifyApiToken } from "~/.server/api/tokens";
import { clientAddress } from "~/.server/auth/client-address";
import { problem } from "~/.server/http";
import { registry } from "~/.server/ops/metrics";
import type { Route } from "./+types/metrics";

const LOOPBACK = new Set(["127.0.0.1", "::1", "localhost"]);

/**
 * GET /metrics: Prometheus text format (prom-client). Served to a scraper on the same machine (loopback), or to
 * a bearer token whose owner is currently an administrator; anyone else gets 403. Behind a reverse proxy
 * (TRUST_PROXY=true) the client is the forwarded address, so the proxy does not make everyone loopback.
 */
export async function loader({ request }: Route.LoaderArgs) {
  const address = clientAddress(request);
  const bearer = /^Bearer\s+(\S+)$/i.exec(
    request.headers.get("Authorization") ?? "",
  )?.[1];
  let allowed = LOOPBACK.has(address);
  if (!allowed && bearer) {
    const check = await verifyApiToken(bearer, address);
    allowed = check.ok && check.caller.user.role === "admin";
  }
  if (!allowed) {
    return problem(
      403,
      "forbidden",
      "Metrics are served to loopback, or to an administrator's API token.",
    );
  }
  return new Response(await registry.metrics(), {
    headers: {
      "Content-Type": registry.contentType,
      "Cache-Control": "no-store",
    },
  });
}
