import { checkReadiness } from "~/.server/ops/readiness";

/**
 * GET /api/ready: 200 when this instance can take traffic (the database accepts a write, its migrations are
 * current, the disks have room), 503 naming the failing checks otherwise. Liveness stays GET /api/health.
 */
export async function loader() {
  const readiness = await checkReadiness();
  return Response.json(readiness, {
    status: readiness.failing.length === 0 ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
