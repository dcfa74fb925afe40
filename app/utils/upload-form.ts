import { z } from "zod";
import { formatDateTime } from "~/core/format";
import { MAX_UPLOAD_BYTES } from "~/core/lab-data/limits";
import { multilineTextSchema } from "~/utils/labels";
import type { RevisionStatus } from "~/utils/sample-vocabulary";

/*
 * The upload form of a sample's results, client-safe: the limits the browser checks before sending (the server
 * enforces them again while reading the request) and the one schema both the browser's check and the server's
 * use. The size limit is the parser's, from its one declaration (app/core/lab-data/limits.ts, which imports
 * nothing, so the browser does not load the parser).
 */

export const UPLOAD_LIMIT_BYTES = MAX_UPLOAD_BYTES;
export const UPLOAD_ACCEPT =
  ".csv,.tsv,.txt,.xlsx,.xlsm,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
/** The limit as the page and its messages say it: "5 MB". */
export const UPLOAD_LIMIT_TEXT = `${UPLOAD_LIMIT_BYTES / 1024 / 1024} MB`;

/** A file of a form (a File, whichever realm made it). */
export function isFile(value: unknown): value is File {
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
    error: `The file is over the ${UPLOAD_LIMIT_TEXT} limit; upload only the results table.`,
  });

/**
 * What the form sends: "Check file" (intent=preview) the file alone; "Store as draft revision" (intent=confirm)
 * the same file again with a comment, the digest of the file that was checked and, for a file identical to a
 * stored revision, the "store it anyway" box.
 */
export const UploadSchema = z.discriminatedUnion(
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

/** Fields whose problems stop the file from being checked at all; the others only stop it from being stored. */
export const UPLOAD_FILE_FIELDS = ["intent", "file"] as const;

/** The message of a file chosen in the browser that is over the limit (nothing is sent). */
export function fileTooLargeText(fileName: string): string {
  return `${fileName} is over the ${UPLOAD_LIMIT_TEXT} limit; upload only the results table.`;
}

/** A revision already stored for the sample with the same file (same SHA-256). */
export type IdenticalRevisionNote = {
  number: number;
  status: RevisionStatus;
  uploaderName: string | null;
  /** ISO 8601. */
  createdAt: string;
};

/** The sentence that points out an identical revision, in the preview and in the refusal to store it. */
export function identicalRevisionText(r: IdenticalRevisionNote): string {
  return `This file is identical (same SHA-256) to revision ${r.number}, uploaded by ${r.uploaderName ?? "a removed account"} on ${formatDateTime(r.createdAt)} (${r.status}).`;
}
