import { Ajv2020, type ValidateFunction } from "ajv/dist/2020.js";
import { parse } from "csv-parse/sync";
import mysql from "mysql2/promise";
import { RouterContextProvider } from "react-router";
import { afterAll, beforeAll, expect, test } from "vitest";
import { openApiDocument } from "~/.server/api/openapi";
import { issueApiToken } from "~/.server/api/tokens";
import { callerContext } from "~/.server/auth/context";
import type { Database } from "~/.server/db/client";
import { seedDemo } from "~/.server/db/seed";
import { action } from "~/routes/api/v1/samples/$sampleId/lookup";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * POST /api/v1/samples/:id/lookup against a real MariaDB holding the invented demo scenario (seedDemo): the
 * route as the server runs it (token check, body read, revision, engine), its answers checked against the
 * response schemas of the OpenAPI document the server serves (ajv, JSON Schema 2020-12, the dialect of
 * OpenAPI 3.1). The numbers are the engine's own (its tests hold the outside references); what is checked here
 * is the HTTP contract: every point answered or refused in place, several properties in one request, the
 * columnar and CSV forms carrying the same numbers, and 400 only for malformed requests.
 */
let db: Database;
let pool: mysql.Pool;
let cleanup: () => Promise<void>;
let token: string;

const document = openApiDocument("http://localhost") as {
  paths: Record<
    string,
    {
      post: {
        responses: Record<
          string,
          { content: Record<string, { schema: object }> }
        >;
      };
    }
  >;
  components: object;
};
const ajv = new Ajv2020({ strict: false, allErrors: true });
ajv.addSchema({
  $id: "https://isopleth.test/openapi.json",
  components: document.components,
});
const responses =
  document.paths["/api/v1/samples/{sampleId}/lookup"]!.post.responses;
function schemaOf(status: string, mediaType: string): ValidateFunction {
  const { schema } = responses[status]!.content[mediaType]!;
  return ajv.compile({
    $id: `https://isopleth.test/lookup/${status}/${mediaType}`,
    ...JSON.parse(
      JSON.stringify(schema).replaceAll(
        '"#/components/',
        '"https://isopleth.test/openapi.json#/components/',
      ),
    ),
  });
}
const validJson = schemaOf("200", "application/json");
const validColumns = schemaOf("200", "application/vnd.isopleth.columns+json");
const validProblem = schemaOf("400", "application/problem+json");

function expectValid(validate: ValidateFunction, body: unknown) {
  const ok = validate(body);
  expect(ok ? [] : validate.errors).toEqual([]);
}

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  db = fresh.db;
  pool = mysql.createPool({ uri: fresh.url });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
  };
  await seedDemo(db, { demoPassword: "demo-password-for-tests" });
  const [rows] = await pool.query(
    "SELECT id FROM users WHERE email = 'engineer@calder.example'",
  );
  const userId = (rows as { id: number }[])[0]!.id;
  // Sample 4 loses its z-factor grid, for the property-not-measured answer.
  await pool.query(
    `DELETE g FROM property_grids g JOIN sample_revisions r ON r.id = g.revision_id
      WHERE r.sample_id = 4 AND g.property = 'z_factor'`,
  );
  token = (
    await issueApiToken({
      userId,
      name: "lookup test",
      scopes: ["lookup"],
      expiresInDays: 1,
      ipAddress: "192.0.2.10",
    })
  ).token;
}, 120_000);

afterAll(async () => {
  await cleanup();
});

async function post(
  body: unknown,
  { sampleId = "1", accept }: { sampleId?: string; accept?: string } = {},
): Promise<Response> {
  const context = new RouterContextProvider();
  context.set(callerContext, {
    user: null,
    sessionId: null,
    ipAddress: "192.0.2.10",
  });
  const request = new Request(
    `http://localhost/api/v1/samples/${sampleId}/lookup`,
    {
      method: "POST",
      headers: {
        Authorization: `Bearer ${token}`,
        "Content-Type": "application/json",
        ...(accept ? { Accept: accept } : {}),
      },
      body: JSON.stringify(body),
    },
  );
  return action({ request, params: { sampleId }, context } as never);
}

type Result = {
  value: number | null;
  errorEstimate: number | null;
  refused?: { code: string; message: string };
  warnings: string[];
  method: string | null;
};
type Block = {
  property: string;
  units: Record<string, string>;
  results: Result[];
  summary: { count: number; refusedCount: number };
};

// Inside sample 1's measured range (400–5400 psia, 150–240 °F; invented demo data).
const inside = [
  { pressure: 3000, temperature: 212 },
  { pressure: 1000, temperature: 160 },
  { pressure: 5000, temperature: 230 },
];

test("one property: one result per point, the answer matches the documented schema and says how long it took", async () => {
  const response = await post({ property: "oil_fvf", points: inside });
  expect(response.status).toBe(200);
  expect(response.headers.get("Content-Type")).toMatch(/^application\/json/);
  expect(response.headers.get("Server-Timing")).toMatch(/^app;dur=[\d.]+/);
  const body = (await response.json()) as Block & { revision: number };
  expectValid(validJson, body);
  expect(body.property).toBe("oil_fvf");
  expect(body.results).toHaveLength(3);
  for (const r of body.results) {
    expect(r.value).toBeGreaterThan(1); // Bo of a live oil is above 1 rb/STB
    expect(r.refused).toBeUndefined();
  }
  expect(body.summary).toMatchObject({ count: 3, refusedCount: 0 });
});

test("several properties in one request: one block per property, each exactly the one-property answer", async () => {
  const properties = ["oil_fvf", "solution_gor", "oil_viscosity"];
  const response = await post({ properties, points: inside });
  expect(response.status).toBe(200);
  const body = (await response.json()) as { lookups: Block[] };
  expectValid(validJson, body);
  expect(body.lookups.map((b) => b.property)).toEqual(properties);
  for (const block of body.lookups) {
    const single = (await (
      await post({ property: block.property, points: inside })
    ).json()) as Block & Record<string, unknown>;
    expect(block).toEqual({
      property: single.property,
      methodDescription: single.methodDescription,
      degree: single.degree,
      units: single.units,
      results: single.results,
      summary: single.summary,
    });
  }
});

test("the columnar form (body format or Accept) carries the same numbers as the per-point form, as arrays per field", async () => {
  const points = [...inside, { pressure: 2650, temperature: 212 }];
  const perPoint = (await (
    await post({ properties: ["oil_fvf", "z_factor"], points })
  ).json()) as { lookups: Block[] };
  for (const ask of [
    { body: { format: "columns" } },
    { accept: "application/vnd.isopleth.columns+json" },
  ]) {
    const response = await post(
      { properties: ["oil_fvf", "z_factor"], points, ...ask.body },
      { accept: ask.accept },
    );
    expect(response.status).toBe(200);
    expect(response.headers.get("Content-Type")).toMatch(
      /^application\/vnd\.isopleth\.columns\+json/,
    );
    const body = (await response.json()) as {
      format: string;
      lookups: {
        count: number;
        columns: Record<string, unknown[]>;
      }[];
    };
    expectValid(validColumns, body);
    expect(body.format).toBe("columns");
    body.lookups.forEach((block, k) => {
      const results = perPoint.lookups[k]!.results;
      expect(block.count).toBe(points.length);
      expect(block.columns.value).toEqual(results.map((r) => r.value));
      expect(block.columns.errorEstimate).toEqual(
        results.map((r) => r.errorEstimate),
      );
      expect(block.columns.method).toEqual(results.map((r) => r.method));
      expect(block.columns.warnings).toEqual(results.map((r) => r.warnings));
      expect(block.columns.refused).toEqual(
        results.map((r) => r.refused ?? null),
      );
      // oil grids carry the bubble point per point; gas grids (z) leave the column out
      const bubble = results.map(
        (r) =>
          (r as { bubblePointPressure?: number }).bubblePointPressure ?? null,
      );
      if (bubble.every((b) => b === null))
        expect(block.columns).not.toHaveProperty("bubblePointPressure");
      else expect(block.columns.bubblePointPressure).toEqual(bubble);
    });
  }
});

test("CSV by Accept: a byte-order mark, comment lines, a header with units and the same numbers", async () => {
  const json = (await (
    await post({ properties: ["oil_fvf", "solution_gor"], points: inside })
  ).json()) as { lookups: Block[] };
  const response = await post(
    { properties: ["oil_fvf", "solution_gor"], points: inside },
    { accept: "text/csv" },
  );
  expect(response.status).toBe(200);
  expect(response.headers.get("Content-Type")).toMatch(/^text\/csv/);
  const bytes = new Uint8Array(await response.arrayBuffer());
  expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // UTF-8 byte-order mark
  const text = new TextDecoder().decode(bytes); // drops the mark
  const rows = parse(text, {
    relax_column_count: true,
  }) as string[][];
  const comments = rows.filter((r) => r[0]!.startsWith("#"));
  expect(comments.some((r) => /caution/.test(r[0]!))).toBe(true);
  const [header, ...data] = rows.filter((r) => !r[0]!.startsWith("#"));
  expect(header!.slice(0, 4)).toEqual([
    "Pressure (psia)",
    "Temperature (°F)",
    "Oil formation volume factor (rb/STB)",
    "Oil formation volume factor error estimate (rb/STB)",
  ]);
  expect(data).toHaveLength(inside.length);
  data.forEach((row, i) => {
    expect(Number(row[0])).toBe(inside[i]!.pressure);
    expect(Number(row[2])).toBe(json.lookups[0]!.results[i]!.value);
    expect(Number(row[3])).toBe(json.lookups[0]!.results[i]!.errorEstimate);
    expect(Number(row[7])).toBe(json.lookups[1]!.results[i]!.value);
  });
});

test("a point outside the measured range is refused in place; the others are served (200, not 422)", async () => {
  const points = [inside[0]!, { pressure: 9000, temperature: 212 }, inside[1]!];
  const response = await post({
    properties: ["oil_fvf", "solution_gor"],
    points,
  });
  expect(response.status).toBe(200);
  const body = (await response.json()) as { lookups: Block[] };
  expectValid(validJson, body);
  for (const block of body.lookups) {
    const [a, refused, c] = block.results;
    expect(a!.value).not.toBeNull();
    expect(c!.value).not.toBeNull();
    expect(refused).toMatchObject({
      value: null,
      errorEstimate: null,
      method: null,
      stencil: null,
      refused: { code: "outside-measured-range" },
    });
    // messages count points from 1: the second point sent is "Point 2"
    expect(refused!.refused!.message).toMatch(/Point 2\b/);
    expect(block.summary).toMatchObject({ count: 3, refusedCount: 1 });
  }
  const columns = await post({
    property: "oil_fvf",
    points,
    format: "columns",
  });
  const block = (await columns.json()) as {
    columns: { value: unknown[]; refused: unknown[] };
  };
  expectValid(validColumns, block);
  expect(block.columns.value[1]).toBeNull();
  expect(block.columns.refused[1]).toMatchObject({
    code: "outside-measured-range",
  });
});

test("malformed requests are refused whole with 400 and a message naming the field", async () => {
  const cases: [unknown, RegExp, (string | number)[]][] = [
    [
      { property: "oil_fvf", properties: ["oil_fvf"], points: inside },
      /not both/,
      ["properties"],
    ],
    [{ points: inside }, /`property`.*`properties`/, ["property"]],
    [
      { properties: ["oil_fvf", "oil_fvf"], points: inside },
      /listed twice/,
      ["properties", 1],
    ],
    [
      {
        property: "oil_fvf",
        points: [inside[0], { pressure: 3000, temperature: "hot" }],
      },
      /finite number/,
      ["points", 1, "temperature"],
    ],
    [
      { property: "oil_fvf", points: inside, format: "rows" },
      /format/,
      ["format"],
    ],
  ];
  for (const [body, message, path] of cases) {
    const response = await post(body);
    expect(response.status).toBe(400);
    const problem = (await response.json()) as {
      code: string;
      detail: string;
      issues: { path: (string | number)[] }[];
    };
    expectValid(validProblem, problem);
    expect(problem.code).toBe("invalid_body");
    expect(`${problem.detail} ${JSON.stringify(problem.issues)}`).toMatch(
      message,
    );
    expect(problem.issues[0]!.path).toEqual(path);
  }
});

test("an absolute pressure at or below zero is a malformed point: 400 naming the point, counted from 1 in words and from 0 in the path", async () => {
  const response = await post({
    property: "oil_fvf",
    points: [inside[0], inside[1], { pressure: -5, temperature: 212 }],
  });
  expect(response.status).toBe(400);
  const problem = (await response.json()) as {
    detail: string;
    issues: { path: (string | number)[] }[];
  };
  expectValid(validProblem, problem);
  expect(problem.issues[0]!.path).toEqual(["points", 2]);
  expect(problem.detail).toMatch(/Point 3\b/);
});

test("a property the revision did not measure: 404 naming it, nothing computed", async () => {
  const response = await post(
    { properties: ["oil_fvf", "z_factor"], points: inside },
    { sampleId: "4" },
  );
  expect(response.status).toBe(404);
  const problem = (await response.json()) as { code: string; detail: string };
  expect(problem.code).toBe("property_not_measured");
  expect(problem.detail).toMatch(/z_factor/);
});
