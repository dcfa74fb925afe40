import { ADMIN, ALL, LAB_LEAD_UP, type Rule } from "./types";

/**
 * Samples, uploads, revisions (the lab-results issue). Sample 1 and its revision 1 exist in the seeded e2e database.
 * Each POST sends a deliberately invalid form: allowed roles get 400 and nothing changes; others get 403.
 */
export const SAMPLE_RULES: Record<string, Rule> = {
  "routes/_app/samples/index.tsx": {
    kind: "page",
    path: "/samples",
    allowed: ALL,
  },
  "routes/_app/samples/new.tsx": {
    kind: "page",
    path: "/samples/new",
    allowed: LAB_LEAD_UP,
    post: { allowed: LAB_LEAD_UP, form: { label: "" } },
  },
  "routes/_app/samples/$sampleId/index.tsx": {
    kind: "page",
    path: "/samples/1",
    allowed: ALL,
    // Following is open to everyone who may read the sample.
    post: { allowed: ALL, form: { intent: "not-an-intent" } },
  },
  "routes/_app/samples/$sampleId/edit.tsx": {
    kind: "page",
    path: "/samples/1/edit",
    allowed: LAB_LEAD_UP,
    post: { allowed: LAB_LEAD_UP, form: { label: "" } },
  },
  "routes/_app/samples/$sampleId/upload.tsx": {
    kind: "page",
    path: "/samples/1/upload",
    allowed: LAB_LEAD_UP,
    // No file: refused before anything is parsed.
    post: { allowed: LAB_LEAD_UP, form: { intent: "preview" } },
  },
  "routes/_app/samples/$sampleId/revisions/$number.tsx": {
    kind: "page",
    path: "/samples/1/revisions/1",
    allowed: ALL,
    post: { allowed: LAB_LEAD_UP, form: { intent: "not-an-intent" } },
  },
  "routes/_app/samples/$sampleId/diff.tsx": {
    kind: "page",
    path: "/samples/1/diff?from=1&to=1",
    allowed: ALL,
  },
  // The lab policy page (four-eyes approval); an invalid choice changes nothing.
  "routes/_app/admin/settings/index.tsx": {
    kind: "page",
    path: "/admin/settings",
    allowed: ADMIN,
    post: { allowed: ADMIN, form: { fourEyes: "not-a-mode" } },
  },
  "routes/upload-templates/$file.ts": {
    kind: "page",
    path: "/upload-templates/isopleth-template-long.csv",
    allowed: ALL,
  },
  "routes/templates/$file.ts": {
    kind: "redirect",
    path: "/templates/isopleth-template-long.csv",
    location: "/upload-templates/isopleth-template-long.csv",
  },
};
