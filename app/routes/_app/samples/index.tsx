import { href, Link } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import { loadSampleList } from "~/.server/samples/list";
import { PageHeader } from "~/components/page-header";
import {
  SAMPLE_LIST_PAGE_SIZE,
  SampleListQuerySchema,
} from "~/components/samples/list-query";
import {
  SampleListPager,
  SampleListTable,
  SampleSearchForm,
} from "~/components/samples/sample-list";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Samples · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const url = new URL(args.request.url);
  const query = SampleListQuerySchema.parse(
    Object.fromEntries(url.searchParams),
  );
  return loadSampleList(query, SAMPLE_LIST_PAGE_SIZE, user);
}

export default function Samples({ loaderData }: Route.ComponentProps) {
  const { query, total, first, last, pageCount, rows, canCreate, units } =
    loaderData;
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
      <SampleSearchForm query={query} />
      <p className="mt-4 text-sm text-ink-muted" aria-live="polite">
        {total === 0
          ? "No samples match."
          : `Samples ${first}–${last} of ${total}`}
      </p>
      <SampleListTable query={query} rows={rows} units={units} />
      <SampleListPager query={query} pageCount={pageCount} />
    </>
  );
}
