import { ALL, ENGINEER_UP, type Rule } from "./types";

/** Lookup workspace, comparison and saved lookup sets (the lookup issue). */
export const LOOKUP_RULES: Record<string, Rule> = {
  "routes/_app/lookup/index.tsx": {
    kind: "page",
    path: "/lookup",
    allowed: ALL,
    // Saving a set needs the engineer role; the deliberately empty name makes an allowed save a 400.
    post: { allowed: ENGINEER_UP, form: { intent: "save-set", name: "" } },
  },
  // No set 999999 exists: allowed roles get 404 from the page, the others 403 first.
  "routes/_app/lookup/sets/$setId.tsx": {
    kind: "page",
    path: "/lookup/sets/999999",
    allowed: ENGINEER_UP,
    okStatus: 404,
  },
  // The lookup page's export (a resource route, POST): the API's rules; a body that is not the export form is a 400.
  "routes/lookup/export.ts": {
    kind: "api",
    path: "/lookup/export",
    method: "POST",
    body: {},
    allowed: ALL,
    okStatus: 400,
  },
  // A run's export: like the set page, 404 in plain words for a set that is not the caller's.
  "routes/lookup/sets/$setId/export.ts": {
    kind: "page",
    path: "/lookup/sets/999999/export?run=1&format=csv",
    allowed: ENGINEER_UP,
    okStatus: 404,
  },
  "routes/_app/compare/index.tsx": {
    kind: "page",
    path: "/compare",
    allowed: ALL,
  },
};
