import { pingDatabase } from "~/.server/db/queries/health";

/** GET /api/health: 200 when the app and its database answer, 503 when the database does not. */
export async function loader() {
  const up = await pingDatabase();
  return Response.json(
    { status: up ? "ok" : "degraded", database: up ? "up" : "down" },
    { status: up ? 200 : 503, headers: { "Cache-Control": "no-store" } },
  );
}
