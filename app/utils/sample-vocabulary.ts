/**
 * The fixed vocabularies of samples and revisions, declared once (client-safe): the database enums
 * (app/.server/db/schema), the zod schemas of forms and the API, and the on-screen labels all derive from
 * these tuples, so a value added here fails the type check wherever it is not yet handled.
 */
export const SAMPLE_TYPES = [
  "bottomhole",
  "separator_recombined",
  "wellhead",
  "formation_tester",
] as const;
export type SampleType = (typeof SAMPLE_TYPES)[number];

export const REVISION_STATUSES = [
  "draft",
  "approved",
  "rejected",
  "superseded",
] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];
