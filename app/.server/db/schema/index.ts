export * from "./auth";
export * from "./fluid-tables";
export * from "./settings";
