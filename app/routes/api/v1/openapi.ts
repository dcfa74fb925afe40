import { openApiDocument } from "~/.server/api/openapi";
import { parseApiQuery } from "~/.server/api/request";
import { json } from "~/.server/api/respond";
import { NoQuery } from "~/.server/api/schemas";
import { getEnv } from "~/.server/env";
import type { Route } from "./+types/openapi";

/** GET /api/v1/openapi.json — the OpenAPI 3.1 description, generated from the zod schemas. Public. */
export async function loader({ request }: Route.LoaderArgs) {
  parseApiQuery(request, NoQuery);
  return json(request, openApiDocument(getEnv().APP_BASE_URL));
}
