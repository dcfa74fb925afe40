import { useEffect, useId, useRef, useState } from "react";
import { data, Form, href, Link, redirect, useNavigation } from "react-router";
import { z } from "zod";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import {
  findIdenticalRevision,
  listRevisionsOfSample,
  storeUploadedRevision,
  type IdenticalRevision,
} from "~/.server/db/queries/revisions";
import {
  checkUpload,
  revisionFromUpload,
} from "~/.server/samples/check-upload";
import { requireSample } from "~/.server/samples/params";
import { presentFindings } from "~/.server/samples/present";
import { buildPreview } from "~/.server/samples/preview";
import { describeStoreFailure } from "~/.server/samples/store-failure";
import { logger } from "~/.server/ops/logger";
import { uploadsByOutcome } from "~/.server/ops/metrics";
import { readCappedFormData } from "~/.server/samples/upload";
import { uploadGuide } from "~/.server/samples/upload-guide";
import {
  Button,
  FieldError,
  FormAlert,
  useZodForm,
  type FieldErrors,
} from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { formatDateTime, formatFileSize } from "~/core/format";
import { BubblePointTable, GridTable } from "~/components/samples/grid-table";
import { GuideBlocks, guideSections, Inline } from "~/components/samples/guide";
import { FindingList, QcSummaryLine } from "~/components/samples/qc-findings";
import { SlicePlot } from "~/components/samples/slice-plot";
import type { DisplayFinding } from "~/components/samples/types";
import { UPLOAD_ACCEPT, UPLOAD_LIMIT_BYTES } from "~/utils/upload-form";
import { fieldErrorsOf, readIntent } from "~/utils/forms";
import { multilineTextSchema } from "~/utils/labels";
import type { Route } from "./+types/upload";

/*
 * Upload of measured results, stateless: "Check file" posts the file (intent=preview) and the action parses and
 * checks it and returns the preview, storing nothing. "Store as draft revision" posts the same file again
 * (the file input keeps it) with intent=confirm; the server parses and checks it again and stores exactly that,
 * as one draft revision, in one transaction. Leaving the page stores nothing.
 * A file identical (SHA-256) to a revision already stored for the sample is pointed out in the preview and is
 * stored only with the "store it anyway" box ticked. When storing fails, the page says that nothing was stored
 * and why, and keeps the preview (with its hidden fields), the chosen file and the comment for a retry.
 */

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Upload results · ${data?.sample.label ?? "Sample"} · Isopleth` },
];

const LIMIT_TEXT = `${UPLOAD_LIMIT_BYTES / 1024 / 1024} MB`;

function isFile(value: unknown): value is File {
  return (
    typeof value === "object" &&
    value !== null &&
    "arrayBuffer" in value &&
    "name" in value &&
    "size" in value
  );
}

const fileField = z
  .custom<File>((v) => isFile(v) && !(v.name === "" && v.size === 0), {
    error: "Choose the CSV or XLSX file with the results.",
  })
  .refine((f) => f.size <= UPLOAD_LIMIT_BYTES, {
    error: `The file is over the ${LIMIT_TEXT} limit; upload only the results table.`,
  });

/** What the form sends; one schema for the browser's check and the server's. */
const UploadSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("preview"), file: fileField }),
    z.object({
      intent: z.literal("confirm"),
      file: fileField,
      comment: multilineTextSchema("comment")
        .trim()
        .min(
          1,
          "Say what this upload is (the report, what changed); it is kept with the revision.",
        )
        .max(2000, "Use at most 2000 characters."),
      previewSha256: z.string().optional(),
      storeIdentical: z.literal("yes").optional(),
    }),
  ],
  { error: "Choose “Check file” or “Store as draft revision”." },
);

const IntentSchema = z.object({
  intent: z.enum(["preview", "confirm"], {
    error: "Choose “Check file” or “Store as draft revision”.",
  }),
  file: fileField,
});

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "upload:revisions");
  const sample = await requireSample(args.params);
  const revisions = await listRevisionsOfSample(sample.id);
  return {
    sample: {
      id: sample.id,
      label: sample.label,
      wellName: sample.wellName,
      fieldName: sample.fieldName,
    },
    nextNumber: (revisions[0]?.number ?? 0) + 1,
    hasGravities:
      sample.stockTankApi !== null && sample.gasSpecificGravity !== null,
    guide: guideSections(uploadGuide()),
  };
}

type Identical = {
  number: number;
  status: IdenticalRevision["status"];
  uploaderName: string | null;
  createdAt: string;
};

type ActionResult = {
  kind: "too_large" | "invalid" | "refused" | "preview" | "store_failed";
  formError?: string;
  errors?: FieldErrors;
  refused?: {
    fileName: string;
    errors: DisplayFinding[];
    warnings: DisplayFinding[];
  };
  preview?: ReturnType<typeof buildPreview>;
  /** The revision this file is identical to, if any. */
  identical?: Identical | null;
  /** The comment as sent, to fill the field again after a failed confirm. */
  comment?: string;
};

function identicalOf(r: IdenticalRevision | null): Identical | null {
  return r
    ? {
        number: r.number,
        status: r.status,
        uploaderName: r.uploaderName,
        createdAt: r.createdAt.toISOString(),
      }
    : null;
}

function identicalText(r: Identical): string {
  return `This file is identical (same SHA-256) to revision ${r.number}, uploaded by ${r.uploaderName ?? "a removed account"} on ${formatDateTime(r.createdAt)} (${r.status}).`;
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "upload:revisions");
  const { ipAddress } = getCaller(args);
  const sample = await requireSample(args.params);
  const system = user.unitSystem;

  // The body is read with a cap: a declared size over it is refused unread, a stream is cut at the cap.
  const body = await readCappedFormData(args.request);
  if (!body.ok) {
    if (body.reason === "too_large") {
      const size = body.declaredBytes ?? body.bytesRead;
      return data<ActionResult>(
        {
          kind: "too_large",
          formError: `The upload (${formatFileSize(size)} or more) is over the ${LIMIT_TEXT} limit, so it was not read and nothing was stored. Upload only the results table.`,
        },
        { status: 413 },
      );
    }
    return data<ActionResult>(
      {
        kind: "invalid",
        formError: "The upload could not be read; choose the file again.",
      },
      { status: 400 },
    );
  }
  const values = Object.fromEntries(body.formData);
  const basic = IntentSchema.safeParse(values);
  if (!basic.success)
    return data<ActionResult>(
      {
        kind: "invalid",
        errors: fieldErrorsOf(basic.error.issues),
        formError: "Nothing was stored.",
      },
      { status: 400 },
    );

  const file = basic.data.file;
  const checked = await checkUpload(
    { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) },
    sample,
  );
  if (!checked.ok) {
    if (basic.data.intent === "confirm")
      uploadsByOutcome.inc({ outcome: "refused" });
    return data<ActionResult>(
      {
        kind: "refused",
        refused: {
          fileName: checked.fileName,
          errors: presentFindings(checked.errors, system),
          warnings: presentFindings(
            checked.warnings,
            system,
            checked.errors.length + 1,
          ),
        },
      },
      { status: 400 },
    );
  }
  const preview = buildPreview(checked, system);
  const identical = identicalOf(
    await findIdenticalRevision(sample.id, checked.sha256),
  );
  if (basic.data.intent === "preview")
    return data<ActionResult>({ kind: "preview", preview, identical });

  const comment = typeof values.comment === "string" ? values.comment : "";
  const confirm = UploadSchema.safeParse(values);
  if (!confirm.success || confirm.data.intent !== "confirm") {
    return data<ActionResult>(
      {
        kind: "preview",
        preview,
        identical,
        comment,
        errors: confirm.success ? {} : fieldErrorsOf(confirm.error.issues),
      },
      { status: 400 },
    );
  }
  if (confirm.data.previewSha256 !== checked.sha256) {
    return data<ActionResult>(
      {
        kind: "preview",
        preview,
        identical,
        comment,
        formError:
          "The file differs from the one you checked, so nothing was stored. Look over this new preview and confirm again.",
      },
      { status: 409 },
    );
  }
  const nextNumber =
    ((await listRevisionsOfSample(sample.id))[0]?.number ?? 0) + 1;
  let outcome: Awaited<ReturnType<typeof storeUploadedRevision>>;
  try {
    outcome = await storeUploadedRevision({
      ...revisionFromUpload(checked, {
        sampleId: sample.id,
        createdBy: user.id,
        comment: confirm.data.comment,
      }),
      ipAddress,
      auditDetails: {
        qcStatus: checked.status,
        layout: preview.layout,
        format: preview.format,
        sha256: checked.sha256,
      },
      storeIdentical: confirm.data.storeIdentical === "yes",
    });
  } catch (error) {
    const failure = describeStoreFailure(error, nextNumber);
    uploadsByOutcome.inc({ outcome: "failed" });
    logger.error(
      { sampleId: sample.id, failure: failure.kind, cause: failure.log },
      "upload not stored",
    );
    return data<ActionResult>(
      {
        kind: "store_failed",
        preview,
        identical,
        comment,
        formError: failure.message,
      },
      { status: failure.status },
    );
  }
  if (!outcome.ok) {
    if (outcome.reason === "sample_gone")
      throw data(
        `Sample ${sample.label} no longer exists; nothing was stored.`,
        { status: 404 },
      );
    const now = identicalOf(outcome.identical)!;
    const text = `${identicalText(now)} Nothing was stored. Tick “Store it anyway” to keep it as a new revision.`;
    return data<ActionResult>(
      {
        kind: "preview",
        preview,
        identical: now,
        comment,
        formError: text,
        errors: { storeIdentical: [text] },
      },
      { status: 409 },
    );
  }
  uploadsByOutcome.inc({ outcome: "stored" });
  throw redirect(
    `${href("/samples/:sampleId/revisions/:number", { sampleId: String(sample.id), number: String(outcome.number) })}?stored=1`,
  );
}

function Preview({
  preview,
  nextNumber,
  errors,
  hasGravities,
  identical,
  comment,
}: {
  preview: NonNullable<ActionResult["preview"]>;
  nextNumber: number;
  errors: FieldErrors;
  hasGravities: boolean;
  identical: Identical | null;
  comment: string | undefined;
}) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  const commentId = useId();
  const identicalId = useId();
  useEffect(() => {
    headingRef.current?.focus();
  }, [preview.sha256]);
  const { errors: errorCount, warnings } = preview.summary;
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

      <div className="rounded-lg border border-accent/40 bg-panel p-5">
        <h3 className="font-semibold">Store as draft revision {nextNumber}</h3>
        <p className="mt-1 text-sm text-ink-muted">
          The file is sent again and checked again on the server; exactly what
          it holds is stored as a draft. A lab lead then approves or rejects it
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
              {identicalText(identical)} Storing it again makes a second
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
    </section>
  );
}

export default function Upload({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { sample, nextNumber, guide, hasGravities } = loaderData;
  const navigation = useNavigation();
  const result = actionData as ActionResult | undefined;
  const form = useZodForm(UploadSchema, result?.errors);
  const fileId = useId();
  const [stale, setStale] = useState(false);
  const [sizeError, setSizeError] = useState<string | null>(null);
  useEffect(() => setStale(false), [actionData]);
  const sampleUrl = href("/samples/:sampleId", { sampleId: String(sample.id) });
  const busy = navigation.state === "submitting";
  const pressed = navigation.formData ? readIntent(navigation.formData) : "";
  const preview = !stale && result?.preview ? result.preview : null;
  const fileErrors = [
    ...(sizeError ? [sizeError] : []),
    ...(form.errors.file ?? []),
  ];
  const templates = [
    {
      layout: "long",
      csv: "isopleth-template-long.csv",
      xlsx: "isopleth-template-long.xlsx",
    },
    {
      layout: "grid",
      csv: "isopleth-template-grid.csv",
      xlsx: "isopleth-template-grid.xlsx",
    },
  ];
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        ›{" "}
        <Link to={sampleUrl} className="hover:underline">
          {sample.label}
        </Link>{" "}
        › Upload
      </nav>
      <PageHeader title={`Upload results for ${sample.label}`}>
        Well {sample.wellName}, {sample.fieldName}. One CSV or XLSX file with
        the measured results of this sample, in the long or the grid layout (see
        below). You see the parsed grids and the quality checks before anything
        is stored.
      </PageHeader>

      <Form
        method="post"
        encType="multipart/form-data"
        noValidate
        onSubmit={form.onSubmit}
        className="space-y-6"
      >
        <div className="rounded-lg border border-line bg-panel p-5">
          <div className="flex flex-wrap items-end gap-4">
            <div className="min-w-72 flex-1">
              <label htmlFor={fileId} className="block text-sm font-semibold">
                Results file (CSV or XLSX, at most {LIMIT_TEXT})
              </label>
              <input
                id={fileId}
                type="file"
                name="file"
                accept={UPLOAD_ACCEPT}
                required
                aria-invalid={fileErrors.length ? true : undefined}
                aria-describedby={`${fileId}-hint${fileErrors.length ? ` ${fileId}-error` : ""}`}
                className="mt-1 block w-full text-sm file:mr-3 file:rounded file:border file:border-line file:bg-surface file:px-3 file:py-1.5 file:font-semibold"
                onChange={(event) => {
                  const chosen = event.currentTarget.files?.[0];
                  setStale(true);
                  setSizeError(
                    chosen && chosen.size > UPLOAD_LIMIT_BYTES
                      ? `${chosen.name} is over the ${LIMIT_TEXT} limit; upload only the results table.`
                      : null,
                  );
                }}
              />
              <p id={`${fileId}-hint`} className="mt-1 text-xs text-ink-muted">
                Templates:{" "}
                {templates.map((t, k) => (
                  <span key={t.layout}>
                    {k > 0 ? "; " : ""}
                    {t.layout} layout{" "}
                    <a
                      href={`/upload-templates/${t.csv}`}
                      className="text-accent underline"
                      download
                    >
                      CSV
                    </a>{" "}
                    or{" "}
                    <a
                      href={`/upload-templates/${t.xlsx}`}
                      className="text-accent underline"
                      download
                    >
                      XLSX
                    </a>
                  </span>
                ))}
                . Their numbers are invented: replace them with your
                measurements.
              </p>
              <FieldError id={`${fileId}-error`} errors={fileErrors} />
            </div>
            <Button
              type="submit"
              name="intent"
              value="preview"
              variant={preview ? "secondary" : "primary"}
              disabled={busy || !!sizeError}
            >
              {busy && pressed === "preview"
                ? "Checking…"
                : preview
                  ? "Check again"
                  : "Check file"}
            </Button>
          </div>
        </div>

        {preview ? null : <FormAlert message={result?.formError} />}

        {result?.kind === "refused" && result.refused && !stale ? (
          <section
            aria-labelledby="refused-heading"
            className="space-y-3"
            data-testid="refused"
          >
            <h2
              id="refused-heading"
              className="text-lg font-semibold text-danger"
            >
              {result.refused.fileName} cannot be used
            </h2>
            <p className="text-sm">
              Nothing was stored. Correct the{" "}
              {result.refused.errors.length === 1
                ? "problem"
                : `${result.refused.errors.length} problems`}{" "}
              below in the file and check it again.
            </p>
            <FindingList findings={result.refused.errors} />
            <FindingList
              findings={result.refused.warnings}
              title="Also noted"
            />
          </section>
        ) : null}

        {preview ? (
          <Preview
            preview={preview}
            nextNumber={nextNumber}
            errors={form.errors}
            hasGravities={hasGravities}
            identical={result?.identical ?? null}
            comment={result?.comment}
          />
        ) : null}

        {preview ? <FormAlert message={result?.formError} /> : null}

        {preview ? (
          <div className="flex flex-wrap items-center gap-4">
            <Button type="submit" name="intent" value="confirm" disabled={busy}>
              {busy && pressed === "confirm"
                ? "Storing…"
                : `Store as draft revision ${nextNumber}`}
            </Button>
            <Link to={sampleUrl} className="text-sm text-accent underline">
              Cancel (nothing is stored)
            </Link>
          </div>
        ) : (
          <p className="text-sm">
            <Link to={sampleUrl} className="text-accent underline">
              Back to {sample.label}
            </Link>
          </p>
        )}
      </Form>

      <section aria-labelledby="guide-heading" className="mt-10">
        <h2 id="guide-heading" className="text-lg font-semibold">
          How to lay out the file
        </h2>
        <div className="mt-2 max-w-4xl space-y-2">
          {guide.intro.map((b, k) =>
            b.kind === "paragraph" ? (
              <p key={k} className="text-sm text-ink-muted">
                <Inline text={b.text} />
              </p>
            ) : null,
          )}
          {guide.sections.map((s) => (
            <details
              key={s.title}
              className="rounded-lg border border-line bg-panel px-4 py-3"
              open={!preview && /layout/i.test(s.title)}
            >
              <summary className="cursor-pointer font-semibold">
                {s.title}
              </summary>
              <div className="mt-3">
                <GuideBlocks blocks={s.blocks} />
              </div>
            </details>
          ))}
        </div>
      </section>
    </>
  );
}
