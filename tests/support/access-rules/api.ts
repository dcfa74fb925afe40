import { ALL, ENGINEER_UP, type Rule } from "./types";

// POST rules send `body` as JSON with our Origin; okStatus is the status an allowed caller gets (default 200).

/** JSON API routes (session-cookie access; token access is tested in api.spec.ts). */
export const API_RULES: Record<string, Rule> = {
  "routes/api/health.ts": {
    kind: "api",
    path: "/api/health",
    allowed: "public",
  },
  "routes/api/ready.ts": { kind: "api", path: "/api/ready", allowed: "public" },
  "routes/api/v1/openapi.ts": {
    kind: "api",
    path: "/api/v1/openapi.json",
    allowed: "public",
  },
  "routes/api/v1/samples/index.ts": {
    kind: "api",
    path: "/api/v1/samples",
    allowed: ALL,
  },
  "routes/api/v1/samples/$sampleId/index.ts": {
    kind: "api",
    path: "/api/v1/samples/1",
    allowed: ALL,
  },
  "routes/api/v1/samples/$sampleId/lookup.ts": {
    kind: "api",
    path: "/api/v1/samples/1/lookup",
    allowed: ALL,
    method: "POST",
    body: {
      property: "oil_fvf",
      points: [{ pressure: 3000, temperature: 212 }],
    },
  },
  // Tables are exports: engineer and above with a session; viewers get 403.
  "routes/api/v1/samples/$sampleId/table.ts": {
    kind: "api",
    path: "/api/v1/samples/1/table?temperature=212&pressures=1000:4000:500",
    allowed: ENGINEER_UP,
  },
  "routes/api/not-found.ts": {
    kind: "api",
    path: "/api/no-such-endpoint",
    allowed: "public",
    okStatus: 404,
  },
};
