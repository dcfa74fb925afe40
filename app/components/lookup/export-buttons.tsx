import { Form, href } from "react-router";
import type { LookupQuery } from "./use-lookup-run";

const BUTTON =
  "rounded border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:border-accent";

/**
 * "Export CSV" and "Export XLSX": a plain form post of the lookup on screen to the export resource route
 * (/lookup/export), which computes it again on the server and answers with the file.
 */
export function LookupExportButtons({ query }: { query: LookupQuery }) {
  const lookup = JSON.stringify({
    sampleId: query.sampleId,
    revision: query.revision,
    properties: query.properties,
    units: query.units,
    method: query.method,
    degree: query.method === "newton" ? query.degree : null,
    extrapolate: query.extrapolate,
    conditions: query.conditions,
  });
  return (
    <Form
      method="post"
      action={href("/lookup/export")}
      reloadDocument
      className="flex gap-2"
    >
      <input type="hidden" name="lookup" value={lookup} />
      <button type="submit" name="format" value="csv" className={BUTTON}>
        Export CSV
      </button>
      <button type="submit" name="format" value="xlsx" className={BUTTON}>
        Export XLSX
      </button>
    </Form>
  );
}
