import { Form, href, Link, useNavigation, useSearchParams } from "react-router";
import { z } from "zod";
import {
  METRE_PER_FOOT,
  toOutputPressure,
  toOutputTemperature,
  unitLabel,
} from "~/core/units";
import { requirePermission } from "~/.server/auth/guards";
import {
  countFollowers,
  followSample,
  isFollowing,
  unfollowSample,
} from "~/.server/db/queries/follows";
import { listRevisionsOfSample } from "~/.server/db/queries/revisions";
import { badRequest, parseForm } from "~/.server/forms";
import { requireSample } from "~/.server/samples/params";
import { loadRevisionView } from "~/.server/samples/revision-view";
import { standardLabel } from "~/.server/samples/sample-input";
import { Button, FormAlert } from "~/components/form";
import {
  formatDateTime,
  formatMeasured,
  roundSignificant,
} from "~/core/format";
import { BubblePointTable, GridTable } from "~/components/samples/grid-table";
import { SAMPLE_TYPE_LABELS } from "~/components/samples/labels";
import {
  FindingList,
  QcStatusBadge,
  QcSummaryLine,
} from "~/components/samples/qc-findings";
import { RevisionStatusBadge } from "~/components/samples/revision-status";
import { can } from "~/utils/permissions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `${data?.sample.label ?? "Sample"} · Isopleth` },
];

const FollowSchema = z.object({
  intent: z.enum(["follow", "unfollow"], {
    error: "Choose follow or unfollow.",
  }),
});

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  const system = user.unitSystem;
  const [revisions, following, followers] = await Promise.all([
    listRevisionsOfSample(sample.id),
    isFollowing(sample.id, user.id),
    countFollowers(sample.id),
  ]);
  const current = revisions.find((r) => r.status === "approved") ?? null;
  const view = current
    ? await loadRevisionView(sample, current.number, system)
    : null;
  const round = (v: number) => roundSignificant(v, 6);
  return {
    sample: {
      id: sample.id,
      label: sample.label,
      fieldName: sample.fieldName,
      wellName: sample.wellName,
      sampleType: sample.sampleType,
      samplingDate: sample.samplingDate,
      depth:
        sample.samplingDepthFt === null
          ? null
          : round(
              system === "metric"
                ? sample.samplingDepthFt * METRE_PER_FOOT
                : sample.samplingDepthFt,
            ),
      reservoirPressure:
        sample.reservoirPressurePsia === null
          ? null
          : round(toOutputPressure(sample.reservoirPressurePsia, system)),
      reservoirTemperature:
        sample.reservoirTemperatureF === null
          ? null
          : round(toOutputTemperature(sample.reservoirTemperatureF, system)),
      stockTankApi: sample.stockTankApi,
      gasSpecificGravity: sample.gasSpecificGravity,
      standardConditions: standardLabel(sample),
      laboratory: sample.laboratory,
      reportReference: sample.reportReference,
      notes: sample.notes,
    },
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
      depth: system === "metric" ? "m" : "ft",
    },
    revisions: revisions.map((r) => ({
      number: r.number,
      status: r.status,
      comment: r.comment,
      sourceFilename: r.sourceFilename,
      createdAt: r.createdAt.toISOString(),
      uploaderName: r.uploaderName,
      reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
      reviewerName: r.reviewerName,
      ownReview: r.reviewedBy !== null && r.reviewedBy === r.createdBy,
      qcStatus: r.qcStatus,
    })),
    current: view,
    following,
    followers,
    can: {
      edit: can(user, "edit:samples"),
      upload: can(user, "upload:revisions"),
      review: can(user, "review:revisions"),
    },
  };
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  const form = await parseForm(args.request, FollowSchema);
  if (!form.ok)
    return badRequest({
      errors: form.errors,
      formError: "That request was not understood.",
    });
  if (form.data.intent === "follow") await followSample(sample.id, user.id);
  else await unfollowSample(sample.id, user.id);
  return {
    errors: {},
    done:
      form.data.intent === "follow"
        ? "You follow this sample: you will get an e-mail when a new revision is approved."
        : "You no longer follow this sample.",
  };
}

function Meta({
  label,
  children,
}: {
  label: string;
  children: React.ReactNode;
}) {
  return (
    <div>
      <dt className="text-xs font-semibold text-ink-muted">{label}</dt>
      <dd className="mt-0.5">{children ?? "—"}</dd>
    </div>
  );
}

const num = (v: number | null) =>
  v === null ? null : <span className="tabular-nums">{formatMeasured(v)}</span>;

export default function SamplePage({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { sample, units, revisions, current, following, followers } =
    loaderData;
  const navigation = useNavigation();
  const [params] = useSearchParams();
  const id = String(sample.id);
  const drafts = revisions.filter((r) => r.status === "draft");
  const flash = params.get("created")
    ? "The sample is created. Upload its measured results next."
    : params.get("saved")
      ? "The sample's record is saved."
      : null;
  const done = actionData && "done" in actionData ? actionData.done : null;
  const formError =
    actionData && "formError" in actionData ? actionData.formError : null;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        › {sample.fieldName} › {sample.wellName}
      </nav>
      <div className="mb-6 flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">{sample.label}</h1>
          <p className="mt-1 text-ink-muted">
            {SAMPLE_TYPE_LABELS[sample.sampleType] ?? sample.sampleType} sample
            from well {sample.wellName}, {sample.fieldName}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <Form method="post">
            <Button
              type="submit"
              name="intent"
              value={following ? "unfollow" : "follow"}
              variant="secondary"
              disabled={navigation.state === "submitting"}
            >
              {following ? "Unfollow" : "Follow"}
            </Button>
          </Form>
          {loaderData.can.edit ? (
            <Link
              to={href("/samples/:sampleId/edit", { sampleId: id })}
              className="rounded border border-line bg-panel px-4 py-2 text-sm font-semibold hover:border-accent"
            >
              Edit record
            </Link>
          ) : null}
          {loaderData.can.upload ? (
            <Link
              to={href("/samples/:sampleId/upload", { sampleId: id })}
              className="rounded bg-accent px-4 py-2 text-sm font-semibold text-white hover:bg-accent-strong"
            >
              Upload results
            </Link>
          ) : null}
        </div>
      </div>
      <div className="mb-4 space-y-2">
        <FormAlert message={flash ?? done} tone="ok" />
        <FormAlert message={formError} />
      </div>
      <p className="mb-4 text-sm text-ink-muted">
        {following ? "You follow this sample. " : ""}
        {followers === 0
          ? "Nobody follows this sample yet."
          : `${followers} ${followers === 1 ? "person follows" : "people follow"} this sample.`}
      </p>

      <section
        aria-labelledby="record"
        className="rounded-lg border border-line bg-panel p-5"
      >
        <h2 id="record" className="font-semibold">
          Record
        </h2>
        <dl className="mt-3 grid gap-x-6 gap-y-3 text-sm sm:grid-cols-3 lg:grid-cols-4">
          <Meta label="Field">{sample.fieldName}</Meta>
          <Meta label="Well">{sample.wellName}</Meta>
          <Meta label="Sample type">
            {SAMPLE_TYPE_LABELS[sample.sampleType] ?? sample.sampleType}
          </Meta>
          <Meta label="Sampling date">{sample.samplingDate}</Meta>
          <Meta label={`Sampling depth (${units.depth})`}>
            {num(sample.depth)}
          </Meta>
          <Meta label={`Reservoir pressure at sampling (${units.pressure})`}>
            {num(sample.reservoirPressure)}
          </Meta>
          <Meta
            label={`Reservoir temperature at sampling (${units.temperature})`}
          >
            {num(sample.reservoirTemperature)}
          </Meta>
          <Meta label="Stock-tank oil gravity (°API)">
            {num(sample.stockTankApi)}
          </Meta>
          <Meta label="Gas specific gravity (air = 1)">
            {num(sample.gasSpecificGravity)}
          </Meta>
          <Meta label="Standard conditions">{sample.standardConditions}</Meta>
          <Meta label="Laboratory">{sample.laboratory}</Meta>
          <Meta label="Report reference">{sample.reportReference}</Meta>
        </dl>
        {sample.notes ? (
          <p className="mt-3 text-sm whitespace-pre-line">{sample.notes}</p>
        ) : null}
        {current && current.bubblePoints.rows.length > 0 ? (
          <div className="mt-4">
            <BubblePointTable bubblePoints={current.bubblePoints} />
            <p className="mt-1 text-xs text-ink-muted">
              From approved revision {current.revision.number}.
            </p>
          </div>
        ) : null}
      </section>

      {drafts.length > 0 ? (
        <section
          aria-labelledby="drafts"
          className="mt-6 rounded-lg border border-caution/40 bg-caution-soft p-4 text-sm"
        >
          <h2 id="drafts" className="font-semibold text-caution">
            {drafts.length === 1
              ? "A draft revision awaits review"
              : `${drafts.length} draft revisions await review`}
          </h2>
          <ul className="mt-1 list-disc pl-5">
            {drafts.map((d) => (
              <li key={d.number}>
                <Link
                  to={href("/samples/:sampleId/revisions/:number", {
                    sampleId: id,
                    number: String(d.number),
                  })}
                  className="text-accent-strong underline"
                >
                  Revision {d.number}
                </Link>
                , uploaded by {d.uploaderName ?? "someone"} on{" "}
                {formatDateTime(d.createdAt)}
                {loaderData.can.review
                  ? " — open it to approve or reject."
                  : "."}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="tables" className="mt-8">
        <h2 id="tables" className="text-lg font-semibold">
          Current tables
        </h2>
        {current ? (
          <div className="mt-2 space-y-4">
            <p className="text-sm text-ink-muted">
              From{" "}
              <Link
                to={href("/samples/:sampleId/revisions/:number", {
                  sampleId: id,
                  number: String(current.revision.number),
                })}
                className="text-accent-strong underline"
              >
                revision {current.revision.number}
              </Link>
              , uploaded by{" "}
              {current.revision.uploaderName ?? "a removed account"} on{" "}
              {formatDateTime(current.revision.createdAt)} and approved by{" "}
              {current.revision.reviewerName ?? "a removed account"} on{" "}
              {formatDateTime(current.revision.reviewedAt)}
              {current.revision.ownReview
                ? " (approved by the person who uploaded it)"
                : ""}
              . Values in your unit system.
            </p>
            <QcSummaryLine summary={current.summary} />
            {current.reportOrigin === "checked-now" ? (
              <p className="text-xs text-ink-muted">
                This revision was stored without a QC report (demo data); the
                checks were run now on its grids.
              </p>
            ) : null}
            <div className="grid gap-4 lg:grid-cols-2">
              {current.grids.map((g) => (
                <GridTable key={g.property} grid={g} />
              ))}
            </div>
            {current.findings.length > 0 ? (
              <FindingList
                findings={current.findings}
                title="QC findings of this revision"
              />
            ) : null}
          </div>
        ) : (
          <p className="mt-2 text-sm text-ink-muted">
            No approved tables yet.
            {loaderData.can.upload ? (
              <>
                {" "}
                <Link
                  to={href("/samples/:sampleId/upload", { sampleId: id })}
                  className="text-accent underline"
                >
                  Upload the laboratory results
                </Link>
                .
              </>
            ) : null}
          </p>
        )}
      </section>

      <section aria-labelledby="history" className="mt-8">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="history" className="text-lg font-semibold">
            Revision history
          </h2>
          {revisions.length > 1 ? (
            <Link
              to={href("/samples/:sampleId/diff", { sampleId: id })}
              className="text-sm text-accent underline"
            >
              Compare two revisions
            </Link>
          ) : null}
        </div>
        <p className="text-sm text-ink-muted">
          Every upload is a new revision; revisions never change. The current
          tables are those of the latest approved one.
        </p>
        <div className="mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
          <table className="w-full text-sm">
            <caption className="sr-only">
              Revisions of {sample.label}, newest first
            </caption>
            <thead className="bg-surface text-left text-ink-muted">
              <tr>
                <th scope="col" className="px-3 py-2 text-right font-semibold">
                  Revision
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  Status
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  Uploaded
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  Reviewed
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  QC
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  Comment
                </th>
                <th scope="col" className="px-3 py-2 font-semibold">
                  <span className="sr-only">Links</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {revisions.map((r, k) => {
                const older = revisions[k + 1];
                return (
                  <tr key={r.number} className="border-t border-line align-top">
                    <td className="px-3 py-2 text-right font-semibold tabular-nums">
                      {r.number}
                    </td>
                    <td className="px-3 py-2">
                      <RevisionStatusBadge status={r.status} />
                    </td>
                    <td className="px-3 py-2">
                      {r.uploaderName ?? "—"}
                      <span className="block text-xs text-ink-muted">
                        {formatDateTime(r.createdAt)}
                      </span>
                      {r.sourceFilename ? (
                        <span className="block text-xs text-ink-muted">
                          {r.sourceFilename}
                        </span>
                      ) : null}
                    </td>
                    <td className="px-3 py-2">
                      {r.reviewerName ??
                        (r.status === "draft" ? (
                          <span className="text-ink-muted">
                            awaiting review
                          </span>
                        ) : (
                          "—"
                        ))}
                      {r.reviewedAt ? (
                        <span className="block text-xs text-ink-muted">
                          {formatDateTime(r.reviewedAt)}
                        </span>
                      ) : null}
                      {r.ownReview ? (
                        <span className="block text-xs font-semibold text-caution">
                          reviewed by the uploader
                        </span>
                      ) : null}
                    </td>
                    <td className="px-3 py-2">
                      <QcStatusBadge status={r.qcStatus} />
                    </td>
                    <td className="max-w-72 px-3 py-2">{r.comment ?? ""}</td>
                    <td className="px-3 py-2 whitespace-nowrap">
                      <Link
                        to={href("/samples/:sampleId/revisions/:number", {
                          sampleId: id,
                          number: String(r.number),
                        })}
                        className="text-accent underline"
                        aria-label={`Open revision ${r.number}`}
                      >
                        Open
                      </Link>
                      {older ? (
                        <Link
                          to={`${href("/samples/:sampleId/diff", { sampleId: id })}?from=${older.number}&to=${r.number}`}
                          className="ml-3 text-accent underline"
                          aria-label={`Compare revision ${older.number} with revision ${r.number}`}
                        >
                          Changes
                        </Link>
                      ) : null}
                    </td>
                  </tr>
                );
              })}
              {revisions.length === 0 ? (
                <tr>
                  <td
                    colSpan={7}
                    className="px-3 py-6 text-center text-ink-muted"
                  >
                    No revisions yet.
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      </section>
    </>
  );
}
