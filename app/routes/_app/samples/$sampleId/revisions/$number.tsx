import { data, href, Link, redirect, useSearchParams } from "react-router";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { requireSample, revisionNumberFrom } from "~/.server/samples/params";
import {
  loadRevisionPage,
  submitReview,
} from "~/.server/samples/revision-page";
import { FormAlert } from "~/components/form";
import { BubblePointTable, GridTable } from "~/components/samples/grid-table";
import { FindingList, QcSummaryLine } from "~/components/samples/qc-findings";
import { ReviewPanel } from "~/components/samples/review-panel";
import { ReviewSchema } from "~/components/samples/review-schema";
import { RevisionDetails } from "~/components/samples/revision-details";
import { RevisionStatusBadge } from "~/components/samples/revision-status";
import { SlicePlot } from "~/components/samples/slice-plot";
import type { Route } from "./+types/$number";

export const meta: Route.MetaFunction = ({ data }) => [
  {
    title: data
      ? `Revision ${data.view.revision.number} of ${data.sample.label} · Isopleth`
      : "Revision · Isopleth",
  },
];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  return loadRevisionPage(args.params, user);
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "review:revisions");
  const { ipAddress } = getCaller(args);
  const sample = await requireSample(args.params);
  const number = revisionNumberFrom(args.params.number);
  if (number === null)
    throw data("There is no such revision.", { status: 404 });
  const form = await parseForm(args.request, ReviewSchema);
  if (!form.ok)
    return badRequest({
      errors: form.errors,
      formError: "The review was not saved.",
    });
  const review = await submitReview({
    sample,
    number,
    form: form.data,
    reviewer: user,
    ipAddress,
  });
  if (!review.ok)
    return badRequest({ errors: review.errors, formError: review.formError });
  throw redirect(
    `${href("/samples/:sampleId/revisions/:number", { sampleId: String(sample.id), number: String(number) })}?reviewed=${form.data.intent === "approve" ? "approved" : "rejected"}`,
  );
}

export default function RevisionPage({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { sample, view, canReview, isUploader, fourEyes } = loaderData;
  const [params] = useSearchParams();
  const r = view.revision;
  const sampleUrl = href("/samples/:sampleId", { sampleId: String(sample.id) });
  const flash =
    params.get("stored") !== null
      ? `Stored as draft revision ${r.number}. It is not used anywhere until a lab lead approves it.`
      : params.get("reviewed") === "approved"
        ? `Revision ${r.number} is approved: it is now the sample's current tables, and followers have been e-mailed.`
        : params.get("reviewed") === "rejected"
          ? `Revision ${r.number} is rejected.`
          : null;
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
        › Revision {r.number}
      </nav>
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-bold tracking-tight">
          Revision {r.number} of {sample.label}
        </h1>
        <RevisionStatusBadge status={r.status} />
      </div>
      <div className="mb-4">
        <FormAlert message={flash} tone="ok" />
      </div>
      <RevisionDetails view={view} />

      {r.status === "draft" && canReview ? (
        <div className="mt-6">
          <ReviewPanel
            view={view}
            isUploader={isUploader}
            fourEyes={fourEyes}
            actionData={actionData}
          />
        </div>
      ) : null}

      <section aria-labelledby="qc" className="mt-8 space-y-3">
        <h2 id="qc" className="text-lg font-semibold">
          Quality checks
        </h2>
        <QcSummaryLine summary={view.summary} />
        {view.reportOrigin === "checked-now" ? (
          <p className="text-xs text-ink-muted">
            This revision was stored without a QC report (demo data); the checks
            were run now on its grids.
          </p>
        ) : null}
        <FindingList
          findings={view.findings}
          empty="No findings: every check passed."
        />
      </section>

      <section aria-labelledby="grids" className="mt-8 space-y-4">
        <h2 id="grids" className="text-lg font-semibold">
          Measured grids
        </h2>
        <BubblePointTable bubblePoints={view.bubblePoints} />
        <div className="grid gap-4 lg:grid-cols-2">
          {view.grids.map((g) => (
            <GridTable key={g.property} grid={g} />
          ))}
        </div>
        <details className="rounded-lg border border-line bg-panel p-4">
          <summary className="cursor-pointer font-semibold">
            Slice plots
          </summary>
          <div className="mt-3 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {view.grids.map((g) => (
              <SlicePlot key={g.property} grid={g} />
            ))}
          </div>
        </details>
      </section>
    </>
  );
}
