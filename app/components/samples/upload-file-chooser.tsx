import { useId } from "react";
import { Button, FieldError } from "~/components/form";
import { UPLOAD_ACCEPT, UPLOAD_LIMIT_TEXT } from "~/utils/upload-form";

const TEMPLATES = [
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

/**
 * The results file input with the template downloads, and the "Check file" button (secondary once a preview is
 * shown, disabled while sending or when the chosen file is over the limit).
 */
export function UploadFileChooser({
  errors,
  onFileChosen,
  previewShown,
  checking,
  busy,
  blocked,
}: {
  errors: string[];
  onFileChosen: (file: File | undefined) => void;
  previewShown: boolean;
  /** "Check file" was pressed and the answer is awaited. */
  checking: boolean;
  /** Any submit of the form is under way. */
  busy: boolean;
  /** The chosen file cannot be sent (over the limit). */
  blocked: boolean;
}) {
  const fileId = useId();
  return (
    <div className="rounded-lg border border-line bg-panel p-5">
      <div className="flex flex-wrap items-end gap-4">
        <div className="min-w-72 flex-1">
          <label htmlFor={fileId} className="block text-sm font-semibold">
            Results file (CSV or XLSX, at most {UPLOAD_LIMIT_TEXT})
          </label>
          <input
            id={fileId}
            type="file"
            name="file"
            accept={UPLOAD_ACCEPT}
            required
            aria-invalid={errors.length ? true : undefined}
            aria-describedby={`${fileId}-hint${errors.length ? ` ${fileId}-error` : ""}`}
            className="mt-1 block w-full text-sm file:mr-3 file:rounded file:border file:border-line file:bg-surface file:px-3 file:py-1.5 file:font-semibold"
            onChange={(event) => onFileChosen(event.currentTarget.files?.[0])}
          />
          <p id={`${fileId}-hint`} className="mt-1 text-xs text-ink-muted">
            Templates:{" "}
            {TEMPLATES.map((t, k) => (
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
            . Their numbers are invented: replace them with your measurements.
          </p>
          <FieldError id={`${fileId}-error`} errors={errors} />
        </div>
        <Button
          type="submit"
          name="intent"
          value="preview"
          variant={previewShown ? "secondary" : "primary"}
          disabled={busy || blocked}
        >
          {checking ? "Checking…" : previewShown ? "Check again" : "Check file"}
        </Button>
      </div>
    </div>
  );
}
