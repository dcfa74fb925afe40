import { problem } from "~/.server/http";

/** Any other /api/* path: a problem-details 404 rather than an HTML page. */
export async function loader({ request }: { request: Request }) {
  return problem(
    404,
    "not_found",
    `There is no API endpoint ${new URL(request.url).pathname}. See /api/v1/openapi.json.`,
  );
}

export async function action({ request }: { request: Request }) {
  return loader({ request });
}
