/*
 * Plain, JSON-serialisable shapes that loaders and actions hand to the sample components. Numbers are already
 * in the reader's unit system; unit symbols travel beside them.
 */
import type { FileFormat, Layout } from "~/core/lab-data";
import type { PropertyKey } from "~/core/units";
import type { FieldErrors } from "~/utils/forms";
import type { IdenticalRevisionNote } from "~/utils/upload-form";

export type Severity = "error" | "warning" | "info";

/** Where a finding points in the uploaded file. */
type FindingPlace = {
  file: string;
  sheet?: string;
  row?: number;
  column?: number;
  columnLetter?: string;
  value?: string;
};

export type DisplayFinding = {
  /** 1-based number shown beside highlighted cells. */
  n: number;
  code: string;
  severity: Severity;
  message: string;
  rule?: string;
  ruleTitle?: string;
  source?: string;
  location?: FindingPlace;
  /** Cells concerned, already in display units: "Bo at 2000 psia, 210 °F". */
  cells: string[];
};

/** A cell flagged by findings: the worst severity and the finding numbers. */
export type CellMark = { severity: Severity; findings: number[] };

export type DisplayGrid = {
  property: PropertyKey;
  /** Display unit symbol of the values (the reader's unit system). */
  unit: string;
  /** Unit the laboratory reported, when different from the display unit. */
  sourceUnit: string | null;
  pressureUnit: string;
  temperatureUnit: string;
  pressures: number[];
  temperatures: number[];
  values: (number | null)[][];
  /** Bubble point per temperature (display pressure unit), when known. */
  bubblePoints: (number | null)[];
  /** Flagged cells, keyed "i:j" (pressure index, temperature index). */
  marks: Record<string, CellMark>;
};

export type DisplayBubblePoints = {
  pressureUnit: string;
  temperatureUnit: string;
  rows: { temperature: number; pressure: number; mark: CellMark | null }[];
};

export type QcSummary = {
  status: "pass" | "warn" | "fail";
  errors: number;
  warnings: number;
  notes: number;
};

/** An uploaded file checked and parsed, before anything is stored: what the upload page's preview shows. */
export type UploadPreview = {
  fileName: string;
  /** SHA-256 of the file, sent back with the confirm so the server stores exactly the file checked. */
  sha256: string;
  sizeBytes: number;
  format: FileFormat;
  layout: Layout;
  sheets: string[] | null;
  counts: {
    properties: number;
    temperatures: number;
    pressures: number;
    cells: number;
  };
  summary: QcSummary;
  findings: DisplayFinding[];
  grids: DisplayGrid[];
  bubblePoints: DisplayBubblePoints;
  /** When the file gave gauge pressures: the sentence saying which barometric pressure made them absolute. */
  gaugeNote: string | null;
};

/** A file that cannot be used (it does not parse): its errors, and the warnings noted on the way. */
export type RefusedUpload = {
  fileName: string;
  errors: DisplayFinding[];
  warnings: DisplayFinding[];
};

/**
 * What the upload action answers (a stored upload redirects instead):
 *  - too_large / invalid: the request could not be read or the form is incomplete; nothing was checked;
 *  - refused: the file was checked and cannot be used;
 *  - preview: the file was checked (and, for a confirm, not stored: the field errors or formError say why);
 *  - store_failed: the database did not store it; the preview and the comment are kept for a retry.
 */
export type UploadReply =
  | { kind: "too_large" | "invalid"; formError: string; errors?: FieldErrors }
  | { kind: "refused"; refused: RefusedUpload }
  | {
      kind: "preview" | "store_failed";
      preview: UploadPreview;
      /** The revision this file is identical to, if any. */
      identical: IdenticalRevisionNote | null;
      /** The comment as sent, to fill the field again after a failed confirm. */
      comment?: string;
      formError?: string;
      errors?: FieldErrors;
    };

/** One cell of a revision diff in the reader's units: a property at one pressure (none for a bubble point) and temperature. */
export type DiffRow = {
  property: PropertyKey | "bubble_point";
  /** Display unit symbol of the values. */
  unit: string;
  pressure: number | null;
  temperature: number;
  from: number | null;
  to: number | null;
};

/** Two revisions compared: counts, per-property counts, and the cells listed (at most a limit per kind). */
export type DisplayRevisionDiff = {
  byProperty: {
    property: DiffRow["property"];
    changed: number;
    added: number;
    removed: number;
  }[];
  counts: {
    changed: number;
    added: number;
    removed: number;
    unchanged: number;
  };
  changed: DiffRow[];
  added: DiffRow[];
  removed: DiffRow[];
};
