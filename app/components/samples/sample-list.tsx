import { Form, href, Link } from "react-router";
import { formatListed } from "~/core/format";
import { SAMPLE_TYPES } from "~/utils/sample-vocabulary";
import { Button } from "~/components/form";
import {
  SAMPLE_STATUS_FILTERS,
  SAMPLE_TYPE_LABELS,
  type SampleSort,
} from "./labels";
import { sampleListUrl, type SampleListQuery } from "./list-query";

/** One page of the samples list as the loader hands it over; reservoir conditions in the reader's units. */
export type SampleListView = {
  query: SampleListQuery;
  total: number;
  /** 1-based positions of the first and last sample shown (0 when none). */
  first: number;
  last: number;
  pageCount: number;
  canCreate: boolean;
  units: { pressure: string; temperature: string };
  rows: {
    id: number;
    label: string;
    sampleType: string;
    samplingDate: string | null;
    fieldName: string;
    wellName: string;
    laboratory: string | null;
    reservoirPressure: number | null;
    reservoirTemperature: number | null;
    approvedRevision: number | null;
    drafts: number;
  }[];
};

const STATUS_LABELS: Record<(typeof SAMPLE_STATUS_FILTERS)[number], string> = {
  approved: "With approved tables",
  none: "Without approved tables",
  draft: "With drafts awaiting review",
};

const isFiltered = (query: SampleListQuery) =>
  !!(query.q || query.type || query.status);

/** The search box and the type and tables filters (a GET form: the filters live in the URL). */
export function SampleSearchForm({ query }: { query: SampleListQuery }) {
  return (
    <Form
      method="get"
      role="search"
      className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-4 text-sm"
    >
      <label className="flex min-w-56 flex-1 flex-col gap-1">
        <span className="font-semibold">Search</span>
        <input
          type="search"
          name="q"
          defaultValue={query.q ?? ""}
          placeholder="Sample, well, field, laboratory or report"
          className="rounded border border-line px-2 py-1.5"
        />
      </label>
      <FilterSelect
        label="Type"
        name="type"
        value={query.type}
        options={SAMPLE_TYPES}
        labels={SAMPLE_TYPE_LABELS}
      />
      <FilterSelect
        label="Tables"
        name="status"
        value={query.status}
        options={SAMPLE_STATUS_FILTERS}
        labels={STATUS_LABELS}
      />
      <input type="hidden" name="sort" value={query.sort} />
      <input type="hidden" name="dir" value={query.dir} />
      <Button type="submit">Search</Button>
      {isFiltered(query) ? (
        <Link
          to={href("/samples")}
          className="self-center text-accent underline"
        >
          Clear
        </Link>
      ) : null}
    </Form>
  );
}

function SortHeader({
  query,
  sort,
  children,
  numeric = false,
}: {
  query: SampleListQuery;
  sort: SampleSort;
  children: React.ReactNode;
  numeric?: boolean;
}) {
  const active = query.sort === sort;
  const nextDir = active && query.dir === "asc" ? "desc" : "asc";
  return (
    <th
      scope="col"
      aria-sort={
        active ? (query.dir === "asc" ? "ascending" : "descending") : undefined
      }
      className={`px-3 py-2 font-semibold ${numeric ? "text-right" : ""}`}
    >
      <Link
        to={sampleListUrl(query, { sort, dir: nextDir, page: 1 })}
        className="inline-flex items-center gap-1 hover:text-ink hover:underline"
      >
        {children}
        <span
          aria-hidden="true"
          className={active ? "text-accent-strong" : "text-line"}
        >
          {active && query.dir === "desc" ? "▼" : "▲"}
        </span>
        <span className="sr-only">
          {active
            ? `, sorted ${query.dir === "asc" ? "ascending" : "descending"}`
            : ", sort"}
        </span>
      </Link>
    </th>
  );
}

/** The samples of one page, sortable by each column. */
export function SampleListTable({
  query,
  rows,
  units,
}: Pick<SampleListView, "query" | "rows" | "units">) {
  return (
    <div className="relative mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-sm">
        <caption className="sr-only">Samples, sortable by each column</caption>
        <thead className="bg-surface text-left text-ink-muted">
          <tr>
            <SortHeader query={query} sort="field">
              Field
            </SortHeader>
            <SortHeader query={query} sort="well">
              Well
            </SortHeader>
            <SortHeader query={query} sort="label">
              Sample
            </SortHeader>
            <SortHeader query={query} sort="type">
              Type
            </SortHeader>
            <SortHeader query={query} sort="sampled">
              Sampled
            </SortHeader>
            <SortHeader query={query} sort="pressure" numeric>
              Reservoir p ({units.pressure})
            </SortHeader>
            <SortHeader query={query} sort="temperature" numeric>
              Reservoir T ({units.temperature})
            </SortHeader>
            <SortHeader query={query} sort="revision" numeric>
              Approved revision
            </SortHeader>
          </tr>
        </thead>
        <tbody>
          {rows.map((s) => (
            <tr key={s.id} className="border-t border-line">
              <td className="px-3 py-2">{s.fieldName}</td>
              <td className="px-3 py-2">{s.wellName}</td>
              <td className="px-3 py-2 font-semibold">
                <Link
                  to={href("/samples/:sampleId", { sampleId: String(s.id) })}
                  className="text-accent-strong hover:underline"
                >
                  {s.label}
                </Link>
              </td>
              <td className="px-3 py-2">
                {SAMPLE_TYPE_LABELS[s.sampleType] ?? s.sampleType}
              </td>
              <td className="px-3 py-2 tabular-nums">
                {s.samplingDate ?? "—"}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">
                {formatListed(s.reservoirPressure)}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">
                {formatListed(s.reservoirTemperature)}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">
                {s.approvedRevision ?? (
                  <span className="text-ink-muted">none</span>
                )}
                {s.drafts > 0 ? (
                  <span className="ml-2 rounded border border-caution/40 bg-caution-soft px-1.5 py-0.5 text-xs font-semibold text-caution">
                    {s.drafts} draft{s.drafts === 1 ? "" : "s"}
                  </span>
                ) : null}
              </td>
            </tr>
          ))}
          {rows.length === 0 ? (
            <tr>
              <td colSpan={8} className="px-3 py-6 text-center text-ink-muted">
                {isFiltered(query)
                  ? "No samples match the search."
                  : "No samples yet."}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}

/** Previous and next page links around "Page n of m". */
export function SampleListPager({
  query,
  pageCount,
}: Pick<SampleListView, "query" | "pageCount">) {
  return (
    <nav aria-label="Pages" className="mt-4 flex items-center gap-3 text-sm">
      {query.page > 1 ? (
        <Link
          to={sampleListUrl(query, { page: query.page - 1 })}
          className="text-accent underline"
        >
          Previous page
        </Link>
      ) : null}
      <span>
        Page {Math.min(query.page, pageCount)} of {pageCount}
      </span>
      {query.page < pageCount ? (
        <Link
          to={sampleListUrl(query, { page: query.page + 1 })}
          className="text-accent underline"
        >
          Next page
        </Link>
      ) : null}
    </nav>
  );
}

/** A filter of the list: one of the options, or "Any" (no filter). */
function FilterSelect<T extends string>({
  label,
  name,
  value,
  options,
  labels,
}: {
  label: string;
  name: string;
  value: T | undefined | null;
  options: readonly T[];
  labels: Record<T, string>;
}) {
  return (
    <label className="flex flex-col gap-1">
      <span className="font-semibold">{label}</span>
      <select
        name={name}
        defaultValue={value ?? ""}
        className="rounded border border-line px-2 py-1.5"
      >
        <option value="">Any</option>
        {options.map((option) => (
          <option key={option} value={option}>
            {labels[option]}
          </option>
        ))}
      </select>
    </label>
  );
}
