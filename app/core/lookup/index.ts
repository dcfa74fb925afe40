// Lookup: property values at reservoir conditions from a measured grid, in the caller's unit system.
// Pure TypeScript (no framework, no I/O). See README.md in this folder.
export {
  describeLookupMethod,
  MAX_LOOKUP_POINTS,
  normalizeLookupOptions,
  runLookup,
  runLookupColumns,
  toLookupError,
  unitContext,
} from "./run-lookup";
export type {
  LookupColumnsResult,
  LookupOptions,
  LookupPoint,
  LookupPointColumns,
  LookupPointResult,
  LookupPoints,
  LookupResult,
  LookupStencil,
  LookupSummary,
  LookupUnitLabels,
  NormalizedLookupOptions,
  UnitContext,
} from "./run-lookup";
export { LOOKUP_METHODS, lookupCanonical, METHOD_CODES } from "./compute";
export type {
  CanonicalLookup,
  CanonicalOptions,
  LookupMethod,
  UsedMethod,
} from "./compute";
export { bubblePointsAt } from "./bubble-point";
export { isLookupError, LookupError } from "./errors";
export type { LookupErrorCode } from "./errors";
export {
  describeWarningCode,
  expandWarningFlags,
  isLookupWarning,
  LOOKUP_WARNING_CODES,
  lookupWarningsFromFlags,
  PCHIP_FALLBACK,
  W_PCHIP_FALLBACK,
} from "./warnings";
export type { LookupWarning } from "./warnings";
export {
  affineToCanonical,
  fromCanonicalWith,
  toCanonicalWith,
} from "./unit-map";
export type { Affine, UnitBasis } from "./unit-map";
export {
  describeValue,
  nestedDeeperThan,
  pointColumns,
  readLookupText,
} from "./point-columns";
export type { LookupText, PointColumns, PointIssue } from "./point-columns";
