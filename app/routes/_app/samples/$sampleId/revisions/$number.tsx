import { useId } from "react";
import {
  data,
  Form,
  href,
  Link,
  redirect,
  useNavigation,
  useSearchParams,
} from "react-router";
import { z } from "zod";
import type { OutputSystem } from "~/core/units";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { getFourEyesPolicy } from "~/.server/db/queries/settings";
import { badRequest, parseForm } from "~/.server/forms";
import { notifyFollowersOfApproval } from "~/.server/samples/notify";
import { requireSample, revisionNumberFrom } from "~/.server/samples/params";
import { reviewRevision } from "~/.server/samples/review";
import { loadRevisionView } from "~/.server/samples/revision-view";
import { Button, FieldError, FormAlert, useZodForm } from "~/components/form";
import { formatDateTime } from "~/core/format";
import { BubblePointTable, GridTable } from "~/components/samples/grid-table";
import { FindingList, QcSummaryLine } from "~/components/samples/qc-findings";
import { RevisionStatusBadge } from "~/components/samples/revision-status";
import { SlicePlot } from "~/components/samples/slice-plot";
import { multilineTextSchema } from "~/utils/labels";
import { describeFourEyes } from "~/utils/four-eyes";
import { can } from "~/utils/permissions";
import type { Route } from "./+types/$number";

export const meta: Route.MetaFunction = ({ data }) => [
  {
    title: data
      ? `Revision ${data.view.revision.number} of ${data.sample.label} · Isopleth`
      : "Revision · Isopleth",
  },
];

const ReviewSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({
      intent: z.literal("approve"),
      comment: multilineTextSchema("review comment")
        .trim()
        .max(2000, "Use at most 2000 characters.")
        .optional()
        .default(""),
      acknowledge: z.literal("yes").optional(),
    }),
    z.object({
      intent: z.literal("reject"),
      comment: multilineTextSchema("review comment")
        .trim()
        .min(1, "Say why the revision is rejected; the uploader will read it.")
        .max(2000, "Use at most 2000 characters."),
      acknowledge: z.string().optional(),
    }),
  ],
  { error: "Choose approve or reject." },
);

async function load(
  args: { params: { sampleId?: string; number?: string } },
  system: OutputSystem,
) {
  const sample = await requireSample(args.params);
  const number = revisionNumberFrom(args.params.number);
  const view =
    number === null ? null : await loadRevisionView(sample, number, system);
  if (!view)
    throw data(
      `Sample ${sample.label} has no revision ${args.params.number}.`,
      { status: 404 },
    );
  return { sample, view };
}

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const { sample, view } = await load(args, user.unitSystem);
  return {
    sample: {
      id: sample.id,
      label: sample.label,
      wellName: sample.wellName,
      fieldName: sample.fieldName,
    },
    view,
    canReview: can(user, "review:revisions"),
    isUploader: view.revision.createdBy === user.id,
    fourEyes:
      view.revision.status === "draft" ? await getFourEyesPolicy() : null,
  };
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
  const outcome = await reviewRevision({
    sampleId: sample.id,
    number,
    decision: form.data.intent,
    reviewerId: user.id,
    comment: form.data.comment || null,
    acknowledgedWarnings: form.data.acknowledge === "yes",
    ipAddress,
  });
  if (!outcome.ok) {
    const messages: Record<
      typeof outcome.reason,
      { field?: string; text: string }
    > = {
      not_found: { text: "This revision no longer exists." },
      not_draft: {
        text: `Only drafts can be reviewed; this revision is ${outcome.status ?? "already reviewed"}.`,
      },
      own_upload: {
        text: `Four-eyes approval is on: a revision must be approved by someone other than the person who uploaded it, and you uploaded revision ${number}. Ask another lab lead or an administrator to approve it. Nothing was changed.`,
      },
      qc_errors: {
        text: "The QC checks found errors, so this revision cannot be approved. Reject it and upload a corrected file.",
      },
      no_qc_report: {
        text: "This revision has no QC report, so it cannot be approved.",
      },
      warnings_not_acknowledged: {
        field: "acknowledge",
        text: "Tick the box to confirm you have read the warnings.",
      },
    };
    const m = messages[outcome.reason];
    return badRequest({
      errors: m.field ? { [m.field]: [m.text] } : {},
      formError: m.text,
    });
  }
  if (form.data.intent === "approve") {
    await notifyFollowersOfApproval({
      sample,
      number,
      previousNumber: outcome.previousApproved,
      approverName: user.name,
    });
  }
  throw redirect(
    `${href("/samples/:sampleId/revisions/:number", { sampleId: String(sample.id), number: String(number) })}?reviewed=${form.data.intent === "approve" ? "approved" : "rejected"}`,
  );
}

function ReviewPanel({
  view,
  isUploader,
  fourEyes,
  actionData,
}: {
  view: Route.ComponentProps["loaderData"]["view"];
  isUploader: boolean;
  fourEyes: Route.ComponentProps["loaderData"]["fourEyes"];
  actionData: Route.ComponentProps["actionData"];
}) {
  const navigation = useNavigation();
  const form = useZodForm(ReviewSchema, actionData?.errors);
  const ackId = useId();
  const commentId = useId();
  const { errors, warnings } = view.summary;
  const blocked = errors > 0;
  const ownBlocked = isUploader && !!fourEyes?.required;
  return (
    <section
      aria-labelledby="review"
      className="rounded-lg border border-caution/40 bg-panel p-5"
    >
      <h2 id="review" className="font-semibold">
        Review this draft
      </h2>
      <p className="mt-1 text-sm text-ink-muted">
        Approving makes these grids the sample&apos;s current tables (the
        approved revision before it becomes superseded) and e-mails the
        sample&apos;s followers. Rejecting keeps the revision for the record;
        nothing else changes.
        {isUploader && !ownBlocked
          ? " You uploaded this revision: you may approve it yourself, and the history will show that you did."
          : ""}
      </p>
      {ownBlocked ? (
        <p
          role="note"
          className="mt-3 rounded border border-caution/40 bg-amber-50 px-3 py-2 text-sm"
          data-testid="four-eyes"
        >
          Four-eyes approval is on ({describeFourEyes(fourEyes!)}): a revision
          must be approved by someone other than its uploader. You uploaded this
          one, so another lab lead or an administrator approves it; you may
          still reject it.
        </p>
      ) : null}
      {blocked ? (
        <p
          role="alert"
          className="mt-3 rounded border border-danger/40 bg-red-50 px-3 py-2 text-sm text-danger"
        >
          Approval is blocked: the QC checks found {errors}{" "}
          {errors === 1 ? "error" : "errors"} (see the findings below). Reject
          the revision and upload a corrected file.
        </p>
      ) : null}
      <Form
        method="post"
        noValidate
        onSubmit={form.onSubmit}
        className="mt-3 space-y-3"
      >
        <FormAlert message={actionData?.formError} />
        {warnings > 0 && !blocked ? (
          <div>
            <div className="flex items-start gap-2">
              <input
                id={ackId}
                type="checkbox"
                name="acknowledge"
                value="yes"
                className="mt-1"
                aria-invalid={
                  form.errors.acknowledge?.length ? true : undefined
                }
                aria-describedby={
                  form.errors.acknowledge?.length ? `${ackId}-error` : undefined
                }
              />
              <label htmlFor={ackId} className="text-sm">
                I have read the {warnings}{" "}
                {warnings === 1 ? "warning" : "warnings"} below and accept the
                values as measured.
              </label>
            </div>
            <FieldError
              id={`${ackId}-error`}
              errors={form.errors.acknowledge}
            />
          </div>
        ) : null}
        <div>
          <label htmlFor={commentId} className="block text-sm font-semibold">
            Review comment
          </label>
          <textarea
            id={commentId}
            name="comment"
            rows={2}
            className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 text-sm"
            aria-describedby={`${commentId}-hint${form.errors.comment?.length ? ` ${commentId}-error` : ""}`}
            aria-invalid={form.errors.comment?.length ? true : undefined}
          />
          <p id={`${commentId}-hint`} className="mt-1 text-xs text-ink-muted">
            Optional when approving; required when rejecting.
          </p>
          <FieldError id={`${commentId}-error`} errors={form.errors.comment} />
        </div>
        <div className="flex flex-wrap gap-3">
          <Button
            type="submit"
            name="intent"
            value="approve"
            disabled={
              blocked || ownBlocked || navigation.state === "submitting"
            }
          >
            Approve revision {view.revision.number}
          </Button>
          <Button
            type="submit"
            name="intent"
            value="reject"
            variant="danger"
            disabled={navigation.state === "submitting"}
          >
            Reject
          </Button>
        </div>
      </Form>
    </section>
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
      <dl className="grid gap-x-6 gap-y-3 rounded-lg border border-line bg-panel p-5 text-sm sm:grid-cols-2 lg:grid-cols-3">
        <div>
          <dt className="text-xs font-semibold text-ink-muted">Uploaded by</dt>
          <dd data-testid="uploaded-by">
            {r.uploaderName ?? "a removed account"},{" "}
            {formatDateTime(r.createdAt)}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-muted">File</dt>
          <dd className="[overflow-wrap:anywhere]">
            {r.sourceFilename ?? "—"}
            {view.file ? (
              <span className="text-ink-muted">
                {" "}
                ({view.file.format.toUpperCase()}, {view.file.layout} layout)
              </span>
            ) : null}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-muted">
            {r.status === "rejected"
              ? "Rejected by"
              : r.status === "draft"
                ? "Review"
                : "Approved by"}
          </dt>
          <dd data-testid="reviewed-by">
            {r.status === "draft"
              ? "awaiting review"
              : `${r.reviewerName ?? "a removed account"}, ${r.reviewedAt ? formatDateTime(r.reviewedAt) : "time not recorded"}`}
            {r.ownReview ? (
              <span className="block text-xs font-semibold text-caution">
                Reviewed by the person who uploaded it.
              </span>
            ) : null}
          </dd>
        </div>
        <div className="sm:col-span-2 lg:col-span-3">
          <dt className="text-xs font-semibold text-ink-muted">
            Upload comment
          </dt>
          <dd>{r.comment ?? "—"}</dd>
        </div>
        {r.reviewComment ? (
          <div className="sm:col-span-2 lg:col-span-3">
            <dt className="text-xs font-semibold text-ink-muted">
              Review comment
            </dt>
            <dd>{r.reviewComment}</dd>
          </div>
        ) : null}
        {r.sourceSha256 ? (
          <div className="sm:col-span-2 lg:col-span-3">
            <dt className="text-xs font-semibold text-ink-muted">
              SHA-256 of the uploaded file
            </dt>
            <dd className="font-mono text-xs break-all">{r.sourceSha256}</dd>
          </div>
        ) : null}
      </dl>

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
