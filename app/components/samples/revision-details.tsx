import { formatDateTime } from "~/core/format";
import type { DisplayRevisionView } from "./revision-types";

/** Who uploaded and reviewed a revision, its file and comments. */
export function RevisionDetails({
  view,
}: {
  view: Pick<DisplayRevisionView, "revision" | "file">;
}) {
  const r = view.revision;
  return (
    <dl className="grid gap-x-6 gap-y-3 rounded-lg border border-line bg-panel p-5 text-sm sm:grid-cols-2 lg:grid-cols-3">
      <div>
        <dt className="text-xs font-semibold text-ink-muted">Uploaded by</dt>
        <dd data-testid="uploaded-by">
          {r.uploaderName ?? "a removed account"}, {formatDateTime(r.createdAt)}
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
        <dt className="text-xs font-semibold text-ink-muted">Upload comment</dt>
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
  );
}
