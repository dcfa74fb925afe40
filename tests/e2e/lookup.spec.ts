import { expect, test } from "@playwright/test";
import { interpolateGrid, type Grid } from "../../app/core/interpolation";
import { signIn } from "../support/e2e";

/*
 * The lookup workspace. The outside reference for the numbers is the engine itself run on the grid the API
 * serves (the engine is checked against SciPy in app/core/interpolation); here we check that what the page
 * shows is that computation, with the right zone.
 */
test("an engineer looks up Bo, Rs and oil viscosity at 3250 psia and 212 °F; the values match the engine and the explanation shows the zone", async ({
  page,
  request,
}) => {
  await signIn(page, "engineer");
  await page.goto("/lookup?sample=1");
  await page.getByRole("button", { name: "Look up" }).click();
  const table = page.getByTestId("results-table");
  await expect(table).toBeVisible();
  await expect(page.getByTestId("results-meta")).toContainText("revision 1");

  // The same input through the engine, on the grid the API serves (field units).
  const detail = (await (
    await page.request.get("/api/v1/samples/1?units=field")
  ).json()) as { grids: (Grid & { property: string })[] };
  const bo = detail.grids.find((g) => g.property === "oil_fvf")!;
  const expected = interpolateGrid(
    bo,
    { pressure: 3250, temperature: 212 },
    { method: "newton", degree: 3 },
  );
  const shown = Number(
    await page.getByTestId("value-oil_fvf-0").getAttribute("data-value"),
  );
  expect(Math.abs(shown - expected.value)).toBeLessThanOrEqual(
    1e-12 * Math.abs(expected.value),
  );

  // How the number was obtained: a 4×4 zone around the point (the zone rule of the engine's contract).
  await page.getByTestId("value-oil_fvf-0").click();
  const grid = page.getByTestId("explanation-grid");
  await expect(grid).toBeVisible();
  const zone = grid.locator("td[data-zone=yes]");
  await expect(zone).toHaveCount(
    expected.stencil.pressure.length * expected.stencil.temperature.length,
  );
  const zonePressures = await grid
    .locator("tbody tr")
    .evaluateAll((rows) =>
      rows
        .filter((r) => r.querySelector("td[data-zone=yes]"))
        .map((r) => Number(r.querySelector("th")!.textContent)),
    );
  expect(zonePressures).toEqual(
    expected.stencil.pressure.map((i) => bo.pressures[i]),
  );
  await expect(
    page.getByText("Same as the server?").locator(".."),
  ).toContainText("yes");
  await expect(page.getByTestId("explanation-step").first()).toBeVisible();
  void request;
});

test("a depletion path of 50 pressures returns 50 rows, and a value past the measured range is refused unless extrapolation is allowed", async ({
  page,
}) => {
  await signIn(page, "engineer");
  await page.goto("/lookup?sample=1");
  await page.getByRole("tab", { name: "Depletion path" }).click();
  await page.getByLabel("From (psia)").fill("5300");
  await page.getByLabel("To (psia)").fill("400");
  await page.getByLabel("Step (psia)").fill("100");
  await page.getByLabel("At (°F)").fill("212");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(
    page.getByTestId("results-table").locator("tbody tr"),
  ).toHaveCount(50);

  await page.getByRole("tab", { name: "One point" }).click();
  await page.getByLabel("Pressure (psia)").fill("6000");
  await page.getByRole("button", { name: "Look up" }).click();
  // The point is refused in its cell, with the server's message (the request itself is answered).
  // The page may still be busy drawing the previous run's plots (Plotly evaluates for seconds on these machines).
  const refused = page.getByTestId("results-table").locator("[data-refused]");
  await expect(refused.first()).toContainText("outside the measured range", {
    timeout: 30_000,
  });
  await expect(refused.first()).toHaveAttribute(
    "data-refused",
    "outside-measured-range",
  );
  await page.getByLabel(/Allow extrapolation/).check();
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByTestId("results-table")).toContainText(
    "extrapolated",
    { timeout: 30_000 },
  );
});

test("an engineer saves a lookup set and runs it; a viewer sees the workspace but cannot save", async ({
  page,
  browser,
}) => {
  await signIn(page, "engineer");
  await page.goto("/lookup?sample=2");
  await page.getByRole("tab", { name: "Pasted list" }).click();
  await page
    .getByRole("textbox", { name: /one pair per line/ })
    .fill("pressure\ttemperature\n3000\t212\n2500\t212\n2000\t200");
  page.once("dialog", (d) => void d.accept("CS-1 SEP-02 test path"));
  await page.getByRole("button", { name: "Save as set" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Saved “CS-1 SEP-02 test path” (3 conditions)",
  );
  await page.reload();
  const item = page
    .getByRole("listitem")
    .filter({ hasText: "CS-1 SEP-02 test path" });
  await item.getByRole("link", { name: "Runs" }).click();
  await page.getByRole("button", { name: /Run against revision 1/ }).click();
  await expect(
    page.getByTestId("set-run-table").locator("tbody tr"),
  ).toHaveCount(3);
  await expect(page.getByText(/revision 1, method auto/)).toBeVisible();

  const viewerPage = await browser.newPage();
  await signIn(viewerPage, "viewer");
  await viewerPage.goto("/lookup?sample=1");
  await viewerPage.getByRole("button", { name: "Look up" }).click();
  await expect(viewerPage.getByTestId("results-table")).toBeVisible();
  await expect(
    viewerPage.getByRole("button", { name: "Save as set" }),
  ).toHaveCount(0);
  const crafted = await viewerPage.request.post("/lookup", {
    data: {
      intent: "save-set",
      name: "x",
      sampleId: 1,
      properties: ["oil_fvf"],
      units: "field",
      method: "auto",
      degree: null,
      conditions: [{ pressure: 3000, temperature: 212 }],
    },
    headers: { Origin: new URL(viewerPage.url()).origin },
  });
  expect(crafted.status()).toBe(403);
});
