import { expect, test } from "@playwright/test";

test("static assets are served pre-compressed (brotli, else gzip), cached as immutable", async ({
  page,
  request,
}) => {
  const scripts: string[] = [];
  page.on("request", (r) => {
    if (r.resourceType() === "script") scripts.push(new URL(r.url()).pathname);
  });
  await page.goto("/sign-in");
  const entry = scripts.find((s) => /^\/assets\/entry\.client-.*\.js$/.test(s));
  expect(entry, `scripts requested: ${scripts.join(", ")}`).toBeTruthy();

  const br = await request.get(entry!, {
    headers: { "Accept-Encoding": "br" },
  });
  expect(br.status()).toBe(200);
  expect(br.headers()["content-encoding"]).toBe("br");
  expect(br.headers()["cache-control"]).toContain("immutable");
  expect(br.headers()["vary"]).toContain("Accept-Encoding");

  const gz = await request.get(entry!, {
    headers: { "Accept-Encoding": "gzip" },
  });
  expect(gz.headers()["content-encoding"]).toBe("gzip");
  // Both decode to the same script.
  expect(await gz.text()).toBe(await br.text());
  expect((await br.text()).length).toBeGreaterThan(1000);
});
