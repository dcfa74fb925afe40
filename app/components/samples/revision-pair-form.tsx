import { Form } from "react-router";
import { Button } from "~/components/form";
import type { RevisionStatus } from "~/utils/sample-vocabulary";
import { REVISION_STATUS_LABELS } from "./labels";

type RevisionChoice = { number: number; status: RevisionStatus };

function RevisionOption({ revision }: { revision: RevisionChoice }) {
  return (
    <option value={revision.number}>
      Revision {revision.number} (
      {REVISION_STATUS_LABELS[revision.status]?.toLowerCase() ??
        revision.status}
      )
    </option>
  );
}

/** Two lists of the sample's revisions, "From" and "To", sent as the query string of the diff page. */
export function RevisionPairForm({
  revisions,
  from,
  to,
}: {
  revisions: RevisionChoice[];
  from: number | null;
  to: number | null;
}) {
  return (
    <Form
      method="get"
      className="mt-4 flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-4 text-sm"
    >
      <label className="flex flex-col gap-1">
        <span className="font-semibold">From</span>
        <select
          name="from"
          defaultValue={from ?? undefined}
          className="rounded border border-line px-2 py-1.5"
        >
          {revisions.map((r) => (
            <RevisionOption key={r.number} revision={r} />
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">To</span>
        <select
          name="to"
          defaultValue={to ?? undefined}
          className="rounded border border-line px-2 py-1.5"
        >
          {revisions.map((r) => (
            <RevisionOption key={r.number} revision={r} />
          ))}
        </select>
      </label>
      <Button type="submit">Compare</Button>
    </Form>
  );
}
