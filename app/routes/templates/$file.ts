import { redirect } from "react-router";
import type { Route } from "./+types/$file";

/*
 * The upload templates' first address, /templates/:file: a permanent redirect to /upload-templates/:file, so
 * links saved before the rename keep working. No guard here: the target checks the caller.
 */
export function loader({ params }: Route.LoaderArgs) {
  return redirect(`/upload-templates/${encodeURIComponent(params.file)}`, 308);
}
