import { href, Link } from "react-router";
import { formatDateTime } from "~/core/format";
import { QcStatusBadge } from "./qc-findings";
import { RevisionStatusBadge } from "./revision-status";
import type { RevisionHistoryRow } from "./revision-types";

/** The "Revision history" section: every revision of the sample, newest first, with links to open and compare. */
export function RevisionHistory({
  sampleId,
  sampleLabel,
  revisions,
}: {
  sampleId: string;
  sampleLabel: string;
  revisions: RevisionHistoryRow[];
}) {
  const diffUrl = href("/samples/:sampleId/diff", { sampleId });
  return (
    <section aria-labelledby="history" className="mt-8">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="history" className="text-lg font-semibold">
          Revision history
        </h2>
        {revisions.length > 1 ? (
          <Link to={diffUrl} className="text-sm text-accent underline">
            Compare two revisions
          </Link>
        ) : null}
      </div>
      <p className="text-sm text-ink-muted">
        Every upload is a new revision; revisions never change. The current
        tables are those of the latest approved one.
      </p>
      <div className="relative mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <caption className="sr-only">
            Revisions of {sampleLabel}, newest first
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
                        <span className="text-ink-muted">awaiting review</span>
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
                        sampleId,
                        number: String(r.number),
                      })}
                      className="text-accent underline"
                      aria-label={`Open revision ${r.number}`}
                    >
                      Open
                    </Link>
                    {older ? (
                      <Link
                        to={`${diffUrl}?from=${older.number}&to=${r.number}`}
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
  );
}
