import {
  findIdenticalRevision,
  listRevisionsOfSample,
  storeUploadedRevision,
  type IdenticalRevision,
} from "~/.server/db/queries/revisions";
import type { SessionUser } from "~/.server/auth/session";
import { logger } from "~/.server/ops/logger";
import { uploadsByOutcome } from "~/.server/ops/metrics";
import type { UploadPreview, UploadReply } from "~/components/samples/types";
import { formatFileSize } from "~/core/format";
import { fieldErrorsOf, type FieldErrors } from "~/utils/forms";
import {
  identicalRevisionText,
  isFile,
  UPLOAD_FILE_FIELDS,
  UPLOAD_LIMIT_TEXT,
  UploadSchema,
  type IdenticalRevisionNote,
} from "~/utils/upload-form";
import {
  checkUpload,
  revisionFromUpload,
  type CheckedUpload,
  type SampleForQc,
} from "./check-upload";
import { presentFindings } from "./present";
import { buildPreview } from "./preview";
import { describeStoreFailure } from "./store-failure";
import { readCappedFormData, type CappedForm } from "./upload";
import { uploadGuide } from "./upload-guide";

/*
 * The upload page's workflow, stateless. "Check file" posts the file (intent=preview): it is parsed and checked
 * and the preview answered, nothing stored. "Store as draft revision" posts the same file again (the file input
 * keeps it) with intent=confirm: it is parsed and checked again and exactly that is stored, as one draft
 * revision, in one transaction, unless the file differs from the one checked. A file identical (SHA-256) to a
 * revision already stored for the sample is pointed out in the preview and stored only with the "store it
 * anyway" box ticked. When storing fails, the answer says that nothing was stored and why, and keeps the
 * preview and the comment for a retry.
 */

/** The sample an upload is for: its id and what the QC checks need. */
type UploadSample = SampleForQc & { id: number };

type UploadSubmission =
  | { kind: "stored"; number: number }
  /** The sample was deleted while the upload was checked. */
  | { kind: "sample_gone" }
  /** Nothing was stored: the page shows the answer. */
  | { kind: "answer"; status: number; reply: UploadReply };

/** What the upload page shows before anything is sent. */
export async function getUploadPage(
  sample: UploadSample & { label: string; wellName: string; fieldName: string },
) {
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
    guide: uploadGuide(),
  };
}

type UploadForm =
  | { ok: false; errors: FieldErrors }
  | { ok: true; intent: "preview"; file: File }
  | {
      ok: true;
      intent: "confirm";
      file: File;
      /** The comment as sent (untrimmed), to fill the field again. */
      comment: string;
      /** What storing needs, or why it cannot be stored (the file is still checked and previewed). */
      store:
        | {
            ok: true;
            comment: string;
            previewSha256?: string;
            storeIdentical: boolean;
          }
        | { ok: false; errors: FieldErrors };
    };

/**
 * The form, parsed once with the page's schema. Problems with the intent or the file stop everything; problems
 * with the confirm's other fields (a missing comment) stop only the store, so the file is still checked.
 */
export function readUploadForm(formData: FormData): UploadForm {
  const values = Object.fromEntries(formData);
  const parsed = UploadSchema.safeParse(values);
  if (parsed.success) {
    if (parsed.data.intent === "preview")
      return { ok: true, intent: "preview", file: parsed.data.file };
    const { file, comment, previewSha256, storeIdentical } = parsed.data;
    return {
      ok: true,
      intent: "confirm",
      file,
      comment: typeof values.comment === "string" ? values.comment : "",
      store: {
        ok: true,
        comment,
        previewSha256,
        storeIdentical: storeIdentical === "yes",
      },
    };
  }
  const blocking = parsed.error.issues.filter((issue) =>
    (UPLOAD_FILE_FIELDS as readonly unknown[]).includes(issue.path[0]),
  );
  // Without a problem with intent or file, the form failed on the confirm's fields: intent is "confirm".
  if (blocking.length > 0 || !isFile(values.file))
    return { ok: false, errors: fieldErrorsOf(blocking) };
  return {
    ok: true,
    intent: "confirm",
    file: values.file,
    comment: typeof values.comment === "string" ? values.comment : "",
    store: { ok: false, errors: fieldErrorsOf(parsed.error.issues) },
  };
}

function answer(status: number, reply: UploadReply): UploadSubmission {
  return { kind: "answer", status, reply };
}

function unreadable(
  body: Extract<CappedForm, { ok: false }>,
): UploadSubmission {
  if (body.reason === "too_large") {
    const size = body.declaredBytes ?? body.bytesRead;
    return answer(413, {
      kind: "too_large",
      formError: `The upload (${formatFileSize(size)} or more) is over the ${UPLOAD_LIMIT_TEXT} limit, so it was not read and nothing was stored. Upload only the results table.`,
    });
  }
  return answer(400, {
    kind: "invalid",
    formError: "The upload could not be read; choose the file again.",
  });
}

function noteOf(r: IdenticalRevision): IdenticalRevisionNote {
  return {
    number: r.number,
    status: r.status,
    uploaderName: r.uploaderName,
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * Handles one post of the upload form: reads the body with a cap (a declared size over it is refused unread, a
 * stream is cut at the cap), parses the form once, checks the file, and previews or stores it.
 */
export async function handleUploadSubmission(
  request: Request,
  user: Pick<SessionUser, "id" | "unitSystem">,
  sample: UploadSample,
  ipAddress: string,
): Promise<UploadSubmission> {
  const body = await readCappedFormData(request);
  if (!body.ok) return unreadable(body);
  const form = readUploadForm(body.formData);
  if (!form.ok)
    return answer(400, {
      kind: "invalid",
      errors: form.errors,
      formError: "Nothing was stored.",
    });

  const system = user.unitSystem;
  const checked = await checkUpload(
    {
      name: form.file.name,
      bytes: new Uint8Array(await form.file.arrayBuffer()),
    },
    sample,
  );
  if (!checked.ok) {
    if (form.intent === "confirm") uploadsByOutcome.inc({ outcome: "refused" });
    return answer(400, {
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
    });
  }
  const preview = buildPreview(checked, system);
  const found = await findIdenticalRevision(sample.id, checked.sha256);
  const identical = found ? noteOf(found) : null;
  if (form.intent === "preview")
    return answer(200, { kind: "preview", preview, identical });

  const kept = { preview, identical, comment: form.comment };
  if (!form.store.ok)
    return answer(400, { kind: "preview", ...kept, errors: form.store.errors });
  if (form.store.previewSha256 !== checked.sha256)
    return answer(409, {
      kind: "preview",
      ...kept,
      formError:
        "The file differs from the one you checked, so nothing was stored. Look over this new preview and confirm again.",
    });
  return storeChecked({
    checked,
    kept,
    sampleId: sample.id,
    userId: user.id,
    ipAddress,
    comment: form.store.comment,
    storeIdentical: form.store.storeIdentical,
  });
}

/** Stores the checked file as a draft revision (with its audit row, in one transaction), or says why not. */
async function storeChecked(input: {
  checked: Extract<CheckedUpload, { ok: true }>;
  kept: {
    preview: UploadPreview;
    identical: IdenticalRevisionNote | null;
    comment: string;
  };
  sampleId: number;
  userId: number;
  ipAddress: string;
  comment: string;
  storeIdentical: boolean;
}): Promise<UploadSubmission> {
  const { checked, kept, sampleId } = input;
  const nextNumber =
    ((await listRevisionsOfSample(sampleId))[0]?.number ?? 0) + 1;
  let outcome: Awaited<ReturnType<typeof storeUploadedRevision>>;
  try {
    outcome = await storeUploadedRevision({
      ...revisionFromUpload(checked, {
        sampleId,
        createdBy: input.userId,
        comment: input.comment,
      }),
      ipAddress: input.ipAddress,
      auditDetails: {
        qcStatus: checked.status,
        layout: kept.preview.layout,
        format: kept.preview.format,
        sha256: checked.sha256,
      },
      storeIdentical: input.storeIdentical,
    });
  } catch (error) {
    const failure = describeStoreFailure(error, nextNumber);
    uploadsByOutcome.inc({ outcome: "failed" });
    logger.error(
      { sampleId, failure: failure.kind, cause: failure.log },
      "upload not stored",
    );
    return answer(failure.status, {
      kind: "store_failed",
      ...kept,
      formError: failure.message,
    });
  }
  if (!outcome.ok) {
    if (outcome.reason === "sample_gone") return { kind: "sample_gone" };
    const now = noteOf(outcome.identical);
    const text = `${identicalRevisionText(now)} Nothing was stored. Tick “Store it anyway” to keep it as a new revision.`;
    return answer(409, {
      kind: "preview",
      ...kept,
      identical: now,
      formError: text,
      errors: { storeIdentical: [text] },
    });
  }
  uploadsByOutcome.inc({ outcome: "stored" });
  return { kind: "stored", number: outcome.number };
}
