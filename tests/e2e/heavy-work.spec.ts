import { expect, test } from "@playwright/test";
import { ACCOUNTS } from "../support/e2e";
import { closeE2eDb, mintToken, userIdOf } from "../support/e2e-db";

/*
 * In the production build a large lookup runs in a worker thread (build/server/heavy-worker.js, found beside
 * the server bundle) and a small one inline; Server-Timing (W3C Server Timing) says which, and both give the
 * same numbers for the same conditions.
 */
test.afterAll(closeE2eDb);

test("a 20,000-point lookup runs in a worker thread, a 1,000-point one inline, with the same results", async ({
  request,
}) => {
  const { token } = await mintToken({
    userId: await userIdOf(ACCOUNTS.engineer),
  });
  const headers = { Authorization: `Bearer ${token}` };
  // Conditions inside sample 1's measured range (400–5400 psia, 150–240 °F of the invented demo scenario).
  const points = Array.from({ length: 20_000 }, (_, i) => ({
    pressure: 400 + ((i * 7919) % 5000),
    temperature: 150 + ((i * 104729) % 90),
  }));

  const large = await request.post("/api/v1/samples/1/lookup", {
    headers,
    data: { property: "oil_fvf", points },
  });
  expect(large.status()).toBe(200);
  expect(large.headers()["server-timing"]).toMatch(
    /compute;dur=[\d.]+;desc="worker thread \d+"/,
  );
  const largeBody = (await large.json()) as { results: unknown[] };
  expect(largeBody.results).toHaveLength(20_000);

  const small = await request.post("/api/v1/samples/1/lookup", {
    headers,
    data: { property: "oil_fvf", points: points.slice(0, 1_000) },
  });
  expect(small.status()).toBe(200);
  expect(small.headers()["server-timing"]).toMatch(
    /compute;dur=[\d.]+;desc="inline"/,
  );
  expect(((await small.json()) as { results: unknown[] }).results).toEqual(
    largeBody.results.slice(0, 1_000),
  );
});
