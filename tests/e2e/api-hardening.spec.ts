import { expect, test, type APIResponse } from "@playwright/test";
import { API_SCOPE_RULES, type ApiScope } from "../../app/utils/api-scopes";
import { ACCOUNTS, apiContextFor, signIn } from "../support/e2e";
import { closeE2eDb, e2eDb, mintToken, userIdOf } from "../support/e2e-db";

/*
 * Hardening of the token API (the hardening issue, items 2–6, 12 and 15): roles bind tokens on every request,
 * drafts stay drafts, scopes mean what the token page says, no NaN or Infinity leaves the server, no 500 for
 * bad input, strict query strings, conditional GETs that work.
 * Guidance followed: RFC 9457 (problem details), RFC 9110 §8.8.3 and §13.1.2 (ETag, If-None-Match, 304),
 * RFC 8259 §6 (JSON has no NaN or Infinity), RFC 6750 §3.1 (insufficient_scope), OWASP REST Security and
 * Input Validation cheat sheets (allow-list parameters, bound sizes, do not reflect input), OWASP
 * Authorization cheat sheet (check permissions on every request, deny by default).
 */
test.afterAll(closeE2eDb);

async function expectProblem(
  response: APIResponse,
  status: number,
  code: string,
) {
  const text = await response.text();
  expect(response.status(), text.slice(0, 500)).toBe(status);
  expect(response.headers()["content-type"]).toContain(
    "application/problem+json",
  );
  const body = JSON.parse(text) as Record<string, unknown>;
  expect(body).toMatchObject({
    status,
    code,
    type: `/api-docs#problem-${code}`,
  });
  return body as {
    detail: string;
    issues?: { path: (string | number)[]; message: string }[];
  };
}

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** Authorization headers of a fresh token (every scope) owned by the demo account `email`. */
async function bearerFor(email: string) {
  const { token } = await mintToken({ userId: await userIdOf(email) });
  return bearer(token);
}
const POINT = { pressure: 3000, temperature: 212 };
const TABLE = "temperature=212&pressures=1000:4000:500";

/** Whether `text` repeats more than 200 characters of the marker `unit` (input reflected back). */
function echoes(text: string, unit: string): boolean {
  return text.includes(unit.repeat(Math.ceil(201 / unit.length)));
}

/** A copy of an approved revision of `sampleId` as a new revision with `status` (as an upload would store it). */
async function copyRevision(
  sampleId: number,
  status: "draft" | "rejected",
): Promise<{ id: number; number: number }> {
  const db = e2eDb();
  const [[source]] = (await db.query(
    "SELECT id FROM sample_revisions WHERE sample_id = ? AND status = 'approved' ORDER BY number DESC LIMIT 1",
    [sampleId],
  )) as unknown as [{ id: number }[]];
  const [[row]] = (await db.query(
    "SELECT MAX(number) + 1 AS next FROM sample_revisions WHERE sample_id = ?",
    [sampleId],
  )) as unknown as [{ next: number }[]];
  const next = row!.next;
  const [inserted] = await db.query(
    "INSERT INTO sample_revisions (sample_id, number, status, comment) VALUES (?, ?, ?, 'e2e: a copy whose checks failed')",
    [sampleId, next, status],
  );
  const id = (inserted as { insertId: number }).insertId;
  await db.query(
    "INSERT INTO revision_bubble_points (revision_id, temperature_f, bubble_point_psia) SELECT ?, temperature_f, bubble_point_psia FROM revision_bubble_points WHERE revision_id = ?",
    [id, source!.id],
  );
  const [grids] = (await db.query(
    "SELECT id, property, unit, source_unit FROM property_grids WHERE revision_id = ?",
    [source!.id],
  )) as unknown as [
    {
      id: number;
      property: string;
      unit: string;
      source_unit: string | null;
    }[],
  ];
  for (const g of grids) {
    const [grid] = await db.query(
      "INSERT INTO property_grids (revision_id, property, unit, source_unit) VALUES (?, ?, ?, ?)",
      [id, g.property, g.unit, g.source_unit],
    );
    await db.query(
      "INSERT INTO grid_points (grid_id, pressure_psia, temperature_f, value) SELECT ?, pressure_psia, temperature_f, value FROM grid_points WHERE grid_id = ?",
      [(grid as { insertId: number }).insertId, g.id],
    );
  }
  return { id, number: Number(next) };
}

test.describe("item 2: a token's authority is its scopes and its owner's current role", () => {
  test("a demoted engineer's token stops exporting tables on the next request; reads and lookups stay", async ({
    request,
  }) => {
    const [result] = await e2eDb().query(
      "INSERT INTO users (email, name, role, password_hash) VALUES (?, 'Demoted Engineer (e2e)', 'engineer', NULL)",
      [`demoted.${Date.now()}@calder.example`],
    );
    const userId = (result as { insertId: number }).insertId;
    const { token } = await mintToken({ userId });
    expect(
      (
        await request.get(`/api/v1/samples/1/table?${TABLE}`, {
          headers: bearer(token),
        })
      ).status(),
    ).toBe(200);
    await e2eDb().query("UPDATE users SET role = 'viewer' WHERE id = ?", [
      userId,
    ]);
    const refused = await expectProblem(
      await request.get(`/api/v1/samples/1/table?${TABLE}`, {
        headers: bearer(token),
      }),
      403,
      "insufficient_role",
    );
    expect(refused.detail).toMatch(/viewer/);
    expect(
      (
        await request.get("/api/v1/samples/1", { headers: bearer(token) })
      ).status(),
    ).toBe(200);
    expect(
      (
        await request.post("/api/v1/samples/1/lookup", {
          headers: bearer(token),
          data: { property: "oil_fvf", points: [POINT] },
        })
      ).status(),
    ).toBe(200);
    await e2eDb().query("UPDATE users SET role = 'engineer' WHERE id = ?", [
      userId,
    ]);
    expect(
      (
        await request.get(`/api/v1/samples/1/table?${TABLE}`, {
          headers: bearer(token),
        })
      ).status(),
    ).toBe(200);
  });

  test("a viewer with tokens from before a demotion lists and revokes them on the tokens page, but cannot create one", async ({
    page,
    request,
  }) => {
    const viewerId = await userIdOf(ACCOUNTS.viewer);
    const { id, token } = await mintToken({
      userId: viewerId,
      scopes: ["tables:read"],
    });
    await e2eDb().query(
      "UPDATE api_tokens SET name = 'From my engineer days (e2e)' WHERE id = ?",
      [id],
    );
    await signIn(page, "viewer");
    const response = await page.goto("/tokens");
    expect(response?.status()).toBe(200);
    const row = page.getByRole("row", {
      name: /From my engineer days \(e2e\)/,
    });
    await expect(row).toBeVisible();
    await expect(
      page.getByRole("button", { name: "Create token" }),
    ).toHaveCount(0);
    await expect(
      page.getByText(/Your role .*cannot create tokens/),
    ).toBeVisible();
    // The create intent is refused on the server too.
    const ctx = await apiContextFor("viewer");
    const create = await ctx.post("/tokens", {
      form: {
        intent: "create",
        name: "sneaky",
        scopes: "lookup",
        expiresInDays: "5",
      },
      maxRedirects: 0,
    });
    expect(create.status()).toBe(403);
    await ctx.dispose();
    await row.getByRole("button", { name: /Revoke/ }).click();
    await expect(page.getByRole("status")).toContainText("is revoked");
    await expectProblem(
      await request.get("/api/v1/samples", { headers: bearer(token) }),
      401,
      "invalid_token",
    );
  });
});

test.describe("item 3: drafts stay drafts", () => {
  let draft: { id: number; number: number };
  test.beforeAll(async () => {
    draft = await copyRevision(1, "draft");
  });
  test.afterAll(async () => {
    await e2eDb().query("DELETE FROM sample_revisions WHERE id = ?", [
      draft.id,
    ]);
  });

  test("a token cannot read, tabulate or look up a draft: 404 revision_not_found, as for a missing number", async ({
    request,
  }) => {
    const h = await bearerFor(ACCOUNTS.admin);
    const missing = await expectProblem(
      await request.get("/api/v1/samples/1?revision=999", { headers: h }),
      404,
      "revision_not_found",
    );
    const asDraft = await expectProblem(
      await request.get(`/api/v1/samples/1?revision=${draft.number}`, {
        headers: h,
      }),
      404,
      "revision_not_found",
    );
    expect(asDraft.detail.replace(String(draft.number), "N")).toBe(
      missing.detail.replace("999", "N"),
    );
    await expectProblem(
      await request.get(
        `/api/v1/samples/1/table?${TABLE}&revision=${draft.number}`,
        { headers: h },
      ),
      404,
      "revision_not_found",
    );
    await expectProblem(
      await request.get(
        `/api/v1/samples/1/table?${TABLE}&revision=${draft.number}&format=csv`,
        { headers: h },
      ),
      404,
      "revision_not_found",
    );
    await expectProblem(
      await request.post("/api/v1/samples/1/lookup", {
        headers: h,
        data: { property: "oil_fvf", points: [POINT], revision: draft.number },
      }),
      404,
      "revision_not_found",
    );
    // Approved output says so.
    const approved = (await (
      await request.get("/api/v1/samples/1?revision=1", { headers: h })
    ).json()) as { revision: { status: string; approved: boolean } };
    expect(approved.revision).toMatchObject({
      status: "approved",
      approved: true,
    });
  });

  test("a signed-in lab lead may ask for a draft, and every output says it is an unapproved draft", async () => {
    const ctx = await apiContextFor("lab_lead");
    const detail = await ctx.get(`/api/v1/samples/1?revision=${draft.number}`);
    expect(detail.status()).toBe(200);
    expect(detail.headers()["isopleth-revision-status"]).toBe("draft");
    expect(
      ((await detail.json()) as { revision: unknown }).revision,
    ).toMatchObject({ number: draft.number, status: "draft", approved: false });

    const table = await ctx.get(
      `/api/v1/samples/1/table?${TABLE}&revision=${draft.number}`,
    );
    expect(table.status()).toBe(200);
    expect(await table.json()).toMatchObject({
      revision: draft.number,
      revisionStatus: "draft",
      approved: false,
    });
    const csv = await (
      await ctx.get(
        `/api/v1/samples/1/table?${TABLE}&revision=${draft.number}&format=csv`,
      )
    ).text();
    expect(csv.split("\r\n")[0]).toMatch(
      /^# UNAPPROVED DRAFT: revision \d+ of sample 1 has not been approved/,
    );
    const text = await (
      await ctx.get(
        `/api/v1/samples/1/table?${TABLE}&revision=${draft.number}&format=text`,
      )
    ).text();
    expect(text.split("\n")[0]).toMatch(
      /^# UNAPPROVED DRAFT: revision \d+ of sample 1 has not been approved/,
    );
    // ... and approved CSV does not carry the line.
    const approvedCsv = await (
      await ctx.get(`/api/v1/samples/1/table?${TABLE}&revision=1&format=csv`)
    ).text();
    expect(approvedCsv).not.toMatch(/DRAFT/);

    const lookup = await ctx.post("/api/v1/samples/1/lookup", {
      data: { property: "oil_fvf", points: [POINT], revision: draft.number },
    });
    expect(lookup.status()).toBe(200);
    expect(await lookup.json()).toMatchObject({
      revision: draft.number,
      revisionStatus: "draft",
      approved: false,
    });
    await ctx.dispose();

    // A viewer's session gets what a token gets.
    const viewer = await apiContextFor("viewer");
    await expectProblem(
      await viewer.get(`/api/v1/samples/1?revision=${draft.number}`),
      404,
      "revision_not_found",
    );
    await viewer.dispose();
  });

  test("the lookup page shows a banner when it runs on a draft", async ({
    page,
  }) => {
    await signIn(page, "lab_lead");
    await page.goto(`/lookup?sample=1&revision=${draft.number}`);
    await page.getByRole("button", { name: "Look up" }).click();
    await expect(
      page.getByRole("alert").filter({ hasText: "Unapproved draft" }),
    ).toContainText(`revision ${draft.number}`);
    await page.goto("/lookup?sample=1");
    await page.getByRole("button", { name: "Look up" }).click();
    await expect(page.getByRole("table").first()).toBeVisible();
    await expect(page.getByText("Unapproved draft")).toHaveCount(0);
  });
});

test.describe("item 4: scopes mean what the token page says", () => {
  test("a lookup-only token cannot read whole measured grids", async ({
    request,
  }) => {
    const { token } = await mintToken({
      userId: await userIdOf(ACCOUNTS.engineer),
      scopes: ["lookup"],
    });
    await expectProblem(
      await request.get("/api/v1/samples/1", { headers: bearer(token) }),
      403,
      "insufficient_scope",
    );
  });

  test("every rule of the scope table is on the token page and enforced by the API", async ({
    page,
    request,
  }) => {
    const userId = await userIdOf(ACCOUNTS.engineer);
    const tokens: Record<ApiScope, string> = {
      "tables:read": (await mintToken({ userId, scopes: ["tables:read"] }))
        .token,
      lookup: (await mintToken({ userId, scopes: ["lookup"] })).token,
    };
    for (const rule of API_SCOPE_RULES) {
      for (const scope of ["tables:read", "lookup"] as const) {
        const path = rule.example.replace("{sampleId}", "1");
        const response =
          rule.method === "POST"
            ? await request.post(path, {
                headers: bearer(tokens[scope]),
                data: { property: "oil_fvf", points: [POINT] },
              })
            : await request.get(path, { headers: bearer(tokens[scope]) });
        const allowed = rule.scopes.includes(scope);
        expect(
          response.status(),
          `${rule.method} ${rule.path} with a ${scope} token`,
        ).toBe(allowed ? 200 : 403);
      }
    }
    await signIn(page, "engineer");
    await page.goto("/tokens");
    const table = page.getByRole("table", { name: "What each scope allows" });
    for (const rule of API_SCOPE_RULES) {
      const row = table.getByRole("row", {
        name: new RegExp(
          `^${rule.method} ${rule.path.replace(/[{}]/g, "\\$&")}\\s`,
        ),
      });
      await expect(row).toContainText(rule.scopes.join(" or "));
      await expect(row).toContainText(rule.description);
    }
  });
});

test.describe("item 5: no NaN or Infinity leaves the server", () => {
  test("a lookup point that cannot be computed comes back with value null and a refusal; the rest are served", async ({
    request,
  }) => {
    const { token } = await mintToken({
      userId: await userIdOf(ACCOUNTS.engineer),
    });
    const response = await request.post("/api/v1/samples/1/lookup", {
      headers: bearer(token),
      data: {
        property: "oil_fvf",
        extrapolate: true,
        method: "newton",
        degree: 6,
        points: [
          POINT,
          { pressure: 1e300, temperature: 212 },
          { pressure: 3000, temperature: 1e300 },
        ],
      },
    });
    const text = await response.text();
    expect(response.status(), text.slice(0, 300)).toBe(200);
    expect(text).not.toMatch(/NaN|Infinity/);
    const body = JSON.parse(text) as {
      results: {
        value: number | null;
        errorEstimate: number | null;
        refused?: { code: string; message: string };
      }[];
    };
    expect(body.results[0]!.value).toBeGreaterThan(1);
    expect(body.results[0]!.refused).toBeUndefined();
    for (const r of body.results.slice(1)) {
      expect(r.value).toBeNull();
      expect(r.errorEstimate).toBeNull();
      // far past the extrapolation limit (or, were it allowed, no finite number)
      expect(["extrapolation-too-far", "impossible-value"]).toContain(
        r.refused?.code,
      );
      expect(r.refused?.message).toMatch(/Point [23]\b/);
    }
  });

  test("the table omits rows that cannot be computed and says why, in JSON, CSV and text", async ({
    request,
  }) => {
    const { token } = await mintToken({
      userId: await userIdOf(ACCOUNTS.engineer),
    });
    const q =
      "temperature=212&pressures=1000,3000,1e300&extrapolate=true&method=newton";
    // 1e300 is not a decimal number: strict numbers (item 12) refuse it; a long decimal says the same thing.
    const big = `1${"0".repeat(300)}`;
    const query = q.replace("1e300", big);
    const json = await request.get(`/api/v1/samples/1/table?${query}`, {
      headers: bearer(token),
    });
    const text = await json.text();
    expect(json.status(), text.slice(0, 300)).toBe(200);
    expect(text).not.toMatch(/NaN|Infinity/);
    const table = JSON.parse(text) as {
      rows: { pressure: number }[];
      notes: { code: string; message: string }[];
    };
    expect(
      table.rows.every((r) => Number.isFinite(r.pressure) && r.pressure < 1e10),
    ).toBe(true);
    expect(
      table.notes.find((n) => n.code === "rows-not-computable")?.message,
    ).toMatch(/cannot be computed/);
    const csv = await (
      await request.get(`/api/v1/samples/1/table?${query}&format=csv`, {
        headers: bearer(token),
      })
    ).text();
    expect(csv).not.toMatch(/NaN|Infinity/);
    const plain = await (
      await request.get(`/api/v1/samples/1/table?${query}&format=text`, {
        headers: bearer(token),
      })
    ).text();
    expect(plain).not.toMatch(/NaN|Infinity/);
    expect(plain).toMatch(/cannot be computed/);
  });

  test("the lookup page shows the refused point instead of 'the server could not be reached'", async ({
    page,
  }) => {
    await signIn(page, "engineer");
    await page.goto("/lookup?sample=1");
    await page.getByRole("tab", { name: "Pasted list" }).click();
    await page
      .getByLabel(/one pair per line/)
      .fill(`3000\t212\n${"9".repeat(300)}\t212`);
    await page.getByRole("radio", { name: /Field/ }).check();
    await page.getByLabel(/Allow extrapolation/).check();
    await page.getByRole("button", { name: "Look up" }).click();
    await expect(page.getByText("The server could not be reached")).toHaveCount(
      0,
    );
    // the second point, refused in its cell with the server's message (points counted from 1)
    const refused = page
      .getByTestId("results-table")
      .locator("[data-refused]")
      .first();
    await expect(refused).toBeVisible();
    await expect(refused).toContainText("refused");
    await expect(refused).toContainText(/Point 2\b/);
  });
});

test.describe("item 6: no 500 for bad input; problems do not echo the input", () => {
  test("a table below absolute zero, in either unit system", async ({
    request,
  }) => {
    const { token } = await mintToken({
      userId: await userIdOf(ACCOUNTS.engineer),
    });
    const field = await expectProblem(
      await request.get(
        "/api/v1/samples/1/table?temperature=-500&pressures=1000,2000",
        { headers: bearer(token) },
      ),
      400,
      "invalid_query",
    );
    expect(field.detail).toMatch(/absolute zero/);
    await expectProblem(
      await request.get(
        "/api/v1/samples/1/table?temperature=-300&pressures=1000,2000&units=metric",
        { headers: bearer(token) },
      ),
      400,
      "invalid_query",
    );
  });

  test("a point value nested 10,000 deep, and a 100 kB key, in a JSON body", async ({
    request,
  }) => {
    const { token } = await mintToken({
      userId: await userIdOf(ACCOUNTS.engineer),
    });
    const deep = `{"property":"oil_fvf","points":[{"pressure":${"[".repeat(10_000)}${"]".repeat(10_000)},"temperature":212}]}`;
    const nested = await request.post("/api/v1/samples/1/lookup", {
      headers: { ...bearer(token), "Content-Type": "application/json" },
      data: deep,
    });
    await expectProblem(nested, 400, "invalid_body");
    expect((await nested.text()).length).toBeLessThan(2_000);
    const deeper = `{"property":"oil_fvf","points":[{"pressure":3000,"temperature":212}],"revision":${'{"a":'.repeat(10_000)}1${"}".repeat(10_000)}}`;
    await expectProblem(
      await request.post("/api/v1/samples/1/lookup", {
        headers: { ...bearer(token), "Content-Type": "application/json" },
        data: deeper,
      }),
      400,
      "invalid_body",
    );
    const key = "Zq".repeat(50_000);
    const long = await request.post("/api/v1/samples/1/lookup", {
      headers: bearer(token),
      data: { property: "oil_fvf", points: [{ ...POINT, [key]: 1 }], [key]: 2 },
    });
    await expectProblem(long, 400, "invalid_body");
    expect(echoes(await long.text(), "Zq")).toBe(false);
    const value = await request.post("/api/v1/samples/1/lookup", {
      headers: bearer(token),
      data: {
        property: "Zq".repeat(50_000),
        points: [{ pressure: "Zq".repeat(50_000), temperature: 212 }],
      },
    });
    await expectProblem(value, 400, "invalid_body");
    expect(echoes(await value.text(), "Zq")).toBe(false);
  });

  test("oversized and odd query values get 400 without echoing them", async ({
    request,
  }) => {
    const h = await bearerFor(ACCOUNTS.engineer);
    for (const path of [
      // Node refuses request heads over 16 kB itself (431), so these stay under that.
      `/api/v1/samples/1/table?temperature=212&pressures=${"Zq".repeat(3_000)}`,
      `/api/v1/samples/1/table?temperature=212&pressures=${"Zq".repeat(6_000)}`,
      `/api/v1/samples/1/table?temperature=${"9".repeat(5_000)}&pressures=1000`,
      `/api/v1/samples/1?units=${"Zq".repeat(3_000)}`,
      `/api/v1/samples/1?${"Zq".repeat(3_000)}=1`,
      `/api/v1/samples/1?revision=${"9".repeat(400)}`,
      `/api/v1/samples/${"9".repeat(400)}`,
      "/api/v1/samples/1/table?temperature=212&pressures=1000,%00",
      "/api/v1/samples/1/table?temperature=NaN&pressures=1000",
      "/api/v1/samples/1/table?temperature=Infinity&pressures=1000",
    ]) {
      const response = await request.get(path, { headers: h });
      expect(
        [400, 404],
        `${path.slice(0, 80)}: ${response.status()}`,
      ).toContain(response.status());
      expect(response.headers()["content-type"]).toContain(
        "application/problem+json",
      );
      const text = await response.text();
      expect(echoes(text, "Zq"), path.slice(0, 80)).toBe(false);
      expect(text.includes("9".repeat(201)), path.slice(0, 80)).toBe(false);
    }
  });
});

test.describe("item 12: strict API query strings", () => {
  test("unknown, repeated and non-decimal parameters are refused with 400 naming them", async ({
    request,
  }) => {
    const h = await bearerFor(ACCOUNTS.engineer);
    const unknown = await expectProblem(
      await request.get("/api/v1/samples/1?unit=metric", { headers: h }),
      400,
      "invalid_query",
    );
    expect(unknown.issues).toEqual([
      expect.objectContaining({ path: ["unit"] }),
    ]);
    expect(unknown.detail).toMatch(/unit/);
    await expectProblem(
      await request.get("/api/v1/samples?unit=metric", { headers: h }),
      400,
      "invalid_query",
    );
    await expectProblem(
      await request.get(`/api/v1/samples/1/table?${TABLE}&unit=metric`, {
        headers: h,
      }),
      400,
      "invalid_query",
    );
    await expectProblem(
      await request.post("/api/v1/samples/1/lookup?units=metric", {
        headers: h,
        data: { property: "oil_fvf", points: [POINT] },
      }),
      400,
      "invalid_query",
    );
    await expectProblem(
      await request.get("/api/v1/openapi.json?x=1"),
      400,
      "invalid_query",
    );

    const repeated = await expectProblem(
      await request.get("/api/v1/samples/1?units=field&units=metric", {
        headers: h,
      }),
      400,
      "invalid_query",
    );
    expect(repeated.issues).toEqual([
      expect.objectContaining({
        path: ["units"],
        message: expect.stringMatching(/more than once/),
      }),
    ]);

    for (const odd of ["0x1", "1e0", "+1", "1.0", " 1", "01"]) {
      const byQuery = await expectProblem(
        await request.get(
          `/api/v1/samples/1?revision=${encodeURIComponent(odd)}`,
          { headers: h },
        ),
        400,
        "invalid_query",
      );
      expect(byQuery.issues?.[0]?.path, odd).toEqual(["revision"]);
      const byPath = await expectProblem(
        await request.get(`/api/v1/samples/${encodeURIComponent(odd)}`, {
          headers: h,
        }),
        400,
        "invalid_path",
      );
      expect(byPath.issues?.[0]?.path, odd).toEqual(["sampleId"]);
      await expectProblem(
        await request.get(
          `/api/v1/samples/${encodeURIComponent(odd)}/table?${TABLE}`,
          { headers: h },
        ),
        400,
        "invalid_path",
      );
    }
    for (const odd of ["0x10", "1e2", "212abc", ""]) {
      const t = await expectProblem(
        await request.get(
          `/api/v1/samples/1/table?temperature=${odd}&pressures=1000,2000`,
          { headers: h },
        ),
        400,
        "invalid_query",
      );
      expect(t.issues?.[0]?.path, odd).toEqual(["temperature"]);
    }
    // Plain decimals still work, including negative and fractional temperatures.
    expect(
      (
        await request.get(
          "/api/v1/samples/1/table?temperature=212.0&pressures=1000,2000",
          { headers: h },
        )
      ).status(),
    ).toBe(200);
    expect(
      (
        await request.get(
          "/api/v1/samples/1/table?temperature=100&units=metric&pressures=100.5,200",
          { headers: h },
        )
      ).status(),
    ).toBe(200);
  });
});

test.describe("item 15: conditional GETs that work", () => {
  test("the table's ETag is the same for the same revision and query, and a conditional GET gets 304", async ({
    request,
  }) => {
    const h = await bearerFor(ACCOUNTS.engineer);
    for (const format of ["json", "csv", "text"]) {
      const first = await request.get(
        `/api/v1/samples/1/table?${TABLE}&format=${format}`,
        { headers: h },
      );
      const etag = first.headers()["etag"]!;
      const second = await request.get(
        `/api/v1/samples/1/table?${TABLE}&format=${format}`,
        { headers: h },
      );
      expect(second.headers()["etag"], format).toBe(etag);
      const conditional = await request.get(
        `/api/v1/samples/1/table?${TABLE}&format=${format}`,
        { headers: { ...h, "If-None-Match": etag } },
      );
      expect(conditional.status(), format).toBe(304);
      expect(await conditional.text()).toBe("");
    }
    // The same query written differently (parameter order, default spelled out) is the same table.
    const a = (
      await request.get(`/api/v1/samples/1/table?${TABLE}`, { headers: h })
    ).headers()["etag"];
    const b = (
      await request.get(
        "/api/v1/samples/1/table?pressures=1000:4000:500&units=field&temperature=212&format=json",
        { headers: h },
      )
    ).headers()["etag"];
    expect(b).toBe(a);
    // Anything that changes the answer changes the ETag.
    const etags = new Set<string | undefined>();
    for (const variant of [
      TABLE,
      `${TABLE}&format=csv`,
      `${TABLE}&format=text`,
      "temperature=100&pressures=70:275:35&units=metric",
      "temperature=212&pressures=1000:4000:250",
      `${TABLE}&method=linear`,
    ]) {
      etags.add(
        (
          await request.get(`/api/v1/samples/1/table?${variant}`, {
            headers: h,
          })
        ).headers()["etag"],
      );
    }
    expect(etags.size).toBe(6);
  });

  test("sample listing and detail answer 304 to their own ETag", async ({
    request,
  }) => {
    const h = await bearerFor(ACCOUNTS.engineer);
    for (const path of [
      "/api/v1/samples",
      "/api/v1/samples/1",
      "/api/v1/samples/1?units=metric&revision=1",
    ]) {
      const etag = (await request.get(path, { headers: h })).headers()["etag"]!;
      expect(
        (
          await request.get(path, { headers: { ...h, "If-None-Match": etag } })
        ).status(),
        path,
      ).toBe(304);
    }
  });
});
