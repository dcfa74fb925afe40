import { ALL, ENGINEER_UP, type Rule } from "./types";

/** JSON API routes (session-cookie access; token access is tested in api.spec.ts). */
export const API_RULES: Record<string, Rule> = {
  "routes/api/health.ts": { kind: "api", path: "/api/health", allowed: "public" },
  "routes/api/v1/openapi.ts": { kind: "api", path: "/api/v1/openapi.json", allowed: "public" },
  "routes/api/v1/samples/index.ts": { kind: "api", path: "/api/v1/samples", allowed: ALL },
  "routes/api/v1/samples/$sampleId/index.ts": { kind: "api", path: "/api/v1/samples/1", allowed: ALL },
};
void ENGINEER_UP;
