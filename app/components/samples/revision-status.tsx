import { REVISION_STATUS_LABELS } from "./labels";

const STYLE: Record<string, string> = {
  draft: "border-caution/40 bg-caution-soft text-caution",
  approved: "border-accent/30 bg-accent-soft text-accent-strong",
  rejected: "border-danger/40 bg-red-50 text-danger",
  superseded: "border-line bg-surface text-ink-muted",
};

export function RevisionStatusBadge({ status }: { status: string }) {
  return (
    <span
      className={`inline-block rounded border px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap ${STYLE[status] ?? STYLE.superseded}`}
    >
      {REVISION_STATUS_LABELS[status] ?? status}
    </span>
  );
}
