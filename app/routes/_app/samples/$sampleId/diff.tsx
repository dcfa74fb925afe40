import { href, Link } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import { getRevisionDiffPage } from "~/.server/samples/diff";
import { requireSample } from "~/.server/samples/params";
import {
  DiffByPropertyTable,
  DiffCellTable,
} from "~/components/samples/diff-table";
import { RevisionPairForm } from "~/components/samples/revision-pair-form";
import type { Route } from "./+types/diff";

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Changes · ${data?.sample.label ?? "Sample"} · Isopleth` },
];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  const query = new URL(args.request.url).searchParams;
  return getRevisionDiffPage(sample, user.unitSystem, query);
}

export default function DiffPage({ loaderData }: Route.ComponentProps) {
  const { sample, revisions, from, to, result, units } = loaderData;
  const sampleUrl = href("/samples/:sampleId", { sampleId: String(sample.id) });
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        ›{" "}
        <Link to={sampleUrl} className="hover:underline">
          {sample.label}
        </Link>{" "}
        › Changes
      </nav>
      <h1 className="text-2xl font-bold tracking-tight">
        {from !== null && to !== null
          ? `Changes from revision ${from} to revision ${to}`
          : "Compare revisions"}
      </h1>
      <p className="mt-1 max-w-3xl text-ink-muted">
        Measured cells of {sample.label} compared one by one: a cell is a
        property at one pressure and one temperature. Values in your unit
        system.
      </p>
      {revisions.length === 0 ? (
        <p className="mt-4 text-sm text-ink-muted">
          This sample has no revisions yet.
        </p>
      ) : (
        <RevisionPairForm revisions={revisions} from={from} to={to} />
      )}
      {result && "missing" in result ? (
        <p
          role="alert"
          className="mt-4 rounded border border-danger/40 bg-red-50 px-3 py-2 text-sm text-danger"
        >
          {sample.label} has no revision {result.missing.join(" or ")}. Choose
          revisions from the lists.
        </p>
      ) : null}
      {result && "diff" in result ? (
        <>
          <p className="mt-4 text-sm" aria-live="polite">
            {result.diff.counts.changed} changed, {result.diff.counts.added}{" "}
            added, {result.diff.counts.removed} removed,{" "}
            {result.diff.counts.unchanged} unchanged.
            {from === to ? " (The same revision on both sides.)" : ""}
          </p>
          {result.diff.byProperty.length > 1 ? (
            <DiffByPropertyTable byProperty={result.diff.byProperty} />
          ) : null}
          <DiffCellTable
            id="changed"
            title="Changed cells"
            rows={result.diff.changed}
            total={result.diff.counts.changed}
            kind="changed"
            units={units}
          />
          <DiffCellTable
            id="added"
            title={`Added in revision ${to}`}
            rows={result.diff.added}
            total={result.diff.counts.added}
            kind="added"
            units={units}
          />
          <DiffCellTable
            id="removed"
            title={`Removed since revision ${from}`}
            rows={result.diff.removed}
            total={result.diff.counts.removed}
            kind="removed"
            units={units}
          />
        </>
      ) : null}
    </>
  );
}
