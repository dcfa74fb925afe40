import { expect, test } from "@playwright/test";
import { signIn } from "../support/e2e";

/** A JSON answer, failing with its body when the status is not 200. */
async function ok200(response: import("@playwright/test").APIResponse) {
  const body = await response.text();
  expect(response.status(), body).toBe(200);
  return JSON.parse(body) as unknown;
}

/*
 * Gauge pressures and the bases of the numbers, through the pages and the API on the demo seed (invented data).
 * The seed's sample 1 records no barometric pressure of its own, so it has the default, 14.696 psia: 3235.304
 * psig is 3250 psia (psia = psig + barometric pressure).
 */
test("the lookup page reads gauge pressures with the sample's barometric pressure; the values are the absolute lookup's", async ({
  page,
}) => {
  await signIn(page, "engineer");
  const absolute = (await ok200(
    await page.request.post("/api/v1/samples/1/lookup", {
      headers: { Origin: new URL(page.url()).origin },
      data: {
        property: "oil_fvf",
        points: [{ pressure: 3250, temperature: 212 }],
      },
    }),
  )) as { results: { value: number }[]; units: Record<string, unknown> };
  expect(absolute.units).toMatchObject({
    pressure: "psia",
    pressureBasis: "absolute",
    barometricPressurePsia: 14.696,
    standardConditions: "60 °F, 14.696 psia",
  });

  await page.goto("/lookup?sample=1");
  await page.getByLabel("Pressures").selectOption("gauge");
  await page.getByLabel("Pressure (psig)").fill("3235.304");
  await page.getByLabel("Temperature (°F)").fill("212");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByTestId("results-table")).toContainText(
    "Pressure (psig)",
  );
  const shown = Number(
    await page.getByTestId("value-oil_fvf-0").getAttribute("data-value"),
  );
  const expected = absolute.results[0]!.value;
  expect(Math.abs(shown - expected)).toBeLessThanOrEqual(1e-9 * expected);
  // the explanation redoes the value on the grid, in absolute pressures
  await page.getByTestId("value-oil_fvf-0").click();
  await expect(
    page.getByText("Same as the server?").locator(".."),
  ).toContainText("yes");
});

test("the API takes and gives gauge pressures (lookups and tables) and names the bases", async ({
  page,
}) => {
  await signIn(page, "engineer");
  const gauge = (await ok200(
    await page.request.post("/api/v1/samples/1/lookup", {
      headers: { Origin: new URL(page.url()).origin },
      data: {
        property: "solution_gor",
        units: "metric",
        pressureBasis: "gauge",
        points: [{ pressure: 150, temperature: 100 }],
      },
    }),
  )) as {
    results: { value: number; bubblePointPressure: number }[];
    units: Record<string, unknown>;
  };
  expect(gauge.units).toMatchObject({
    pressure: "barg",
    pressureBasis: "gauge",
    standardConditions: "15 °C, 101.325 kPa",
  });
  // 150 barg = 150 + 14.696 / 14.503773773 bara (NIST SP 811: 1 bar = 14.503773773 psi)
  const absolute = (await ok200(
    await page.request.post("/api/v1/samples/1/lookup", {
      headers: { Origin: new URL(page.url()).origin },
      data: {
        property: "solution_gor",
        units: "metric",
        points: [{ pressure: 150 + 14.696 / 14.503773773, temperature: 100 }],
      },
    }),
  )) as { results: { value: number; bubblePointPressure: number }[] };
  expect(gauge.results[0]!.value).toBeCloseTo(absolute.results[0]!.value, 9);
  expect(gauge.results[0]!.bubblePointPressure).toBeCloseTo(
    absolute.results[0]!.bubblePointPressure - 14.696 / 14.503773773,
    6,
  );

  const text = await (
    await page.request.get(
      "/api/v1/samples/1/table?temperature=212&pressures=1000:3000:500&format=text&pressureBasis=gauge",
    )
  ).text();
  expect(text).toMatch(/^# standard conditions: 60 deg F, 14.696 psia$/m);
  expect(text).toMatch(
    /^# pressures: gauge \(psig\); absolute = gauge \+ 14.696 psia/m,
  );
  const csv = await (
    await page.request.get(
      "/api/v1/samples/1/table?temperature=212&pressures=1000:3000:500&format=csv",
    )
  ).text();
  expect(csv).toMatch(/^# standard conditions: 60 deg F, 14.696 psia\r$/m);
});

test("the sample page shows the barometric pressure the sample records", async ({
  page,
}) => {
  await signIn(page, "engineer");
  await page.goto("/samples/1");
  await expect(page.getByText("Barometric pressure (psia)")).toBeVisible();
  await expect(
    page.getByText("Barometric pressure (psia)").locator(".."),
  ).toContainText("14.696");
});
