export * from "./auth";
export * from "./fluid-tables";
