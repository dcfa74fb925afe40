import { useEffect, useId, useRef } from "react";
import { FieldError, type FieldErrors } from "~/components/form";
import {
  identicalRevisionText,
  type IdenticalRevisionNote,
} from "~/utils/upload-form";
import { BubblePointTable, GridTable } from "./grid-table";
import { FindingList, QcSummaryLine } from "./qc-findings";
import { SlicePlot } from "./slice-plot";
import type { UploadPreview } from "./types";

/**
 * The checked file before anything is stored: what was parsed, the QC findings, the grids with their flagged
 * cells and slice plots, and the part of the form that stores it (the checked file's digest, the "store it
 * anyway" box for an identical file, the comment). Its heading takes the focus when a new file is previewed.
 */
export function UploadPreviewPanel({
  preview,
  nextNumber,
  errors,
  hasGravities,
  identical,
  comment,
}: {
  preview: UploadPreview;
  nextNumber: number;
  errors: FieldErrors;
  hasGravities: boolean;
  identical: IdenticalRevisionNote | null;
  comment: string | undefined;
}) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    headingRef.current?.focus();
  }, [preview.sha256]);
  return (
    <section
      aria-labelledby="preview-heading"
      className="space-y-4"
      data-testid="preview"
    >
      <h2
        id="preview-heading"
        ref={headingRef}
        tabIndex={-1}
        className="text-lg font-semibold outline-none"
      >
        Preview of {preview.fileName}
      </h2>
      <p className="text-sm text-ink-muted">
        {preview.format.toUpperCase()} file, {preview.layout} layout
        {preview.sheets
          ? `, sheets ${preview.sheets.map((s) => `“${s}”`).join(", ")}`
          : ""}
        : {preview.counts.properties}{" "}
        {preview.counts.properties === 1 ? "property" : "properties"} at{" "}
        {preview.counts.temperatures}{" "}
        {preview.counts.temperatures === 1 ? "temperature" : "temperatures"} and{" "}
        {preview.counts.pressures} pressures, {preview.counts.cells} measured
        values. Nothing is stored yet.
      </p>
      <QcSummaryLine summary={preview.summary} />
      {preview.gaugeNote ? (
        <p className="text-xs text-ink-muted">{preview.gaugeNote}</p>
      ) : null}
      {!hasGravities ? (
        <p className="text-xs text-ink-muted">
          The sample record has no stock-tank oil gravity or gas gravity, so the
          correlation and density checks were skipped.
        </p>
      ) : null}
      <FindingList
        findings={preview.findings}
        title="QC findings"
        empty="No findings: every check passed."
      />
      <BubblePointTable bubblePoints={preview.bubblePoints} />
      <div
        className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3"
        aria-label="Slice plots"
      >
        {preview.grids.map((g) => (
          <SlicePlot key={g.property} grid={g} />
        ))}
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        {preview.grids.map((g) => (
          <GridTable key={g.property} grid={g} />
        ))}
      </div>
      <StoreDraftFields
        preview={preview}
        nextNumber={nextNumber}
        errors={errors}
        identical={identical}
        comment={comment}
      />
    </section>
  );
}

/** The fields sent with "Store as draft revision": the checked file's digest, the identical-file box, the comment. */
function StoreDraftFields({
  preview,
  nextNumber,
  errors,
  identical,
  comment,
}: {
  preview: UploadPreview;
  nextNumber: number;
  errors: FieldErrors;
  identical: IdenticalRevisionNote | null;
  comment: string | undefined;
}) {
  const commentId = useId();
  const identicalId = useId();
  const { errors: errorCount, warnings } = preview.summary;
  return (
    <div className="rounded-lg border border-accent/40 bg-panel p-5">
      <h3 className="font-semibold">Store as draft revision {nextNumber}</h3>
      <p className="mt-1 text-sm text-ink-muted">
        The file is sent again and checked again on the server; exactly what it
        holds is stored as a draft. A lab lead then approves or rejects it
        {errorCount > 0
          ? "; with errors it cannot be approved, but the draft keeps a record of the file"
          : warnings > 0
            ? "; the warnings must be acknowledged to approve it"
            : ""}
        .
      </p>
      <input type="hidden" name="previewSha256" value={preview.sha256} />
      {identical ? (
        <div
          className="mt-3 rounded border border-caution/40 bg-amber-50 px-3 py-2 text-sm"
          data-testid="identical"
        >
          <p>
            {identicalRevisionText(identical)} Storing it again makes a second
            revision with the same measurements.
          </p>
          <div className="mt-2 flex items-start gap-2">
            <input
              id={identicalId}
              type="checkbox"
              name="storeIdentical"
              value="yes"
              className="mt-1"
              aria-invalid={errors.storeIdentical?.length ? true : undefined}
              aria-describedby={
                errors.storeIdentical?.length
                  ? `${identicalId}-error`
                  : undefined
              }
            />
            <label htmlFor={identicalId}>
              Store it anyway as revision {nextNumber}
            </label>
          </div>
          <FieldError
            id={`${identicalId}-error`}
            errors={errors.storeIdentical}
          />
        </div>
      ) : null}
      <div className="mt-3">
        <label htmlFor={commentId} className="block text-sm font-semibold">
          Comment
        </label>
        <textarea
          id={commentId}
          name="comment"
          defaultValue={comment}
          rows={2}
          className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 text-sm aria-invalid:border-danger"
          aria-invalid={errors.comment?.length ? true : undefined}
          aria-describedby={`${commentId}-hint${errors.comment?.length ? ` ${commentId}-error` : ""}`}
        />
        <p id={`${commentId}-hint`} className="mt-1 text-xs text-ink-muted">
          Required: which report this is and what changed since the last
          revision.
        </p>
        <FieldError id={`${commentId}-error`} errors={errors.comment} />
      </div>
    </div>
  );
}
