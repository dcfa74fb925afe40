import { ALL, LAB_LEAD_UP, type Rule } from "./types";

/** Samples, uploads, revisions (the lab-results issue). Sample 1 and its revision 1 exist in the seeded e2e database. */
export const SAMPLE_RULES: Record<string, Rule> = {
  "routes/_app/samples/index.tsx": { kind: "page", path: "/samples", allowed: ALL },
  "routes/_app/samples/new.tsx": { kind: "page", path: "/samples/new", allowed: LAB_LEAD_UP },
  "routes/_app/samples/$sampleId/index.tsx": { kind: "page", path: "/samples/1", allowed: ALL },
  "routes/_app/samples/$sampleId/edit.tsx": { kind: "page", path: "/samples/1/edit", allowed: LAB_LEAD_UP },
  "routes/_app/samples/$sampleId/upload.tsx": { kind: "page", path: "/samples/1/upload", allowed: LAB_LEAD_UP },
  "routes/_app/samples/$sampleId/revisions/$number.tsx": { kind: "page", path: "/samples/1/revisions/1", allowed: ALL },
  "routes/_app/samples/$sampleId/diff.tsx": { kind: "page", path: "/samples/1/diff?from=1&to=1", allowed: ALL },
  "routes/templates/$file.ts": { kind: "page", path: "/templates/isopleth-long-template.csv", allowed: ALL },
};
