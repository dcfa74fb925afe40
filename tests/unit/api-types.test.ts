import { readFileSync } from "node:fs";
import { expect, test } from "vitest";
import { apiTypesSource } from "../../scripts/api-types";

// The browser's API types are generated from the OpenAPI document; a schema change without
// `npm run api:types` would let the client and the server drift.
test("app/utils/api/openapi-types.ts is the current output of npm run api:types", async () => {
  const committed = readFileSync(
    new URL("../../app/utils/api/openapi-types.ts", import.meta.url),
    "utf8",
  );
  expect(committed).toBe(await apiTypesSource());
}, 60_000); // generating and formatting takes a few seconds on a loaded machine
