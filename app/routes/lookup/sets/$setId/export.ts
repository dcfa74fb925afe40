import { requirePermission } from "~/.server/auth/guards";
import { lookupRunSheet } from "~/.server/lookup/sets";
import { EXPORT_FORMATS, sheetDownload } from "~/.server/spreadsheet";
import type { Route } from "./+types/export";

const ID = /^[1-9]\d{0,15}$/;

/**
 * GET /lookup/sets/:setId/export?run=<id>&format=csv|xlsx (a resource route): one recorded run of one of the
 * user's sets as a file, written like a lookup's export. 404 in plain words for a set or run that is not theirs.
 */
export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const url = new URL(args.request.url);
  const format = EXPORT_FORMATS.find(
    (f) => f === (url.searchParams.get("format") ?? "csv"),
  );
  if (!format) return text(400, "format must be csv or xlsx.");
  const setId = args.params.setId ?? "";
  const runId = url.searchParams.get("run") ?? "";
  if (!ID.test(setId) || !ID.test(runId))
    return text(404, "There is no such run of a lookup set among yours.");
  const found = await lookupRunSheet(Number(setId), Number(runId), user.id);
  if (!found)
    return text(404, "There is no such run of a lookup set among yours.");
  return sheetDownload(found.sheet, format, found.fileBase);
}

function text(status: number, message: string): Response {
  return new Response(message, {
    status,
    headers: { "Content-Type": "text/plain; charset=utf-8" },
  });
}
