import type { Finding, FileFormat, Layout, QcMeta } from "~/core/lab-data";

/**
 * What is stored in sample_revisions.qc_report: the findings of the parser (warnings and notes about the file)
 * and of the physical checks, the sample data the checks used, and the overall status. Errors block approval;
 * warnings must be acknowledged by the reviewer.
 */
export type StoredQcReport = {
  version: 1;
  status: "pass" | "warn" | "fail";
  checkedAt: string;
  file: { name: string; format: FileFormat; layout: Layout; sizeBytes: number };
  /** Sample data the checks were given (API gravity, gas gravity, standard conditions). */
  meta: QcMeta;
  /** Warnings and notes about the file itself (decimal comma, encoding, …). */
  fileFindings: Finding[];
  /** Findings of the physical checks (runQc), errors first. */
  findings: Finding[];
};

export function isStoredQcReport(value: unknown): value is StoredQcReport {
  if (!value || typeof value !== "object") return false;
  const v = value as Partial<StoredQcReport>;
  return (
    v.version === 1 &&
    (v.status === "pass" || v.status === "warn" || v.status === "fail") &&
    Array.isArray(v.findings) &&
    Array.isArray(v.fileFindings)
  );
}

type QcSummary = {
  status: "pass" | "warn" | "fail";
  errors: number;
  warnings: number;
  notes: number;
};

/** Counts by severity over the file and check findings. */
export function summarizeFindings(findings: readonly Finding[]): QcSummary {
  const errors = findings.filter((f) => f.severity === "error").length;
  const warnings = findings.filter((f) => f.severity === "warning").length;
  const notes = findings.filter((f) => f.severity === "info").length;
  return {
    status: errors > 0 ? "fail" : warnings > 0 ? "warn" : "pass",
    errors,
    warnings,
    notes,
  };
}

export function summarizeReport(report: StoredQcReport): QcSummary {
  return summarizeFindings([...report.fileFindings, ...report.findings]);
}

const RANK = { error: 0, warning: 1, info: 2 } as const;

/** File and check findings in one list: errors, then warnings, then notes (stable within each). */
export function orderFindings(findings: readonly Finding[]): Finding[] {
  return findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => RANK[a.f.severity] - RANK[b.f.severity] || a.i - b.i)
    .map(({ f }) => f);
}
