import { expect, test, type Page } from "@playwright/test";
import { APP_URL, signIn } from "../support/e2e";

/*
 * The lookup page's choices live in its address and change the account only when asked ("Make … my default");
 * loading a saved set keeps the page's units; pasted conditions take comma pairs and refuse ambiguous thousands
 * separators. Signed in as the lab lead, whose unit preference (field) is put back at the end.
 */

const radio = (page: Page, name: RegExp) => page.getByRole("radio", { name });

test("choosing metric, a method and extrapolation changes the address, not the account; the default changes only when asked", async ({
  page,
  browser,
}) => {
  await signIn(page, "lab_lead");
  await page.goto("/lookup?sample=1");
  await page.waitForLoadState("networkidle");
  await expect(radio(page, /^Field/)).toBeChecked();
  await expect(page.getByText("Your default units.")).toBeVisible();

  await radio(page, /^Metric/).check();
  await expect(page).toHaveURL(/units=metric/);
  await expect(page.getByLabel("Pressure (bara)")).toHaveValue("224");
  await page.getByLabel("Method").selectOption("newton");
  await expect(page).toHaveURL(/method=newton/);
  await page.getByLabel("Degree in p").fill("2");
  await expect(page).toHaveURL(/degree=2%2C3/);
  await page.getByLabel(/Allow extrapolation/).check();
  await expect(page).toHaveURL(/extrapolate=1/);
  await page.getByLabel(/oil density/).check();
  await expect(page).toHaveURL(/property=oil_density/);

  // a reload (or a shared link) shows the same choices
  await page.reload();
  await expect(radio(page, /^Metric/)).toBeChecked();
  await expect(page.getByLabel("Method")).toHaveValue("newton");
  await expect(page.getByLabel("Degree in p")).toHaveValue("2");
  await expect(page.getByLabel(/Allow extrapolation/)).toBeChecked();
  await expect(page.getByLabel(/oil density/)).toBeChecked();
  await expect(page.getByText("Your default is field.")).toBeVisible();

  // the account was not changed: a page without choices in its address starts from field units
  const other = await browser.newPage();
  await signIn(other, "lab_lead");
  await other.goto("/lookup");
  await expect(radio(other, /^Field/)).toBeChecked();
  await expect(other.getByLabel("Method")).toHaveValue("auto");
  // the reservoir conditions of the sample picker are in the page's units too
  await expect(
    page.getByText(/\d+(\.\d+)? bara, \d+(\.\d+)? °C/),
  ).toBeVisible();

  // "Make metric my default": now the account's default
  await page.getByRole("button", { name: "Make metric my default" }).click();
  await expect(page.getByText("Your default units.")).toBeVisible();
  await other.goto("/lookup");
  await expect(radio(other, /^Metric/)).toBeChecked();

  // put the lab lead's preference back
  await radio(other, /^Field/).check();
  await other.getByRole("button", { name: "Make field my default" }).click();
  await expect(other.getByText("Your default units.")).toBeVisible();
  await other.goto("/lookup");
  await expect(radio(other, /^Field/)).toBeChecked();
  await other.close();
});

test("loading a saved set keeps the page's units and writes the set's conditions in them", async ({
  page,
}) => {
  await signIn(page, "lab_lead");
  const name = `units kept ${Date.now()}`;
  const saved = await page.request.post("/lookup?index", {
    data: {
      intent: "save-set",
      name,
      sampleId: 1,
      properties: ["oil_fvf"],
      units: "field",
      method: "auto",
      degree: null,
      conditions: [{ pressure: 3250, temperature: 212 }],
    },
    headers: { Origin: APP_URL },
  });
  expect(saved.status()).toBe(200);
  await page.goto("/lookup?sample=2&units=metric");
  await page.waitForLoadState("networkidle");
  const item = page.getByRole("listitem").filter({ hasText: name });
  await item.getByRole("button", { name: "Load" }).click();
  await expect(page).toHaveURL(/sample=1/);
  await expect(radio(page, /^Metric/)).toBeChecked();
  // 3250 psia = 224.0796 bara (NIST SP 811: 1 psi = 6.894757 kPa), 212 °F = 100 °C
  const list = page.getByRole("textbox", { name: /one pair per line/ });
  await expect(list).toHaveValue(/^224\.079\d*\t100$/);
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByTestId("results-table")).toBeVisible();

  await item.getByRole("button", { name: `Delete ${name}` }).click();
  await expect(item).toHaveCount(0);
});

test("pasted conditions: comma pairs are read, an ambiguous thousands separator is refused with its line", async ({
  page,
}) => {
  await signIn(page, "viewer");
  await page.goto("/lookup?sample=1&units=field");
  await page.waitForLoadState("networkidle");
  await page.getByRole("tab", { name: "Pasted list" }).click();
  const list = page.getByRole("textbox", { name: /one pair per line/ });
  await list.fill("3250,212\n3000, 200");
  await page.getByRole("button", { name: "Look up" }).click();
  const table = page.getByTestId("results-table");
  await expect(table.locator("tbody tr")).toHaveCount(2);
  await expect(table.locator("tbody tr").first()).toContainText("3250");

  await list.fill("3000\t200\n3,250\t212");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByRole("alert")).toContainText(
    "Line 2 (“3,250\t212”): “3,250” could be 3250 (a thousands separator) or 3.250 (a decimal comma).",
  );
  await list.fill("3,250,212");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByRole("alert")).toContainText(
    "Line 1 (“3,250,212”): its commas could separate the two numbers or group thousands.",
  );
});
