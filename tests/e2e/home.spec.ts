import { expect, test } from "@playwright/test";
import { signIn } from "../support/e2e";

test("home page shows the product, the navigation, the caution and the bundled font, with no request leaving 127.0.0.1", async ({
  page,
}) => {
  const hosts = new Set<string>();
  const fontFiles: string[] = [];
  page.on("request", (request) => {
    const url = new URL(request.url());
    hosts.add(url.hostname);
    if (/noto-sans.*\.woff2$/.test(url.pathname)) fontFiles.push(url.pathname);
  });

  await signIn(page, "engineer");
  await page.goto("/");
  await expect(
    page.getByRole("heading", { level: 1, name: "Isopleth" }),
  ).toBeVisible();
  const nav = page.getByRole("navigation", { name: "Main" });
  for (const label of ["Samples", "Lookup", "Compare", "API tokens"]) {
    await expect(nav.getByRole("link", { name: label })).toBeVisible();
  }
  await expect(page.getByTestId("estimate-caution")).toContainText("estimates");
  await expect(page.getByTestId("estimate-caution")).toContainText(
    "licensed engineering practice",
  );

  // The font is served from our own build, not fetched from a font service.
  await page.evaluate(() => document.fonts.ready);
  const loaded = await page.evaluate(
    () =>
      [...document.fonts].filter(
        (f) =>
          f.family.replace(/"/g, "") === "Noto Sans" && f.status === "loaded",
      ).length,
  );
  expect(loaded).toBeGreaterThan(0);
  expect(fontFiles.length).toBeGreaterThan(0);
  const family = await page.evaluate(
    () => getComputedStyle(document.body).fontFamily,
  );
  expect(family).toContain("Noto Sans");

  // Client-side navigation to every section works.
  await nav.getByRole("link", { name: "Samples" }).click();
  await expect(
    page.getByRole("heading", { level: 1, name: "Samples" }),
  ).toBeVisible();
  await expect(
    page
      .getByRole("link", { name: "CS-1 BH-01" })
      .or(page.getByRole("cell", { name: "CS-1 BH-01" }))
      .first(),
  ).toBeVisible();
  await nav.getByRole("link", { name: "Lookup" }).click();
  await expect(
    page.getByRole("heading", { level: 1, name: "Lookup" }),
  ).toBeVisible();

  expect([...hosts]).toEqual(["127.0.0.1"]);
});

test("health route reports the database as up", async ({ request }) => {
  const response = await request.get("/api/health");
  expect(response.status()).toBe(200);
  expect(await response.json()).toEqual({ status: "ok", database: "up" });
});

test("a viewer's navigation leaves out what the role cannot use", async ({
  page,
}) => {
  await signIn(page, "viewer");
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "Compare" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "API tokens" })).toHaveCount(0);
  await expect(
    page.getByRole("navigation", { name: "Administration" }),
  ).toHaveCount(0);
});
