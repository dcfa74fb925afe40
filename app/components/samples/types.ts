/*
 * Plain, JSON-serialisable shapes that loaders and actions hand to the sample components. Numbers are already
 * in the reader's unit system; unit symbols travel beside them.
 */
import type { PropertyKey } from "~/core/units";

export type Severity = "error" | "warning" | "info";

/** Where a finding points in the uploaded file. */
export type FindingPlace = {
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
