import { FindingList } from "./qc-findings";
import type { RefusedUpload } from "./types";

/** A file that cannot be used: nothing was stored, and the problems to correct in the file. */
export function RefusedUploadNotice({ refused }: { refused: RefusedUpload }) {
  return (
    <section
      aria-labelledby="refused-heading"
      className="space-y-3"
      data-testid="refused"
    >
      <h2 id="refused-heading" className="text-lg font-semibold text-danger">
        {refused.fileName} cannot be used
      </h2>
      <p className="text-sm">
        Nothing was stored. Correct the{" "}
        {refused.errors.length === 1
          ? "problem"
          : `${refused.errors.length} problems`}{" "}
        below in the file and check it again.
      </p>
      <FindingList findings={refused.errors} />
      <FindingList findings={refused.warnings} title="Also noted" />
    </section>
  );
}
