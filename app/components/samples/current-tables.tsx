import { href, Link } from "react-router";
import { formatDateTime } from "~/core/format";
import { GridTable } from "./grid-table";
import { FindingList, QcSummaryLine } from "./qc-findings";
import type { DisplayRevisionView } from "./revision-types";

/** The "Current tables" section: the grids of the approved revision, or how to get some. */
export function CurrentTables({
  sampleId,
  current,
  canUpload,
}: {
  sampleId: string;
  current: DisplayRevisionView | null;
  canUpload: boolean;
}) {
  return (
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
                sampleId,
                number: String(current.revision.number),
              })}
              className="text-accent-strong underline"
            >
              revision {current.revision.number}
            </Link>
            , uploaded by {current.revision.uploaderName ?? "a removed account"}{" "}
            on {formatDateTime(current.revision.createdAt)} and approved by{" "}
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
          {canUpload ? (
            <>
              {" "}
              <Link
                to={href("/samples/:sampleId/upload", { sampleId })}
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
  );
}
