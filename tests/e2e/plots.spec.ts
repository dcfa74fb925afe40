import { expect, test, type Page } from "@playwright/test";
import { APP_URL, signIn } from "../support/e2e";

/*
 * The compare page and the Plotly plots. The reference for the table's numbers is the lookup API itself
 * (POST /api/v1/samples/:id/lookup, method auto), whose engine is checked against SciPy in app/core/interpolation;
 * here we check that the page shows those values and computes their relative differences.
 *
 * WebGL pages hang under Playwright's trace screenshots on these machines (stack notes §11): traces are off here.
 */
test.use({ trace: "off" });

const PLOT_CHUNK = /plots\.client|plotly/i;

/** Console errors of a page (GPU "stall" messages are warnings, not errors, and are not collected). */
function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  return errors;
}

type LookupAnswer = { results: { value: number }[] };

test("compare: a viewer chooses two samples and conditions; the table shows both values and their relative difference, highlighted by the threshold", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const errors = collectErrors(page);
  await signIn(page, "viewer");
  await page.goto("/compare");
  await page.waitForLoadState("networkidle"); // interactive: choosing a sample reloads the data without a page load
  await expect(
    page.getByRole("heading", { level: 1, name: "Compare" }),
  ).toBeVisible();
  await expect(
    page.getByText("Choose two to four samples to compare."),
  ).toBeVisible();

  // the sample list is searchable; choosing a sample reloads the page's data
  const search = page.getByRole("searchbox", { name: "Find samples" });
  await search.fill("CS-1 BH");
  await expect(page.getByRole("checkbox")).toHaveCount(1);
  await page.getByRole("checkbox", { name: /CS-1 BH-01/ }).check();
  await expect(page).toHaveURL(/samples=1/);
  await search.fill("CS-2");
  await page.getByRole("checkbox", { name: /CS-2 BH-01/ }).check();
  await expect(page).toHaveURL(/samples=1&samples=3|samples=3&samples=1/);

  // conditions typed by the person (field units, the viewer's preference)
  const conditions = [
    { pressure: 3250, temperature: 212 },
    { pressure: 1500, temperature: 190 },
  ];
  await page
    .getByRole("textbox", { name: "Conditions" })
    .fill(conditions.map((c) => `${c.pressure}, ${c.temperature}`).join("\n"));
  const table = page.getByRole("table", { name: /Bo by sample/ });
  await expect(table.locator("tbody tr")).toHaveCount(2);
  await expect(table.getByTestId("compare-value")).toHaveCount(4, {
    timeout: 15_000,
  });
  await expect(table.getByTestId("compare-difference")).toHaveCount(2);
  await expect(page.getByTestId("estimate-caution").first()).toBeVisible();

  // the reference: the lookup API with the automatic method, for each sample
  const lookup = async (id: number) => {
    const response = await page.request.post(`/api/v1/samples/${id}/lookup`, {
      data: {
        property: "oil_fvf",
        points: conditions,
        method: "auto",
        units: "field",
      },
      headers: { Origin: APP_URL },
    });
    expect(response.status()).toBe(200);
    return ((await response.json()) as LookupAnswer).results.map(
      (r) => r.value,
    );
  };
  const [a, b] = [await lookup(1), await lookup(3)];
  const rows = table.locator("tbody tr");
  const differences: number[] = [];
  for (let k = 0; k < conditions.length; k++) {
    const cells = rows.nth(k).getByTestId("compare-value");
    const shownA = Number(
      (await cells.nth(0).locator("span").first().textContent())!.replace(
        /,/g,
        "",
      ),
    );
    const shownB = Number(
      (await cells.nth(1).locator("span").first().textContent())!.replace(
        /,/g,
        "",
      ),
    );
    // five significant digits on screen
    expect(Math.abs(shownA - a[k]!)).toBeLessThanOrEqual(
      5e-5 * Math.abs(a[k]!),
    );
    expect(Math.abs(shownB - b[k]!)).toBeLessThanOrEqual(
      5e-5 * Math.abs(b[k]!),
    );
    const expected = ((b[k]! - a[k]!) / Math.abs(a[k]!)) * 100;
    differences.push(expected);
    const text = (await rows
      .nth(k)
      .getByTestId("compare-difference")
      .textContent())!;
    const shown = Number(text.replace(/[^0-9.−-]/g, "").replace("−", "-"));
    expect(Math.abs(shown - expected)).toBeLessThanOrEqual(
      0.01 + 0.001 * Math.abs(expected),
    );
  }
  expect(differences.some((d) => d !== 0)).toBe(true);

  // the threshold decides which differences are highlighted
  const threshold = page.getByRole("spinbutton", {
    name: "Highlight differences beyond (%)",
  });
  const exceeding = table.locator(
    '[data-testid="compare-difference"][data-exceeds="true"]',
  );
  await threshold.fill("0");
  await expect(exceeding).toHaveCount(
    differences.filter((d) => Math.abs(d) > 0).length,
  );
  await threshold.fill("1000");
  await expect(exceeding).toHaveCount(0);
  const between = (Math.abs(differences[0]!) + Math.abs(differences[1]!)) / 2;
  if (Math.abs(Math.abs(differences[0]!) - Math.abs(differences[1]!)) > 0.02) {
    await threshold.fill(between.toFixed(3));
    await expect(exceeding).toHaveCount(1);
  }

  expect(errors).toEqual([]);
});

test("compare: the 3D surface renders (the plot area is not blank), side by side too, and the slices mark the bubble point; time to the first 3D canvas is printed", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const errors = collectErrors(page);
  const scripts: string[] = [];
  page.on("request", (r) => {
    if (r.resourceType() === "script") scripts.push(r.url());
  });
  await signIn(page, "engineer");

  // the server renders a visible loading state where the plots will be (Plotly is never rendered on the server)
  const html = await (
    await page.request.get("/compare?samples=1,2&property=oil_fvf")
  ).text();
  expect(html).toMatch(/role="status"[^>]*>.*Loading the 3D surface/s);
  expect(html).not.toMatch(PLOT_CHUNK);

  const started = Date.now();
  const documentResponse = await page.goto(
    "/compare?samples=1,2&property=oil_fvf",
  );
  // The plots draw under the production Content-Security-Policy: scripts by nonce only, no 'unsafe-inline' or
  // 'unsafe-eval' for scripts; a violation would be a console error, and `errors` must stay empty.
  const csp = documentResponse!.headers()["content-security-policy"] ?? "";
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{16,}'/);
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-(inline|eval)'/);
  // the numbers do not wait for Plotly
  await expect(
    page
      .getByRole("table", { name: /Bo by sample/ })
      .getByTestId("compare-value")
      .first(),
  ).toBeVisible({ timeout: 30_000 });
  const surface = page.locator(
    '[data-testid="property-surface"][data-state="drawn"]',
  );
  await expect(surface.locator("canvas").first()).toBeVisible({
    timeout: 90_000,
  });
  const seconds = (Date.now() - started) / 1000;
  console.log(
    `time from navigation to the first drawn 3D canvas on /compare: ${seconds.toFixed(1)} s`,
  );

  expect(scripts.some((u) => PLOT_CHUNK.test(u))).toBe(true); // the plot chunk is loaded here (positive control)

  // the plot area is not blank: measure the share of pixels that are not the white background
  await page.waitForTimeout(500);
  const png = await surface.screenshot();
  const stats = await page.evaluate(async (base64) => {
    const image = new Image();
    image.src = `data:image/png;base64,${base64}`;
    await image.decode();
    const canvas = document.createElement("canvas");
    canvas.width = image.width;
    canvas.height = image.height;
    const ctx = canvas.getContext("2d")!;
    ctx.drawImage(image, 0, 0);
    const { data } = ctx.getImageData(0, 0, image.width, image.height);
    let ink = 0;
    let strong = 0;
    const colours = new Set<number>();
    for (let i = 0; i < data.length; i += 4) {
      const r = data[i]!;
      const g = data[i + 1]!;
      const b = data[i + 2]!;
      if (Math.max(255 - r, 255 - g, 255 - b) > 24) ink++;
      if (Math.max(r, g, b) - Math.min(r, g, b) > 60) strong++;
      colours.add(((r >> 4) << 8) | ((g >> 4) << 4) | (b >> 4));
    }
    const total = data.length / 4;
    return { ink: ink / total, strong: strong / total, colours: colours.size };
  }, png.toString("base64"));
  console.log(
    `surface plot pixels: ${(stats.ink * 100).toFixed(1)} % not background, ${(stats.strong * 100).toFixed(1)} % strongly coloured, ${stats.colours} colours`,
  );
  expect(stats.ink).toBeGreaterThan(0.05);
  expect(stats.strong).toBeGreaterThan(0.02);
  expect(stats.colours).toBeGreaterThan(20);

  // both samples overlaid in one scene, with a legend; then side by side, one scene per sample
  await expect(surface.getByText("CS-1 SEP-02").first()).toBeVisible();
  const scenes = () =>
    page.evaluate(
      `Object.keys(document.querySelector('[data-testid="property-surface"] .js-plotly-plot')._fullLayout).filter((k) => /^scene\\d*$/.test(k)).length`,
    );
  expect(await scenes()).toBe(1);
  await page.getByText("Side by side", { exact: true }).click();
  await expect.poll(scenes, { timeout: 60_000 }).toBe(2);
  await expect(surface.getByText("CS-1 BH-01").first()).toBeVisible();

  // the 2D slices: curves, measured markers and the bubble point named in the legend
  const slices = page.locator(
    '[data-testid="property-slices"][data-state="drawn"]',
  );
  await expect(slices).toBeVisible({ timeout: 60_000 });
  await expect(
    slices.getByText(/^pb [\d,.]+ psia \(.+\)$/).first(),
  ).toBeVisible();
  await expect(slices.getByText("Pressure (psia)")).toBeVisible();

  expect(errors).toEqual([]);
});

test("the Plotly chunk is not requested on the sign-in, home and samples pages", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const scripts: string[] = [];
  page.on("request", (r) => {
    if (r.resourceType() === "script") scripts.push(r.url());
  });
  await page.goto("/sign-in");
  await expect(page.getByRole("button", { name: "Sign in" })).toBeVisible();
  await signIn(page, "engineer");
  await page.goto("/");
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  await page.goto("/samples");
  await expect(
    page.getByRole("heading", { level: 1, name: "Samples" }),
  ).toBeVisible();
  // and by client-side navigation between them
  await page
    .getByRole("navigation", { name: "Main" })
    .getByRole("link", { name: "Samples" })
    .click();
  await page.locator("a[href='/']").first().click();
  await expect(page).toHaveURL(/\/$/);
  await page.waitForLoadState("networkidle");
  expect(scripts.length).toBeGreaterThan(0);
  expect(scripts.filter((u) => PLOT_CHUNK.test(u))).toEqual([]);

  // positive control: the name really is the plot chunk's, which /compare does request
  const before = scripts.length;
  await page.goto("/compare?samples=1,2&property=oil_fvf");
  await expect
    .poll(() => scripts.slice(before).some((u) => PLOT_CHUNK.test(u)), {
      timeout: 30_000,
    })
    .toBe(true);
});
