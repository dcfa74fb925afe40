import type { PropertyRun } from "./property-run";

/** Said wherever a page shows values of an unapproved revision (asked for with ?revision=N). */
export function DraftBanner({ runs }: { runs: PropertyRun[] }) {
  const drafts = [
    ...new Map(
      runs.flatMap((r) =>
        r.ok && !r.approved ? [[r.revision, r.revisionStatus] as const] : [],
      ),
    ).entries(),
  ];
  if (drafts.length === 0) return null;
  return (
    <div
      role="alert"
      className="mt-6 rounded-lg border border-danger/40 bg-red-50 p-4 text-sm text-danger"
    >
      <strong>Unapproved draft.</strong>{" "}
      {drafts
        .map(([number, status]) => `revision ${number} (${status})`)
        .join(", ")}{" "}
      has not been approved; its checks may have failed. These values are for
      review only: do not use them for decisions or hand them on.
    </div>
  );
}
