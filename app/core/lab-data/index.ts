/**
 * Laboratory results: the upload parser (CSV/XLSX, long and grid layouts), the writers and templates, and
 * the physical QC checks. Pure: no framework, no I/O. See README.md.
 */
export * from "./types";
export { LabDataError, isLabDataError, type LabDataErrorCode } from "./errors";
export {
  parseUpload,
  MAX_UPLOAD_BYTES,
  ACCEPTED_EXTENSIONS,
  displayFileName,
  detectLayout,
} from "./parse-upload";
export {
  HEADER_NAMES,
  HEADER_LABELS,
  resolveHeaderName,
  type HeaderName,
} from "./header-names";
export {
  datasetFromCanonicalGrids,
  unitRef,
  type CanonicalGridInput,
} from "./dataset";
export {
  layoutSheets,
  longLayoutRows,
  gridLayoutBlocks,
  toCsv,
  toXlsx,
  type Cell,
  type TableSheet,
  type WriteOptions,
} from "./write-tables";
export {
  buildTemplateCsv,
  buildTemplateXlsx,
  templateDataset,
  templateFileName,
} from "./templates";
export { runQc, qcStatus } from "./qc/run-qc";
export type { QcMeta } from "./qc/context";
export {
  RULES as QC_RULES,
  type RuleId as QcRuleId,
  type RuleInfo as QcRuleInfo,
} from "./qc/rules";
export { PLAUSIBLE_BANDS } from "./qc/ranges";
