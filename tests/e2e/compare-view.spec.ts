import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { expect, test, type Page } from "@playwright/test";
import { signIn } from "../support/e2e";

/*
 * The compare page compares: side-by-side panels share their axis ranges, a sample measured at one temperature
 * is drawn as a line (not a degenerate surface), bubble points are named in the legend, and the conditions box
 * follows the chosen samples until the person types. A lab lead first stores a one-temperature sample: the
 * 210 °F rows of reference-data/examples/lab-results-long.csv (invented data). The sample is new for each run,
 * so the seeded samples other specs read are left alone. Screenshots go to test-results/compare-view/.
 *
 * WebGL pages hang under Playwright's trace screenshots on these machines: traces are off here (as plots.spec).
 */
test.use({ trace: "off", viewport: { width: 1280, height: 900 } });
test.describe.configure({ mode: "serial" });

const EXAMPLE = fileURLToPath(
  new URL(
    "../../reference-data/examples/lab-results-long.csv",
    import.meta.url,
  ),
);
const RUN = Date.now().toString(36);
const LABEL = `One-T ${RUN}`;
let sampleId = 0;

/** The example file with only its 210 °F rows (and its comment and header lines). */
function oneTemperatureFile(): Buffer {
  const lines = readFileSync(EXAMPLE, "utf8")
    .split(/\r?\n/)
    .filter(
      (l) => l.startsWith("#") || /^[a-z]/i.test(l) || /^\d+,210,/.test(l),
    );
  return Buffer.from(lines.join("\r\n"), "utf8");
}

/** Plotly's own view of a drawn plot (its data and full layout), read from the page. */
async function plotState(page: Page, testId: string) {
  return page.evaluate((id) => {
    const el = document.querySelector(
      `[data-testid="${id}"] .js-plotly-plot`,
    ) as unknown as {
      data: { type: string; mode?: string; name?: string; y?: number[] }[];
      _fullLayout: Record<
        string,
        {
          xaxis?: { range: number[] };
          yaxis?: { range: number[] };
          zaxis?: { range: number[] };
        }
      >;
    };
    const scenes = Object.keys(el._fullLayout)
      .filter((k) => /^scene\d*$/.test(k))
      .sort()
      .map((k) => {
        const s = el._fullLayout[k]!;
        return [s.xaxis!.range, s.yaxis!.range, s.zaxis!.range];
      });
    return {
      traces: el.data.map((d) => ({
        type: d.type,
        mode: d.mode ?? "",
        name: d.name ?? "",
        ys: [...new Set(d.y ?? [])],
      })),
      scenes,
    };
  }, testId);
}

test("a lab lead stores a sample measured at one temperature", async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signIn(page, "lab_lead");
  await page.goto("/samples/new");
  await page.getByLabel("Field", { exact: true }).fill("Calder Shelf (demo)");
  await page.getByLabel("Well", { exact: true }).fill("CS-1");
  await page.getByLabel("Sample label").fill(LABEL);
  await page.getByLabel("Sample type").selectOption("bottomhole");
  await page.getByLabel("Sampling date").fill("2025-11-03");
  await page.getByLabel("Reservoir pressure at sampling (psia)").fill("4400");
  await page.getByLabel("Reservoir temperature at sampling (°F)").fill("210");
  await page.getByLabel("Stock-tank oil gravity (°API)").fill("38");
  await page.getByLabel("Gas specific gravity (air = 1)").fill("0.8");
  await page.getByLabel("Laboratory").fill("Invented Laboratory");
  await page.getByRole("button", { name: "Create sample" }).click();
  await expect(
    page.getByRole("heading", { level: 1, name: LABEL }),
  ).toBeVisible();
  sampleId = Number(/\/samples\/(\d+)/.exec(page.url())![1]);

  await page.goto(`/samples/${sampleId}/upload`);
  await page.getByLabel(/Results file/).setInputFiles({
    name: "one-temperature.csv",
    mimeType: "text/csv",
    buffer: oneTemperatureFile(),
  });
  await page.getByRole("button", { name: "Check file" }).click();
  await expect(
    page.getByTestId("preview").getByText(/at 1 temperature and 12 pressures/),
  ).toBeVisible();
  await page
    .getByLabel("Comment")
    .fill("Invented report, the 210 °F column only.");
  await page.getByRole("button", { name: /Store as draft revision 1/ }).click();
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 1",
  );
  const acknowledge = page.getByLabel(/I have read the \d+ warning/);
  if (await acknowledge.count()) await acknowledge.check();
  await page.getByRole("button", { name: "Approve revision 1" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Revision 1 is approved",
  );
});

test("compare: shared ranges side by side, the one-temperature sample as a line, bubble points in the legend, conditions that follow the samples", async ({
  page,
}) => {
  test.setTimeout(180_000);
  expect(sampleId).toBeGreaterThan(0);
  await signIn(page, "viewer");
  // CS-1 BH-01 (4650 psia, 212 °F at the reservoir, invented)
  await page.goto("/compare?samples=1");
  await page.waitForLoadState("networkidle");
  const box = page.getByRole("textbox", { name: "Conditions" });
  await expect(box).toHaveValue("4650, 212");

  // choosing another sample: the box follows (its reservoir conditions are added) while nothing was typed
  await page.getByRole("checkbox", { name: new RegExp(LABEL) }).check();
  await expect(page).toHaveURL(new RegExp(`samples=${sampleId}`));
  await expect(box).toHaveValue("4650, 212\n4400, 210");

  await page.getByText("Side by side", { exact: true }).click();
  const surface = page.locator(
    '[data-testid="property-surface"][data-state="drawn"]',
  );
  await expect(surface).toBeVisible({ timeout: 90_000 });
  await expect
    .poll(
      async () => (await plotState(page, "property-surface")).scenes.length,
      {
        timeout: 60_000,
      },
    )
    .toBe(2);
  const { traces, scenes } = await plotState(page, "property-surface");
  // both panels show the same pressure, temperature and value ranges
  expect(scenes[1]).toEqual(scenes[0]);
  const [x, y, z] = scenes[0]!;
  // the union of the two samples' measured ranges: 15–5500 psia (this sample), 150–240 °F (CS-1 BH-01)
  expect(x![0]).toBeLessThanOrEqual(15);
  expect(x![1]).toBeGreaterThanOrEqual(5500);
  expect(y![0]).toBeLessThanOrEqual(150);
  expect(y![1]).toBeGreaterThanOrEqual(240);
  // Bo of both lies between about 1.05 and 1.45 rb/STB: the value axis does not start at 0
  expect(z![0]).toBeGreaterThan(0.9);
  // the one-temperature sample is a line at 210 °F, not a surface
  expect(traces.filter((t) => t.type === "surface").map((t) => t.name)).toEqual(
    ["CS-1 BH-01"],
  );
  const line = traces.find((t) => t.type === "scatter3d" && t.mode === "lines");
  expect(line?.name).toContain(`${LABEL} (measured at 210 °F only)`);
  expect(line?.ys).toEqual([210]);
  await surface.screenshot({
    path: "test-results/compare-view/surface-side-by-side.png",
  });

  const slices = page.locator(
    '[data-testid="property-slices"][data-state="drawn"]',
  );
  await expect(slices).toBeVisible({ timeout: 90_000 });
  await expect(
    slices.getByText(/^pb 2,650 psia \(CS-1 BH-01 · 212 °F\)$/),
  ).toBeVisible();
  await expect(
    slices.getByText(new RegExp(`^${LABEL} · 210 °F$`)),
  ).toBeVisible();
  await slices.screenshot({ path: "test-results/compare-view/slices.png" });

  // once the person types, the box is theirs: a change of samples leaves it alone
  await box.fill("3000, 200");
  await page.getByRole("checkbox", { name: /CS-2 BH-01/ }).check();
  await expect(page).toHaveURL(/samples=3/);
  await expect(box).toHaveValue("3000, 200");
});
