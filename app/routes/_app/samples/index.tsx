import { Form, href, Link } from "react-router";
import { z } from "zod";
import { toOutputPressure, toOutputTemperature, unitLabel } from "~/core/units";
import { requirePermission } from "~/.server/auth/guards";
import { searchSamples } from "~/.server/db/queries/samples";
import { Button } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { formatMeasured, roundSignificant } from "~/core/format";
import {
  SAMPLE_SORTS,
  SAMPLE_STATUS_FILTERS,
  SAMPLE_TYPE_LABELS,
  type SampleSort,
} from "~/components/samples/labels";
import { SAMPLE_TYPES } from "~/utils/sample-vocabulary";
import { can } from "~/utils/permissions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Samples · Isopleth" }];

const PAGE_SIZE = 20;
const ListSchema = z.object({
  q: z.string().trim().max(120).optional().catch(undefined),
  type: z.enum(SAMPLE_TYPES).optional().catch(undefined),
  status: z.enum(SAMPLE_STATUS_FILTERS).optional().catch(undefined),
  sort: z.enum(SAMPLE_SORTS).default("field").catch("field"),
  dir: z.enum(["asc", "desc"]).default("asc").catch("asc"),
  page: z.coerce.number().int().min(1).max(1_000_000).default(1).catch(1),
});

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const url = new URL(args.request.url);
  const query = ListSchema.parse(Object.fromEntries(url.searchParams));
  const { total, rows } = await searchSamples({
    ...query,
    pageSize: PAGE_SIZE,
  });
  const system = user.unitSystem;
  return {
    query,
    total,
    pageCount: Math.max(1, Math.ceil(total / PAGE_SIZE)),
    canCreate: can(user, "edit:samples"),
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
    },
    rows: rows.map((r) => ({
      id: r.id,
      label: r.label,
      sampleType: r.sampleType,
      samplingDate: r.samplingDate,
      fieldName: r.fieldName,
      wellName: r.wellName,
      laboratory: r.laboratory,
      reservoirPressure:
        r.reservoirPressurePsia === null
          ? null
          : toOutputPressure(r.reservoirPressurePsia, system),
      reservoirTemperature:
        r.reservoirTemperatureF === null
          ? null
          : toOutputTemperature(r.reservoirTemperatureF, system),
      approvedRevision: r.approvedRevision,
      drafts: r.drafts,
    })),
  };
}

type Query = z.output<typeof ListSchema>;

function listUrl(query: Query, change: Partial<Query>): string {
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

const STATUS_LABELS: Record<(typeof SAMPLE_STATUS_FILTERS)[number], string> = {
  approved: "With approved tables",
  none: "Without approved tables",
  draft: "With drafts awaiting review",
};

function SortHeader({
  query,
  sort,
  children,
  numeric = false,
}: {
  query: Query;
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
        to={listUrl(query, { sort, dir: nextDir, page: 1 })}
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

export default function Samples({ loaderData }: Route.ComponentProps) {
  const { query, total, pageCount, rows, canCreate, units } = loaderData;
  const first = total === 0 ? 0 : (query.page - 1) * PAGE_SIZE + 1;
  const last = Math.min(total, query.page * PAGE_SIZE);
  return (
    <>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeader title="Samples">
          Fluid samples with laboratory results, by field and well.
        </PageHeader>
        {canCreate ? (
          <Link
            to={href("/samples/new")}
            className="rounded bg-accent px-4 py-2 text-sm font-semibold text-white hover:bg-accent-strong"
          >
            New sample
          </Link>
        ) : null}
      </div>
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
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Type</span>
          <select
            name="type"
            defaultValue={query.type ?? ""}
            className="rounded border border-line px-2 py-1.5"
          >
            <option value="">Any</option>
            {SAMPLE_TYPES.map((t) => (
              <option key={t} value={t}>
                {SAMPLE_TYPE_LABELS[t]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Tables</span>
          <select
            name="status"
            defaultValue={query.status ?? ""}
            className="rounded border border-line px-2 py-1.5"
          >
            <option value="">Any</option>
            {SAMPLE_STATUS_FILTERS.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <input type="hidden" name="sort" value={query.sort} />
        <input type="hidden" name="dir" value={query.dir} />
        <Button type="submit">Search</Button>
        {query.q || query.type || query.status ? (
          <Link
            to={href("/samples")}
            className="self-center text-accent underline"
          >
            Clear
          </Link>
        ) : null}
      </Form>
      <p className="mt-4 text-sm text-ink-muted" aria-live="polite">
        {total === 0
          ? "No samples match."
          : `Samples ${first}–${last} of ${total}`}
      </p>
      <div className="mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <caption className="sr-only">
            Samples, sortable by each column
          </caption>
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
                  {s.reservoirPressure === null
                    ? "—"
                    : formatMeasured(roundSignificant(s.reservoirPressure, 5))}
                </td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {s.reservoirTemperature === null
                    ? "—"
                    : formatMeasured(
                        roundSignificant(s.reservoirTemperature, 5),
                      )}
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
                <td
                  colSpan={8}
                  className="px-3 py-6 text-center text-ink-muted"
                >
                  {query.q || query.type || query.status
                    ? "No samples match the search."
                    : "No samples yet."}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="mt-4 flex items-center gap-3 text-sm">
        {query.page > 1 ? (
          <Link
            to={listUrl(query, { page: query.page - 1 })}
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
            to={listUrl(query, { page: query.page + 1 })}
            className="text-accent underline"
          >
            Next page
          </Link>
        ) : null}
      </nav>
    </>
  );
}
