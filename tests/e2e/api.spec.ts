import { expect, test, type APIResponse } from "@playwright/test";
import { ACCOUNTS, signIn } from "../support/e2e";
import { closeE2eDb, e2eDb, mintToken, userIdOf } from "../support/e2e-db";

/*
 * The simulator API with bearer tokens: token life cycle, JWT attacks, scopes and restrictions, problem details,
 * size and rate limits, ETags. Problem details follow RFC 9457.
 */
test.afterAll(closeE2eDb);

async function expectProblem(
  response: APIResponse,
  status: number,
  code: string,
) {
  expect(response.status(), await response.text()).toBe(status);
  expect(response.headers()["content-type"]).toContain(
    "application/problem+json",
  );
  const body = (await response.json()) as Record<string, unknown>;
  expect(body).toMatchObject({
    status,
    code,
    type: `/api-docs#problem-${code}`,
  });
  expect(typeof body.title).toBe("string");
  expect(typeof body.detail).toBe("string");
  return body;
}

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

test("an engineer creates a token in the browser; a script uses it, then it is revoked and stops at once", async ({
  page,
  request,
}) => {
  await signIn(page, "engineer");
  await page.goto("/tokens");
  await page.getByLabel("Name").fill("Calder full-field model (test)");
  await page.getByRole("button", { name: "Create token" }).click();
  const token = await page.getByLabel("New token").inputValue();
  expect(token.split(".")).toHaveLength(3);

  const list = await request.get("/api/v1/samples", { headers: bearer(token) });
  expect(list.status()).toBe(200);
  const body = (await list.json()) as {
    samples: { label: string; approvedRevision: number }[];
  };
  expect(body.samples.map((s) => s.label)).toContain("CS-1 BH-01");

  // Last use is recorded.
  await page.reload();
  const row = page.getByRole("row", {
    name: /Calder full-field model \(test\)/,
  });
  await expect(row).not.toContainText("never");

  await row.getByRole("button", { name: /Revoke/ }).click();
  await expect(page.getByRole("status")).toContainText("is revoked");
  await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(token) }),
    401,
    "invalid_token",
  );
});

test("JWT attacks are refused with 401 and leak nothing", async ({
  request,
}) => {
  const userId = await userIdOf(ACCOUNTS.engineer);
  const good = await mintToken({ userId });
  expect(
    (
      await request.get("/api/v1/samples", { headers: bearer(good.token) })
    ).status(),
  ).toBe(200);

  // Wrong signature: same claims, another secret.
  const forged = await mintToken({
    userId,
    secret: "not-the-server-secret-not-the-server-secret",
    record: true,
  });
  let problem = await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(forged.token) }),
    401,
    "invalid_token",
  );
  expect(JSON.stringify(problem)).not.toContain("secret");

  // alg "none": header and payload of a valid token, no signature.
  const [, payload] = good.token.split(".");
  const none = `${Buffer.from(JSON.stringify({ alg: "none", typ: "JWT" })).toString("base64url")}.${payload}.`;
  await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(none) }),
    401,
    "invalid_token",
  );

  // Expired.
  const expired = await mintToken({ userId, expiresInSeconds: -10 });
  problem = await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(expired.token) }),
    401,
    "invalid_token",
  );
  expect(problem.detail).toMatch(/expired/);

  // Revoked in the database: refused on the very next request.
  await e2eDb().query(
    "UPDATE api_tokens SET revoked_at = NOW(3) WHERE id = ?",
    [good.id],
  );
  problem = await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(good.token) }),
    401,
    "invalid_token",
  );
  expect(problem.detail).toMatch(/revoked/);

  // A token whose record does not exist.
  const orphan = await mintToken({ userId, record: false });
  await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(orphan.token) }),
    401,
    "invalid_token",
  );

  // Garbage and a malformed header.
  await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer("abc.def.ghi") }),
    401,
    "invalid_token",
  );
  await expectProblem(
    await request.get("/api/v1/samples", {
      headers: { Authorization: "Basic Zm9vOmJhcg==" },
    }),
    401,
    "invalid_token",
  );
  await expectProblem(
    await request.get("/api/v1/samples"),
    401,
    "unauthenticated",
  );
});

test("a disabled person's tokens stop working", async ({ request }) => {
  const [result] = await e2eDb().query(
    "INSERT INTO users (email, name, role, password_hash) VALUES (?, 'Temp Engineer', 'engineer', NULL)",
    [`temp.${Date.now()}@calder.example`],
  );
  const userId = (result as { insertId: number }).insertId;
  const { token } = await mintToken({ userId });
  expect(
    (await request.get("/api/v1/samples", { headers: bearer(token) })).status(),
  ).toBe(200);
  await e2eDb().query("UPDATE users SET disabled_at = NOW(3) WHERE id = ?", [
    userId,
  ]);
  const problem = await expectProblem(
    await request.get("/api/v1/samples", { headers: bearer(token) }),
    401,
    "invalid_token",
  );
  expect(problem.detail).toMatch(/owner/);
});

test("scopes and restrictions are enforced", async ({ request }) => {
  const userId = await userIdOf(ACCOUNTS.engineer);
  const lookupOnly = await mintToken({ userId, scopes: ["lookup"] });
  await expectProblem(
    await request.get(
      "/api/v1/samples/1/table?temperature=212&pressures=1000,2000",
      { headers: bearer(lookupOnly.token) },
    ),
    403,
    "insufficient_scope",
  );
  const tablesOnly = await mintToken({ userId, scopes: ["tables:read"] });
  await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: bearer(tablesOnly.token),
      data: {
        property: "oil_fvf",
        points: [{ pressure: 3000, temperature: 212 }],
      },
    }),
    403,
    "insufficient_scope",
  );

  const onlySample2 = await mintToken({
    userId,
    restriction: { sampleIds: [2] },
  });
  const list = (await (
    await request.get("/api/v1/samples", { headers: bearer(onlySample2.token) })
  ).json()) as { samples: { id: number }[] };
  expect(list.samples.map((s) => s.id)).toEqual([2]);
  expect(
    (
      await request.get("/api/v1/samples/2", {
        headers: bearer(onlySample2.token),
      })
    ).status(),
  ).toBe(200);
  await expectProblem(
    await request.get("/api/v1/samples/1", {
      headers: bearer(onlySample2.token),
    }),
    403,
    "outside_restriction",
  );
  await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: bearer(onlySample2.token),
      data: {
        property: "oil_fvf",
        points: [{ pressure: 3000, temperature: 212 }],
      },
    }),
    403,
    "outside_restriction",
  );
});

test("invalid input, unknown samples, oversized bodies and unsupported types get their problem details", async ({
  request,
}) => {
  const { token } = await mintToken({
    userId: await userIdOf(ACCOUNTS.engineer),
  });
  const h = bearer(token);
  const invalid = await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: h,
      data: {
        property: "oil_fvf",
        points: [{ pressure: "high", temperature: 212 }],
      },
    }),
    400,
    "invalid_body",
  );
  expect(invalid.issues).toEqual(
    expect.arrayContaining([
      expect.objectContaining({ path: ["points", 0, "pressure"] }),
    ]),
  );
  await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: h,
      data: { property: "porosity", points: [] },
    }),
    400,
    "invalid_body",
  );
  await expectProblem(
    await request.get("/api/v1/samples/abc", { headers: h }),
    400,
    "invalid_path",
  );
  await expectProblem(
    await request.get("/api/v1/samples/999999", { headers: h }),
    404,
    "sample_not_found",
  );
  await expectProblem(
    await request.get("/api/v1/samples/1?revision=99", { headers: h }),
    404,
    "revision_not_found",
  );
  await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: { ...h, "Content-Type": "text/plain" },
      data: "hello",
    }),
    415,
    "unsupported_media_type",
  );
  const huge = JSON.stringify({
    property: "oil_fvf",
    points: [],
    padding: "x".repeat(9 * 1024 * 1024),
  });
  await expectProblem(
    await request.post("/api/v1/samples/1/lookup", {
      headers: { ...h, "Content-Type": "application/json" },
      data: huge,
    }),
    413,
    "payload_too_large",
  );
  // A point outside the measured range is not a malformed request: 200, the point refused in place.
  const outside = await request.post("/api/v1/samples/1/lookup", {
    headers: h,
    data: {
      property: "oil_fvf",
      points: [
        { pressure: 3000, temperature: 212 },
        { pressure: 9000, temperature: 212 },
      ],
    },
  });
  expect(outside.status()).toBe(200);
  const answered = (await outside.json()) as {
    results: {
      value: number | null;
      refused?: { code: string; message: string };
    }[];
  };
  expect(answered.results[0]!.value).toBeGreaterThan(1);
  expect(answered.results[1]!.value).toBeNull();
  expect(answered.results[1]!.refused?.code).toBe("outside-measured-range");
  expect(answered.results[1]!.refused?.message).toMatch(/Point 2\b/);
  expect(answered.results[1]!.refused?.message).toMatch(/400 to 5400 psia/);
});

test("every response names its revision and carries an ETag; a conditional GET answers 304", async ({
  request,
}) => {
  const { token } = await mintToken({
    userId: await userIdOf(ACCOUNTS.engineer),
  });
  const first = await request.get("/api/v1/samples/1?units=metric", {
    headers: bearer(token),
  });
  expect(first.status()).toBe(200);
  const etag = first.headers()["etag"];
  expect(etag).toMatch(/^".+"$/);
  expect(first.headers()["isopleth-revision"]).toBe("1");
  const body = (await first.json()) as {
    revision: { number: number };
    units: { pressure: string };
  };
  expect(body.revision.number).toBe(1);
  expect(body.units.pressure).toBe("bara");
  const again = await request.get("/api/v1/samples/1?units=metric", {
    headers: { ...bearer(token), "If-None-Match": etag! },
  });
  expect(again.status()).toBe(304);
  const otherUnits = await request.get("/api/v1/samples/1?units=field", {
    headers: { ...bearer(token), "If-None-Match": etag! },
  });
  expect(otherUnits.status()).toBe(200);
});

test("a token over its budget gets 429 with Retry-After", async ({
  request,
}) => {
  const { token } = await mintToken({
    userId: await userIdOf(ACCOUNTS.engineer),
  });
  let limited: APIResponse | null = null;
  for (let i = 0; i < 140 && !limited; i++) {
    const r = await request.get("/api/v1/samples", { headers: bearer(token) });
    if (r.status() === 429) limited = r;
    else expect(r.status()).toBe(200);
  }
  expect(
    limited,
    "the budget of 120 requests per minute was never exceeded",
  ).not.toBeNull();
  await expectProblem(limited!, 429, "rate_limited");
  expect(Number(limited!.headers()["retry-after"])).toBeGreaterThanOrEqual(1);
});

test("the OpenAPI description is served and rendered for people", async ({
  page,
  request,
}) => {
  const doc = (await (await request.get("/api/v1/openapi.json")).json()) as {
    openapi: string;
    paths: Record<string, unknown>;
  };
  expect(doc.openapi).toBe("3.1.0");
  expect(Object.keys(doc.paths)).toEqual(
    expect.arrayContaining([
      "/api/v1/samples",
      "/api/v1/samples/{sampleId}",
      "/api/v1/samples/{sampleId}/lookup",
      "/api/v1/samples/{sampleId}/table",
    ]),
  );
  await signIn(page, "viewer");
  await page.goto("/api-docs");
  await expect(
    page.getByRole("heading", { name: "/api/v1/samples/{sampleId}/lookup" }),
  ).toBeVisible();
  await expect(page.locator("#problem-rate_limited")).toContainText("429");
});

test("a resampled table in JSON, CSV and text agrees row by row, in the order simulators need", async ({
  request,
}) => {
  const { token } = await mintToken({
    userId: await userIdOf(ACCOUNTS.engineer),
    scopes: ["tables:read"],
  });
  const q = "temperature=212&pressures=500:5000:250&units=field";
  const jsonRes = await request.get(
    `/api/v1/samples/1/table?${q}&format=json`,
    { headers: bearer(token) },
  );
  expect(jsonRes.status()).toBe(200);
  expect(jsonRes.headers()["isopleth-revision"]).toBe("1");
  const table = (await jsonRes.json()) as {
    revision: number;
    rows: ({ pressure: number; branch: string } & Record<string, number>)[];
  };
  expect(table.revision).toBe(1);
  const rows = table.rows;
  expect(rows.length).toBeGreaterThanOrEqual(19);

  // Order simulators need: pressure strictly increasing, Rs non-decreasing, Bo falling above the bubble point.
  for (let i = 1; i < rows.length; i++) {
    expect(rows[i]!.pressure).toBeGreaterThan(rows[i - 1]!.pressure);
    expect(rows[i]!.solution_gor!).toBeGreaterThanOrEqual(
      rows[i - 1]!.solution_gor!,
    );
    if (rows[i - 1]!.branch === "undersaturated")
      expect(rows[i]!.oil_fvf!).toBeLessThan(rows[i - 1]!.oil_fvf!);
  }
  expect(
    rows.some((r) => r.branch === "saturated") &&
      rows.some((r) => r.branch === "undersaturated"),
  ).toBe(true);

  // CSV parsed back gives the same numbers.
  const csv = await (
    await request.get(`/api/v1/samples/1/table?${q}&format=csv`, {
      headers: bearer(token),
    })
  ).text();
  const csvLines = csv.split("\n").filter((l) => l && !l.startsWith("#"));
  const header = csvLines[0]!.split(",");
  expect(header[0]).toBe("pressure (psia)");
  const csvRows = csvLines.slice(1).map((l) => l.split(","));
  expect(csvRows).toHaveLength(rows.length);
  const boColumn = header.findIndex(
    (h) => h.startsWith("Bo (") || h.startsWith("oil_fvf ("),
  );
  expect(boColumn, `Bo column in ${header.join(",")}`).toBeGreaterThan(0);
  csvRows.forEach((cells, i) => {
    expect(Number(cells[0])).toBe(rows[i]!.pressure);
    expect(Number(cells[boColumn])).toBe(rows[i]!.oil_fvf);
  });

  // Text: comment lines with sample, revision, units, standard conditions and the caution; then aligned columns.
  const text = await (
    await request.get(`/api/v1/samples/1/table?${q}&format=text`, {
      headers: bearer(token),
    })
  ).text();
  expect(text).toMatch(/^# revision: 1$/m);
  expect(text).toMatch(/^# units: pressure psia; Rs scf\/STB; Bo rb\/STB/m);
  expect(text).toMatch(/^# standard conditions: 60 deg F, 14.696 psia$/m);
  expect(text).toMatch(/estimates/);
  const textRows = text
    .split("\n")
    .filter((l) => l.trim() && !l.startsWith("#"))
    .map((l) => l.trim().split(/\s+/).map(Number));
  expect(textRows).toHaveLength(rows.length);
  textRows.forEach((cells, i) => expect(cells[0]).toBe(rows[i]!.pressure));

  // Metric: pressures in bara.
  const metric = await request.get(
    `/api/v1/samples/1/table?temperature=100&pressures=50,100,150,200,250&units=metric`,
    { headers: bearer(token) },
  );
  expect(metric.status()).toBe(200);
  expect(
    ((await metric.json()) as { units: { pressure: string } }).units.pressure,
  ).toBe("bara");
  // Weak: derived from the revision and the query, since the body names its generation time (api-hardening.spec.ts).
  expect(metric.headers()["etag"]).toMatch(/^W\/".+"$/);

  await expectProblem(
    await request.get(
      `/api/v1/samples/1/table?temperature=212&pressures=500:x`,
      { headers: bearer(token) },
    ),
    400,
    "invalid_pressures",
  );
  await expectProblem(
    await request.get(
      `/api/v1/samples/1/table?temperature=212&pressures=9000,9500`,
      { headers: bearer(token) },
    ),
    422,
    "out_of_range",
  );
});
