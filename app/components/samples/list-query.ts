import { href } from "react-router";
import { z } from "zod";
import { SAMPLE_TYPES } from "~/utils/sample-vocabulary";
import { SAMPLE_SORTS, SAMPLE_STATUS_FILTERS } from "./labels";

/* The samples list's query string: what it searches, filters and sorts by, and which page it shows. */

export const SAMPLE_LIST_PAGE_SIZE = 20;

/** Unknown or malformed values fall back to the defaults, so any URL shows a list. */
export const SampleListQuerySchema = z.object({
  q: z.string().trim().max(120).optional().catch(undefined),
  type: z.enum(SAMPLE_TYPES).optional().catch(undefined),
  status: z.enum(SAMPLE_STATUS_FILTERS).optional().catch(undefined),
  sort: z.enum(SAMPLE_SORTS).default("field").catch("field"),
  dir: z.enum(["asc", "desc"]).default("asc").catch("asc"),
  page: z.coerce.number().int().min(1).max(1_000_000).default(1).catch(1),
});

export type SampleListQuery = z.output<typeof SampleListQuerySchema>;

/** The list's URL for `query` with `change` applied; defaults are left out of the query string. */
export function sampleListUrl(
  query: SampleListQuery,
  change: Partial<SampleListQuery>,
): string {
  const next = { ...query, ...change };
  const params = new URLSearchParams();
  if (next.q) params.set("q", next.q);
  if (next.type) params.set("type", next.type);
  if (next.status) params.set("status", next.status);
  if (next.sort !== "field") params.set("sort", next.sort);
  if (next.dir !== "asc") params.set("dir", next.dir);
  if (next.page > 1) params.set("page", String(next.page));
  const s = params.toString();
  return s ? `${href("/samples")}?${s}` : href("/samples");
}
