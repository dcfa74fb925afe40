/**
 * Building parse findings: each names the file, sheet (XLSX), row, column and value, in one sentence.
 */
import { columnLetter } from "./cells";
import type {
  FileLocation,
  Finding,
  ParseFindingCode,
  Severity,
} from "./types";

/** Most findings listed for one upload; the rest are summarised in one last finding. */
const MAX_FINDINGS = 100;

export interface Place {
  readonly sheet?: string;
  /** 1-based. */
  readonly row?: number;
  /** 1-based. */
  readonly column?: number;
}

/** Quote a cell value for a message, shortened if long. */
export function quote(value: string): string {
  const oneLine = value.replace(/\s+/g, " ");
  const short = oneLine.length > 60 ? `${oneLine.slice(0, 57)}…` : oneLine;
  return `"${short}"`;
}

/** "In results.xlsx, sheet "Bo", row 7, column C" */
function describePlace(file: string, place: Place): string {
  const parts = [`In ${file}`];
  if (place.sheet !== undefined) parts.push(`sheet ${quote(place.sheet)}`);
  if (place.row !== undefined) parts.push(`row ${place.row}`);
  if (place.column !== undefined)
    parts.push(`column ${columnLetter(place.column)}`);
  return parts.join(", ");
}

function makeLocation(
  file: string,
  place: Place,
  value?: string,
): FileLocation {
  return {
    file,
    ...(place.sheet !== undefined ? { sheet: place.sheet } : {}),
    ...(place.row !== undefined ? { row: place.row } : {}),
    ...(place.column !== undefined
      ? { column: place.column, columnLetter: columnLetter(place.column) }
      : {}),
    ...(value !== undefined ? { value } : {}),
  };
}

/** Collects findings for one upload, with a cap on how many are listed. */
export class FindingList {
  readonly errors: Finding[] = [];
  readonly warnings: Finding[] = [];
  private dropped = 0;

  constructor(readonly file: string) {}

  /**
   * Add a finding at a place. `sentence` continues "In file, sheet, row, column, …" and ends with a full stop;
   * `value` is the offending text as written.
   */
  add(
    severity: Severity,
    code: ParseFindingCode,
    place: Place,
    sentence: string,
    value?: string,
  ): void {
    const list = severity === "error" ? this.errors : this.warnings;
    if (list.length >= MAX_FINDINGS) {
      this.dropped++;
      return;
    }
    const where = describePlace(this.file, place);
    list.push({
      code,
      severity,
      message: `${where}, ${sentence}`,
      location: makeLocation(this.file, place, value),
    });
  }

  error(
    code: ParseFindingCode,
    place: Place,
    sentence: string,
    value?: string,
  ): void {
    this.add("error", code, place, sentence, value);
  }

  warn(
    code: ParseFindingCode,
    place: Place,
    sentence: string,
    value?: string,
  ): void {
    this.add("warning", code, place, sentence, value);
  }

  info(
    code: ParseFindingCode,
    place: Place,
    sentence: string,
    value?: string,
  ): void {
    this.add("info", code, place, sentence, value);
  }

  get hasErrors(): boolean {
    return this.errors.length > 0;
  }

  /** Errors, with a closing note when some were left out. */
  finalErrors(): Finding[] {
    if (this.dropped === 0) return this.errors;
    return [
      ...this.errors,
      {
        code: "TOO_MANY_FINDINGS",
        severity: "error",
        message: `In ${this.file}, ${this.dropped} more problems were found and are not listed; fix the ones above and upload again.`,
        location: { file: this.file },
      },
    ];
  }
}
