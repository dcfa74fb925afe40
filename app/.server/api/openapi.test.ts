import SwaggerParser from "@apidevtools/swagger-parser";
import { Validator } from "@seriousme/openapi-schema-validator";
import { expect, test } from "vitest";
import { openApiDocument } from "./openapi";

/*
 * The OpenAPI document the server serves (/api/v1/openapi.json), checked by two validators written
 * independently of each other and of the generator we build it with (zod-to-openapi):
 * - @seriousme/openapi-schema-validator checks it against the OpenAPI Initiative's JSON Schema of 3.1;
 * - @apidevtools/swagger-parser parses it, resolves every $ref and checks it against the specification
 *   (its schema, and what a JSON Schema cannot say: every $ref resolves).
 * Each is also shown a broken copy, so neither check can pass whatever it is given.
 */
const document = () =>
  structuredClone(openApiDocument("http://localhost")) as Record<
    string,
    unknown
  >;

test("the OpenAPI document is valid OpenAPI 3.1 by the OpenAPI Initiative's schema (@seriousme/openapi-schema-validator)", async () => {
  const validator = new Validator();
  const result = await validator.validate(document());
  expect(result.errors ?? []).toEqual([]);
  expect(result.valid).toBe(true);
  expect(validator.version).toBe("3.1");

  const broken = document();
  (broken.info as Record<string, unknown>).title = 42;
  expect((await new Validator().validate(broken)).valid).toBe(false);
});

test("the OpenAPI document parses, dereferences and validates (@apidevtools/swagger-parser)", async () => {
  const api = (await SwaggerParser.validate(document() as never)) as {
    paths: Record<string, Record<string, unknown>>;
  };
  expect(Object.keys(api.paths)).toContain("/api/v1/samples/{sampleId}/lookup");

  // a reference to a schema that does not exist
  const broken = document();
  const schemas = (broken.components as { schemas: Record<string, unknown> })
    .schemas;
  schemas.LookupBlock = { $ref: "#/components/schemas/NoSuchSchema" };
  await expect(SwaggerParser.validate(broken as never)).rejects.toThrow(
    /NoSuchSchema/,
  );
});

test("the lookup's description documents refused points, several properties, the columnar and CSV forms and its problem answers", () => {
  const doc = document() as {
    paths: Record<
      string,
      {
        post?: {
          description: string;
          responses: Record<string, { content?: Record<string, unknown> }>;
        };
      }
    >;
    components: { schemas: Record<string, unknown> };
  };
  const lookup = doc.paths["/api/v1/samples/{sampleId}/lookup"]!.post!;
  expect(Object.keys(lookup.responses["200"]!.content!)).toEqual([
    "application/json",
    "application/vnd.isopleth.columns+json",
    "text/csv",
  ]);
  for (const status of ["400", "404", "413", "415"])
    expect(lookup.responses[status]!.content).toHaveProperty(
      "application/problem+json",
    );
  expect(lookup.responses).not.toHaveProperty("422");
  expect(lookup.description).toMatch(/refused/);
  expect(lookup.description).toMatch(/`properties`/);
  expect(lookup.description).toMatch(/columns/);
  expect(lookup.description).toMatch(/text\/csv/);
  for (const name of [
    "LookupResponse",
    "LookupsResponse",
    "LookupColumnsResponse",
    "LookupsColumnsResponse",
    "Refused",
    "LookupSummary",
  ])
    expect(doc.components.schemas).toHaveProperty(name);
});
