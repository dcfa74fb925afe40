import { requirePermission } from "~/.server/auth/guards";
import type { Route } from "./+types/$file";

// Placeholder until the upload templates land.
export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  return new Response("template", { headers: { "Content-Type": "text/csv" } });
}
