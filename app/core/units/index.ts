/**
 * Units: quantity catalogue with exact factors, canonical internal system, field and metric presets,
 * standard conditions as data, and a unit-label parser for laboratory spreadsheets. See README.md.
 */
export * from "./definitions";
export * from "./errors";
export * from "./catalogue";
export * from "./gravity";
export * from "./standard-conditions";
export * from "./properties";
export * from "./unit-systems";
export * from "./output";
export * from "./parse-unit-label";
