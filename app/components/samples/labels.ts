import type { RevisionStatus, SampleType } from "~/utils/sample-vocabulary";

// Property names and symbols are in the property catalogue, app/core/units/properties.ts.

export const SAMPLE_TYPE_LABELS: Record<string, string> = {
  bottomhole: "Bottomhole",
  separator_recombined: "Separator, recombined",
  wellhead: "Wellhead",
  formation_tester: "Formation tester",
} satisfies Record<SampleType, string>;

export const REVISION_STATUS_LABELS: Record<string, string> = {
  draft: "Draft, awaiting review",
  approved: "Approved",
  rejected: "Rejected",
  superseded: "Superseded",
} satisfies Record<RevisionStatus, string>;

export const QC_STATUS_LABELS: Record<"pass" | "warn" | "fail", string> = {
  pass: "Passed",
  warn: "Warnings",
  fail: "Errors",
};

export const SEVERITY_LABELS: Record<"error" | "warning" | "info", string> = {
  error: "Error",
  warning: "Warning",
  info: "Note",
};

/** How the sample list can be sorted and filtered (query string values). */
export const SAMPLE_SORTS = [
  "field",
  "well",
  "label",
  "type",
  "sampled",
  "pressure",
  "temperature",
  "revision",
  "updated",
] as const;
export type SampleSort = (typeof SAMPLE_SORTS)[number];
export const SAMPLE_STATUS_FILTERS = ["approved", "none", "draft"] as const;
