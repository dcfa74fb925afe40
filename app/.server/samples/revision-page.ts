import { data } from "react-router";
import { getFourEyesPolicy } from "~/.server/db/queries/settings";
import type { OutputSystem } from "~/core/units";
import type { ReviewForm } from "~/components/samples/review-schema";
import { can, type Role } from "~/utils/permissions";
import { notifyFollowersOfApproval } from "./notify";
import { requireSample, revisionNumberFrom } from "./params";
import { reviewRevision, type ReviewOutcome } from "./review";
import { loadRevisionView } from "./revision-view";

/**
 * What the revision page shows: the revision in the reader's units with its QC findings, and, for a draft, what
 * the reader may do about it (the four-eyes policy in force). A 404 when the sample or the revision is not there.
 */
export async function loadRevisionPage(
  params: { sampleId?: string; number?: string },
  user: { id: number; role: Role; unitSystem: OutputSystem },
) {
  const sample = await requireSample(params);
  const number = revisionNumberFrom(params.number);
  const view =
    number === null
      ? null
      : await loadRevisionView(sample, number, user.unitSystem);
  if (!view)
    throw data(`Sample ${sample.label} has no revision ${params.number}.`, {
      status: 404,
    });
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

type Refusal = Extract<ReviewOutcome, { ok: false }>;

/** What the review form says when the review is refused, and the field it belongs to. */
function refusalMessage(
  outcome: Refusal,
  number: number,
): { field?: string; text: string } {
  const messages: Record<Refusal["reason"], { field?: string; text: string }> =
    {
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
  return messages[outcome.reason];
}

/**
 * Approves or rejects a draft (the rules are in ./review.ts) and, after an approval, e-mails the sample's
 * followers. A refusal comes back as form errors.
 */
export async function submitReview(input: {
  sample: { id: number; label: string; wellName: string; fieldName: string };
  number: number;
  form: ReviewForm;
  reviewer: { id: number; name: string };
  ipAddress: string | null;
}): Promise<
  | { ok: true }
  | { ok: false; errors: Record<string, string[]>; formError: string }
> {
  const { sample, number, form, reviewer } = input;
  const outcome = await reviewRevision({
    sampleId: sample.id,
    number,
    decision: form.intent,
    reviewerId: reviewer.id,
    comment: form.comment || null,
    acknowledgedWarnings: form.acknowledge === "yes",
    ipAddress: input.ipAddress,
  });
  if (!outcome.ok) {
    const m = refusalMessage(outcome, number);
    return {
      ok: false,
      errors: m.field ? { [m.field]: [m.text] } : {},
      formError: m.text,
    };
  }
  if (form.intent === "approve") {
    await notifyFollowersOfApproval({
      sample,
      number,
      previousNumber: outcome.previousApproved,
      approverName: reviewer.name,
    });
  }
  return { ok: true };
}
