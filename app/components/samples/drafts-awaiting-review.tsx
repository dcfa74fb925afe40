import { href, Link } from "react-router";
import { formatDateTime } from "~/core/format";
import type { RevisionHistoryRow } from "./revision-types";

/** The notice on a sample page that drafts await review, with a link to each. */
export function DraftsAwaitingReview({
  sampleId,
  drafts,
  canReview,
}: {
  sampleId: string;
  drafts: RevisionHistoryRow[];
  canReview: boolean;
}) {
  if (drafts.length === 0) return null;
  return (
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
                sampleId,
                number: String(d.number),
              })}
              className="text-accent-strong underline"
            >
              Revision {d.number}
            </Link>
            , uploaded by {d.uploaderName ?? "someone"} on{" "}
            {formatDateTime(d.createdAt)}
            {canReview ? " — open it to approve or reject." : "."}
          </li>
        ))}
      </ul>
    </section>
  );
}
