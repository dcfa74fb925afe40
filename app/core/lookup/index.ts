// Lookup: property values at reservoir conditions from a measured grid, in the caller's unit system.
// Pure TypeScript (no framework, no I/O). See README.md in this folder.
export {
  describeLookupMethod,
  MAX_EXTRAPOLATION_LIMIT,
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
  LookupRefusal,
  LookupResult,
  LookupStencil,
  LookupStencilColumn,
  LookupSummary,
  LookupUnitLabels,
  NormalizedLookupOptions,
  UnitContext,
} from "./run-lookup";
export {
  engineOptions,
  LOOKUP_METHODS,
  lookupCanonical,
  METHOD_CODES,
} from "./compute";
export {
  engineRefusal,
  isPossible,
  LOOKUP_REFUSAL_CODES,
  PHYSICAL_LIMITS,
  refusalCode,
  REFUSED_IMPOSSIBLE,
  REFUSED_NO_VALUES,
  REFUSED_OUTSIDE,
  REFUSED_TOO_FAR,
} from "./refusals";
export type { LookupRefusalCode } from "./refusals";
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
  LOOKUP_ONLY_WARNING_CODES,
  LOOKUP_WARNING_CODES,
  LOOKUP_WARNING_FLAGS,
  lookupWarningsFromFlags,
  NEAR_BUBBLE_POINT,
  NEAR_BUBBLE_POINT_FRACTION,
  PCHIP_FALLBACK,
  W_NEAR_BUBBLE_POINT,
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
