import { Form, href, Link } from "react-router";
import { z } from "zod";
import { requirePermission } from "~/.server/auth/guards";
import { listAuditEntries } from "~/.server/db/queries/audit";
import { listUsers } from "~/.server/db/queries/users";
import { Button } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { AUDIT_ACTIONS } from "~/utils/audit-actions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "Audit log · Isopleth" },
];

const PAGE_SIZE = 50;
const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/)
  .optional()
  .catch(undefined);
const FilterSchema = z.object({
  person: z.coerce.number().int().positive().optional().catch(undefined),
  action: z.enum(AUDIT_ACTIONS).optional().catch(undefined),
  from: day,
  to: day,
  page: z.coerce.number().int().min(1).default(1).catch(1),
});

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:audit-log");
  const url = new URL(args.request.url);
  const filter = FilterSchema.parse(Object.fromEntries(url.searchParams));
  const { total, rows } = await listAuditEntries(
    {
      userId: filter.person,
      action: filter.action,
      from: filter.from ? new Date(`${filter.from}T00:00:00Z`) : undefined,
      to: filter.to ? new Date(`${filter.to}T23:59:59.999Z`) : undefined,
    },
    { limit: PAGE_SIZE, offset: (filter.page - 1) * PAGE_SIZE },
  );
  const people = (await listUsers()).map((u) => ({
    id: u.id,
    name: u.name,
    email: u.email,
  }));
  return {
    filter,
    total,
    rows,
    people,
    pageCount: Math.max(1, Math.ceil(total / PAGE_SIZE)),
  };
}

export default function AuditLog({ loaderData }: Route.ComponentProps) {
  const { filter, total, rows, people, pageCount } = loaderData;
  const pageLink = (page: number) => {
    const params = new URLSearchParams();
    for (const [k, v] of Object.entries({ ...filter, page }))
      if (v !== undefined && v !== "") params.set(k, String(v));
    return `${href("/admin/audit")}?${params}`;
  };
  return (
    <>
      <PageHeader title="Audit log">
        Who did what, when and from where. Newest first.
      </PageHeader>
      <Form
        method="get"
        className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-4 text-sm"
      >
        <label className="flex max-w-full min-w-0 flex-col gap-1">
          <span className="font-semibold">Person</span>
          <select
            name="person"
            defaultValue={filter.person ?? ""}
            className="max-w-full rounded border border-line px-2 py-1.5"
          >
            <option value="">Anyone</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.email})
              </option>
            ))}
          </select>
        </label>
        <label className="flex max-w-full min-w-0 flex-col gap-1">
          <span className="font-semibold">Action</span>
          <select
            name="action"
            defaultValue={filter.action ?? ""}
            className="max-w-full rounded border border-line px-2 py-1.5"
          >
            <option value="">Any</option>
            {AUDIT_ACTIONS.map((a) => (
              <option key={a} value={a}>
                {a.replaceAll("_", " ")}
              </option>
            ))}
          </select>
        </label>
        <label className="flex max-w-full min-w-0 flex-col gap-1">
          <span className="font-semibold">From</span>
          <input
            type="date"
            name="from"
            defaultValue={filter.from ?? ""}
            className="rounded border border-line px-2 py-1"
          />
        </label>
        <label className="flex max-w-full min-w-0 flex-col gap-1">
          <span className="font-semibold">To</span>
          <input
            type="date"
            name="to"
            defaultValue={filter.to ?? ""}
            className="rounded border border-line px-2 py-1"
          />
        </label>
        <Button type="submit">Filter</Button>
      </Form>
      <p className="mt-4 text-sm text-ink-muted">{total} entries</p>
      <div className="relative mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <thead className="bg-surface text-left text-ink-muted">
            <tr>
              <th className="px-3 py-2 font-semibold">When (UTC)</th>
              <th className="px-3 py-2 font-semibold">Who</th>
              <th className="px-3 py-2 font-semibold">What</th>
              <th className="px-3 py-2 font-semibold">Concerning</th>
              <th className="px-3 py-2 font-semibold">Details</th>
              <th className="px-3 py-2 font-semibold">From</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-t border-line align-top">
                <td className="px-3 py-2 whitespace-nowrap tabular-nums">
                  {new Date(r.createdAt)
                    .toISOString()
                    .replace("T", " ")
                    .slice(0, 19)}
                </td>
                <td className="px-3 py-2">
                  {r.userEmail ??
                    (r.apiTokenId ? `token ${r.apiTokenId.slice(0, 8)}` : "—")}
                </td>
                <td className="px-3 py-2">{r.action.replaceAll("_", " ")}</td>
                <td className="px-3 py-2">
                  {r.entityType ? `${r.entityType} ${r.entityId ?? ""}` : "—"}
                </td>
                <td
                  className="max-w-80 truncate px-3 py-2 font-mono text-xs"
                  title={r.details ? JSON.stringify(r.details) : ""}
                >
                  {r.details ? JSON.stringify(r.details) : ""}
                </td>
                <td className="px-3 py-2 tabular-nums">{r.ipAddress ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="mt-4 flex items-center gap-3 text-sm">
        {filter.page > 1 ? (
          <Link
            to={pageLink(filter.page - 1)}
            className="text-accent underline"
          >
            Newer
          </Link>
        ) : null}
        <span>
          Page {filter.page} of {pageCount}
        </span>
        {filter.page < pageCount ? (
          <Link
            to={pageLink(filter.page + 1)}
            className="text-accent underline"
          >
            Older
          </Link>
        ) : null}
      </nav>
    </>
  );
}
