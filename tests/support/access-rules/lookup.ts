import { ALL, type Rule } from "./types";

/** Lookup workspace, comparison and saved lookup sets (the lookup issue). */
export const LOOKUP_RULES: Record<string, Rule> = {
  "routes/_app/lookup/index.tsx": { kind: "page", path: "/lookup", allowed: ALL },
  "routes/_app/compare/index.tsx": { kind: "page", path: "/compare", allowed: ALL },
};
