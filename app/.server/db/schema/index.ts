export * from "./auth";
export * from "./fluid-tables";
export * from "./ops";
export * from "./settings";
