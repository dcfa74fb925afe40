import type { PropertyKey } from "~/core/units";

/** How properties are named on screen: a plain name and the usual symbol. */
export const PROPERTY_LABELS: Record<
  PropertyKey,
  { name: string; symbol: string }
> = {
  oil_fvf: { name: "Oil formation volume factor", symbol: "Bo" },
  solution_gor: { name: "Solution gas–oil ratio", symbol: "Rs" },
  oil_viscosity: { name: "Oil viscosity", symbol: "μo" },
  oil_density: { name: "Oil density", symbol: "ρo" },
  gas_fvf: { name: "Gas formation volume factor", symbol: "Bg" },
  gas_viscosity: { name: "Gas viscosity", symbol: "μg" },
  z_factor: { name: "Gas deviation factor", symbol: "Z" },
};

export const SAMPLE_TYPE_LABELS: Record<string, string> = {
  bottomhole: "Bottomhole",
  separator_recombined: "Separator, recombined",
  wellhead: "Wellhead",
  formation_tester: "Formation tester",
};

export const REVISION_STATUS_LABELS: Record<string, string> = {
  draft: "Draft, awaiting review",
  approved: "Approved",
  rejected: "Rejected",
  superseded: "Superseded",
};

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
export type SampleStatusFilter = (typeof SAMPLE_STATUS_FILTERS)[number];
