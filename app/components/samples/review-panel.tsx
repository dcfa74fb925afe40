import { useId } from "react";
import { Form, useNavigation } from "react-router";
import {
  Button,
  FieldError,
  FormAlert,
  useZodForm,
  type FieldErrors,
} from "~/components/form";
import { describeFourEyes, type FourEyesPolicy } from "~/utils/four-eyes";
import { ReviewSchema } from "./review-schema";
import type { DisplayRevisionView } from "./revision-types";

/** The approve / reject form of a draft, with what blocks approval (QC errors, four-eyes) said up front. */
export function ReviewPanel({
  view,
  isUploader,
  fourEyes,
  actionData,
}: {
  view: Pick<DisplayRevisionView, "summary" | "revision">;
  isUploader: boolean;
  fourEyes: FourEyesPolicy | null;
  actionData: { errors?: FieldErrors; formError?: string } | undefined;
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
      {ownBlocked && fourEyes ? (
        <p
          role="note"
          className="mt-3 rounded border border-caution/40 bg-amber-50 px-3 py-2 text-sm"
          data-testid="four-eyes"
        >
          Four-eyes approval is on ({describeFourEyes(fourEyes)}): a revision
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
