/**
 * Writes app/utils/api/openapi-types.ts: the TypeScript types of our OpenAPI document (the one served at
 * /api/v1/openapi.json, generated from the zod schemas), for the browser's typed API client.
 * `npm run api:types` after changing a schema; a unit test fails while the file is out of date.
 */
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { apiTypesSource } from "./api-types";

const target = fileURLToPath(
  new URL("../app/utils/api/openapi-types.ts", import.meta.url),
);
writeFileSync(target, await apiTypesSource());
console.log(`wrote ${target}`);
