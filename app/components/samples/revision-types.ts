/*
 * Plain shapes of a revision as the sample pages show it (dates as ISO strings, numbers already in the reader's
 * unit system); app/.server/samples builds them.
 */
import type {
  DisplayBubblePoints,
  DisplayFinding,
  DisplayGrid,
  QcSummary,
} from "./types";

/** Who uploaded and reviewed a revision, and when. */
type DisplayRevision = {
  number: number;
  status: string;
  comment: string | null;
  reviewComment: string | null;
  sourceFilename: string | null;
  sourceSha256: string | null;
  createdAt: string;
  createdBy: number | null;
  uploaderName: string | null;
  reviewedAt: string | null;
  reviewerName: string | null;
  /** Reviewed by the person who uploaded it. */
  ownReview: boolean;
};

/** One revision with its QC findings and grids. */
export type DisplayRevisionView = {
  revision: DisplayRevision;
  file: { format: string; layout: string } | null;
  /** stored: the QC report of the upload; checked-now: none was stored, the checks ran when the page loaded. */
  reportOrigin: "stored" | "checked-now";
  summary: QcSummary;
  findings: DisplayFinding[];
  grids: DisplayGrid[];
  bubblePoints: DisplayBubblePoints;
};

/** A row of a sample's revision history (newest first). */
export type RevisionHistoryRow = {
  number: number;
  status: string;
  comment: string | null;
  sourceFilename: string | null;
  createdAt: string;
  uploaderName: string | null;
  reviewedAt: string | null;
  reviewerName: string | null;
  ownReview: boolean;
  qcStatus: QcSummary["status"] | null;
};
