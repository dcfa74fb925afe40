import { requirePermission } from "~/.server/auth/guards";
import {
  buildTemplateCsv,
  buildTemplateXlsx,
  templateFileName,
  type Layout,
} from "~/core/lab-data";
import type { Route } from "./+types/$file";

/*
 * The downloadable upload templates: long and grid layouts, as CSV and XLSX (isopleth-template-long.csv,
 * isopleth-template-grid.xlsx, …). They carry a small invented example; built once per process.
 */
const TEMPLATES = (["long", "grid"] as const).flatMap((layout) =>
  (["csv", "xlsx"] as const).map((format) => ({
    layout,
    format,
    name: templateFileName(layout, format),
  })),
);
const built = new Map<string, Promise<Uint8Array>>();

async function build(
  layout: Layout,
  format: "csv" | "xlsx",
): Promise<Uint8Array> {
  return format === "csv"
    ? new TextEncoder().encode(buildTemplateCsv(layout))
    : buildTemplateXlsx(layout);
}

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  const template = TEMPLATES.find((t) => t.name === args.params.file);
  if (!template) {
    return new Response(
      `There is no template named "${args.params.file}". Templates: ${TEMPLATES.map((t) => t.name).join(", ")}.`,
      {
        status: 404,
        headers: { "Content-Type": "text/plain; charset=utf-8" },
      },
    );
  }
  let bytes = built.get(template.name);
  if (!bytes) {
    bytes = build(template.layout, template.format);
    bytes.catch(() => built.delete(template.name));
    built.set(template.name, bytes);
  }
  return new Response(new Blob([(await bytes) as Uint8Array<ArrayBuffer>]), {
    headers: {
      "Content-Type":
        template.format === "csv"
          ? "text/csv; charset=utf-8"
          : "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
      "Content-Disposition": `attachment; filename="${template.name}"`,
      "Cache-Control": "private, max-age=3600",
    },
  });
}
