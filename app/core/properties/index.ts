/**
 * Fluid-property methods: published correlations, laboratory-data methods and the synthetic sample
 * generator. Pure functions in canonical units (psia, °F, rb/STB, rb/scf, scf/STB, cP, lb/ft³, 1/psi),
 * each returning { value, warnings }. See README.md.
 */
export * from "./errors";
export type {
  Estimate,
  PropertyWarning,
  PropertyWarningCode,
  ValidityRange,
  ValidityRanges,
} from "./estimate";
export * from "./standing";
export * from "./vasquez-beggs";
export * from "./beggs-robinson";
export * from "./pseudo-critical";
export * from "./z-factor";
export * from "./gas-properties";
export * from "./separator-adjustment";
export * from "./undersaturated-oil";
export * from "./y-function";
export * from "./saturated-branch";
export * from "./oil-density";
export * from "./generate-sample";
export {
  solveBracketed,
  solveFirstRoot,
  type RootResult,
} from "./solve-bracketed";
export { createRandom, type Random } from "./prng";
