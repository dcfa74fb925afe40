import { requireApiCaller } from "~/.server/api/caller";
import { readFormData } from "~/.server/forms";
import { LookupExportSchema, lookupExportSheet } from "~/.server/lookup/export";
import { EXPORT_FORMATS, sheetDownload } from "~/.server/spreadsheet";
import type { Route } from "./+types/export";

/**
 * POST /lookup/export (a resource route: the lookup page's "Export CSV" and "Export XLSX" forms). Fields:
 * `format` (csv or xlsx) and `lookup`, the page's lookup as JSON (sample, revision, properties, settings,
 * conditions). The lookup is computed again on the server, with the API's access rules; the answer is the
 * file, or a 400 in plain words.
 */
export async function action(args: Route.ActionArgs) {
  const caller = await requireApiCaller(args, "lookup");
  const form = await readFormData(args.request);
  const format = EXPORT_FORMATS.find((f) => f === form.get("format"));
  if (!format) return refuse("Choose the format of the export: csv or xlsx.");
  let body: unknown;
  try {
    body = JSON.parse(String(form.get("lookup") ?? ""));
  } catch {
    return refuse("The lookup to export is missing or is not valid JSON.");
  }
  const parsed = LookupExportSchema.safeParse(body);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return refuse(
      `The lookup to export is not valid: ${issue.path.join(".") || "lookup"}: ${issue.message}`,
    );
  }
  const { sheet, fileBase } = await lookupExportSheet(caller, parsed.data);
  return sheetDownload(sheet, format, fileBase);
}

function refuse(message: string): Response {
  return new Response(message, {
    status: 400,
    headers: { "Content-Type": "text/plain; charset=utf-8" },
  });
}
