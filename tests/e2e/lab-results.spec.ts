import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { expect, test, type Page } from "@playwright/test";
import {
  ACCOUNTS,
  apiContextFor,
  APP_URL,
  signIn,
  waitForMailLink,
} from "../support/e2e";

/*
 * Lab results end to end: a lab lead creates a sample, uploads example files from reference-data/examples
 * (invented data), sees the preview with its QC findings and flagged cells, confirms, reviews; a follower is
 * e-mailed with a link to the diff; viewers and engineers cannot upload, even with a crafted request; bad and
 * oversized files are refused and nothing is stored. The sample is new for each run, so the seeded samples that
 * other specs read are left alone.
 */

test.describe.configure({ mode: "serial" });

const EXAMPLES = fileURLToPath(
  new URL("../../reference-data/examples/", import.meta.url),
);
const RUN = Date.now().toString(36);
const FIELD = `Invented E2E Field ${RUN}`;
const LABEL = `E2E BH-${RUN}`;
let samplePath = "";

/** Fails the test on any error in the page (hydration mismatches included). */
function watchErrors(page: Page) {
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  page.on("console", (m) => {
    if (m.type() === "error" && !/Failed to load resource/.test(m.text()))
      errors.push(m.text());
  });
  return () => expect(errors, "errors in the page").toEqual([]);
}

async function revisionCount(page: Page): Promise<number> {
  await page.goto(samplePath);
  return page
    .getByRole("table", { name: /Revisions of/ })
    .locator("tbody tr")
    .filter({ has: page.getByRole("link", { name: /Open revision/ }) })
    .count();
}

/** The long example with one value changed, one row removed and one row added (still invented data). */
function correctedExample(): Buffer {
  const lines = readFileSync(`${EXAMPLES}lab-results-long.csv`, "utf8").split(
    /\r?\n/,
  );
  const out: string[] = [];
  for (const line of lines) {
    if (line.startsWith("300,210,")) continue; // removed: every property at 300 psia, 210 °F
    if (line.startsWith("1500,170,"))
      out.push("1250,170,,1.201,327,0.748,46.34,2.161,0.0147,0.857"); // added
    out.push(
      line.startsWith("3500,170,,1.421,")
        ? line.replace("3500,170,,1.421,", "3500,170,,1.423,")
        : line,
    ); // changed Bo
  }
  return Buffer.from(out.join("\r\n"), "utf8");
}

test("a lab lead creates the field, the well and the sample", async ({
  page,
}) => {
  const check = watchErrors(page);
  await signIn(page, "lab_lead");
  await page.goto("/samples");
  await page.getByRole("link", { name: "New sample" }).click();
  // The form is checked before it is sent, with the messages tied to their fields.
  await page.getByRole("button", { name: "Create sample" }).click();
  await expect(page.getByLabel("Field", { exact: true })).toHaveAttribute(
    "aria-invalid",
    "true",
  );
  await expect(page.getByText("Enter the field name.")).toBeVisible();

  await page.getByLabel("Field", { exact: true }).fill(FIELD);
  await page.getByLabel("Region (for a new field)").fill("Invented basin");
  await page.getByLabel("Well", { exact: true }).fill("E2E-1");
  await page.getByLabel("Sample label").fill(LABEL);
  await page.getByLabel("Sample type").selectOption("bottomhole");
  await page.getByLabel("Sampling date").fill("2025-11-03");
  await page.getByLabel("Reservoir pressure at sampling (psia)").fill("4400");
  await page.getByLabel("Reservoir temperature at sampling (°F)").fill("210");
  await page.getByLabel("Stock-tank oil gravity (°API)").fill("30");
  await page.getByLabel("Gas specific gravity (air = 1)").fill("0.65");
  await page.getByLabel("Laboratory").fill("Invented Laboratory");
  await page.getByRole("button", { name: "Create sample" }).click();
  await expect(
    page.getByRole("heading", { level: 1, name: LABEL }),
  ).toBeVisible();
  await expect(page.getByRole("status")).toContainText("The sample is created");
  samplePath = new URL(page.url()).pathname;
  await expect(page.getByText("No approved tables yet.")).toBeVisible();

  // The list finds it by search.
  await page.goto(`/samples?q=${encodeURIComponent(RUN)}`);
  await expect(page.getByText("Samples 1–1 of 1")).toBeVisible();
  await expect(page.getByRole("link", { name: LABEL })).toBeVisible();
  check();
});

test("an engineer follows the sample", async ({ page }) => {
  await signIn(page, "engineer");
  await page.goto(samplePath);
  await expect(page.getByRole("link", { name: "Upload results" })).toHaveCount(
    0,
  );
  await page.getByRole("button", { name: "Follow" }).click();
  await expect(page.getByRole("status")).toContainText(
    "You follow this sample",
  );
  await expect(page.getByRole("button", { name: "Unfollow" })).toBeVisible();
});

test("a file with a QC error: the preview flags it, the draft cannot be approved, and is rejected", async ({
  page,
}) => {
  const check = watchErrors(page);
  await signIn(page, "lab_lead");
  await page.goto(samplePath);
  await page.getByRole("link", { name: "Upload results" }).click();
  await expect(
    page.getByRole("heading", { name: `Upload results for ${LABEL}` }),
  ).toBeVisible();
  await page
    .getByLabel(/Results file/)
    .setInputFiles(`${EXAMPLES}lab-results-with-qc-findings.csv`);
  await page.getByRole("button", { name: "Check file" }).click();

  const preview = page.getByTestId("preview");
  await expect(
    preview.getByRole("heading", {
      name: "Preview of lab-results-with-qc-findings.csv",
    }),
  ).toBeVisible();
  await expect(preview.getByText("1 error")).toBeVisible();
  const findings = preview.getByTestId("findings");
  await expect(findings.locator("li[data-severity=error]")).toContainText(
    "Bo falls from 1.245 rb/STB to 1.232 rb/STB",
  );
  await expect(
    findings.locator("li[data-severity=warning]").first(),
  ).toBeVisible();
  // The cells concerned are highlighted in the grid table.
  const bo = preview.getByTestId("grid-oil_fvf");
  await expect(bo.locator("td[data-flag=error]")).toHaveCount(2);
  await expect(bo.locator("td[data-flag=error]").first()).toContainText(
    "1.245",
  );
  await expect(
    preview.getByRole("img", {
      name: /Oil formation volume factor against pressure/,
    }),
  ).toBeVisible();

  // Confirming needs a comment; the file input kept its file, and the server checks it again.
  await page.getByRole("button", { name: /Store as draft revision 1/ }).click();
  await expect(page.getByText("Say what this upload is")).toBeVisible();
  await page.getByLabel("Comment").fill("Invented report INV-1, first issue.");
  await page.getByRole("button", { name: /Store as draft revision 1/ }).click();
  await expect(page).toHaveURL(
    new RegExp(`${samplePath}/revisions/1\\?stored=1$`),
  );
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 1",
  );
  await expect(page.getByText("Approval is blocked")).toBeVisible();
  await expect(
    page.getByRole("button", { name: "Approve revision 1" }),
  ).toBeDisabled();

  // The server refuses a crafted approval too.
  const lab = await apiContextFor("lab_lead");
  const crafted = await lab.post(`${samplePath}/revisions/1`, {
    form: { intent: "approve", acknowledge: "yes" },
    maxRedirects: 0,
  });
  expect(crafted.status()).toBe(400);
  await lab.dispose();

  await page.getByRole("button", { name: "Reject" }).click();
  await expect(
    page.getByText("Say why the revision is rejected"),
  ).toBeVisible();
  await page
    .getByLabel("Review comment")
    .fill(
      "Bo at 2000 psia and 210 °F is transposed; the laboratory will reissue.",
    );
  await page.getByRole("button", { name: "Reject" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Revision 1 is rejected",
  );
  await expect(
    page.getByText("Rejected", { exact: true }).first(),
  ).toBeVisible();
  check();
});

test("the example file: preview, confirm, approve with the warning acknowledged; the follower is e-mailed", async ({
  page,
}) => {
  const check = watchErrors(page);
  await signIn(page, "lab_lead");
  await page.goto(`${samplePath}/upload`);
  await page
    .getByLabel(/Results file/)
    .setInputFiles(`${EXAMPLES}lab-results-long.csv`);
  await page.getByRole("button", { name: "Check file" }).click();
  const preview = page.getByTestId("preview");
  await expect(
    preview.getByText("7 properties at 2 temperatures and 12 pressures"),
  ).toBeVisible();
  // The sample's gravities (30 °API, 0.65) differ from the fluid the file was made for: the correlation check warns.
  await expect(
    preview.getByTestId("findings").locator("li[data-severity=warning]"),
  ).toContainText("gas viscosity departs");
  await expect(preview.getByTestId("grid-gas_fvf")).toContainText(
    "reported by the laboratory in rb/Mscf",
  );
  await page.getByLabel("Comment").fill("Invented report INV-1, reissued.");
  await page.getByRole("button", { name: /Store as draft revision 2/ }).click();
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 2",
  );

  // Warnings must be acknowledged.
  await page.getByRole("button", { name: "Approve revision 2" }).click();
  await expect(
    page
      .getByText("Tick the box to confirm you have read the warnings.")
      .first(),
  ).toBeVisible();
  await page.getByLabel(/I have read the 1 warning/).check();
  await page.getByRole("button", { name: "Approve revision 2" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Revision 2 is approved",
  );
  await expect(
    page.getByText("Reviewed by the person who uploaded it."),
  ).toBeVisible();

  await page.goto(samplePath);
  await expect(page.getByText(/From\s+revision 2/)).toBeVisible();
  await expect(page.getByTestId("grid-oil_fvf")).toContainText("1.442");
  await expect(
    page.getByText("reviewed by the uploader").first(),
  ).toBeVisible();

  const link = await waitForMailLink(
    ACCOUNTS.engineer,
    new RegExp(`New approved tables for ${LABEL}: revision 2`),
  );
  expect(link).toBe(`${APP_URL}${samplePath}/revisions/2`);
  check();
});

test("a corrected file: the follower's e-mail links to the diff, which lists changed, added and removed cells", async ({
  page,
  browser,
}) => {
  await signIn(page, "lab_lead");
  await page.goto(`${samplePath}/upload`);
  await page.getByLabel(/Results file/).setInputFiles({
    name: "lab-results-long-corrected.csv",
    mimeType: "text/csv",
    buffer: correctedExample(),
  });
  await page.getByRole("button", { name: "Check file" }).click();
  await expect(page.getByTestId("preview")).toBeVisible();
  await page
    .getByLabel("Comment")
    .fill(
      "Invented report INV-1, revision B: Bo at 3500 psia corrected, 1250 psia added.",
    );
  await page.getByRole("button", { name: /Store as draft revision 3/ }).click();
  await page.getByLabel(/I have read the/).check();
  await page.getByRole("button", { name: "Approve revision 3" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Revision 3 is approved",
  );

  const link = await waitForMailLink(
    ACCOUNTS.engineer,
    new RegExp(`New approved tables for ${LABEL}: revision 3`),
  );
  expect(link).toBe(`${APP_URL}${samplePath}/diff?from=2&to=3`);
  const engineer = await browser.newPage();
  await signIn(engineer, "engineer");
  await engineer.goto(link);
  await expect(
    engineer.getByRole("heading", {
      name: "Changes from revision 2 to revision 3",
    }),
  ).toBeVisible();
  const changed = engineer.getByTestId("diff-changed");
  await expect(changed.locator("tbody tr")).toHaveCount(1);
  await expect(changed).toContainText("1.421");
  await expect(changed).toContainText("1.423");
  await expect(
    engineer.getByTestId("diff-added").locator("tbody tr"),
  ).toHaveCount(7);
  await expect(
    engineer.getByTestId("diff-removed").locator("tbody tr"),
  ).toHaveCount(7);

  // Revision 2 is superseded, and still readable.
  await engineer.goto(`${samplePath}/revisions/2`);
  await expect(engineer.getByText("Superseded").first()).toBeVisible();
  await engineer.close();
});

test("a refused file names file, row, column and value; nothing is stored, and cancelling a preview stores nothing", async ({
  page,
}) => {
  await signIn(page, "lab_lead");
  const before = await revisionCount(page);
  await page.goto(`${samplePath}/upload`);
  await page
    .getByLabel(/Results file/)
    .setInputFiles(`${EXAMPLES}refused-ambiguous-unit.csv`);
  await page.getByRole("button", { name: "Check file" }).click();
  const refused = page.getByTestId("refused");
  await expect(
    refused.getByRole("heading", {
      name: "refused-ambiguous-unit.csv cannot be used",
    }),
  ).toBeVisible();
  await expect(refused).toContainText(
    'In refused-ambiguous-unit.csv, row 3, column A, the unit in the header "pressure (psi)" is ambiguous',
  );
  await expect(refused).toContainText(
    'row 7, column D, the value "n/a" is not a number',
  );
  await expect(refused).toContainText("Nothing was stored.");
  await expect(
    page.getByRole("button", { name: /Store as draft/ }),
  ).toHaveCount(0);

  await page
    .getByLabel(/Results file/)
    .setInputFiles(`${EXAMPLES}lab-results-long.csv`);
  await page.getByRole("button", { name: "Check file" }).click();
  await expect(page.getByTestId("preview")).toBeVisible();
  await page.getByRole("link", { name: "Cancel (nothing is stored)" }).click();
  await expect(page).toHaveURL(new RegExp(`${samplePath}$`));
  expect(await revisionCount(page)).toBe(before);
});

test("a viewer and an engineer cannot upload, not even with a crafted request", async ({
  page,
}) => {
  const file = {
    name: "lab-results-long.csv",
    mimeType: "text/csv",
    buffer: readFileSync(`${EXAMPLES}lab-results-long.csv`),
  };
  for (const role of ["viewer", "engineer"] as const) {
    const context = await apiContextFor(role);
    expect(
      (await context.get(`${samplePath}/upload`, { maxRedirects: 0 })).status(),
      `${role} GET upload`,
    ).toBe(403);
    for (const intent of ["preview", "confirm"]) {
      const response = await context.post(`${samplePath}/upload`, {
        multipart: { intent, comment: "crafted", file },
        maxRedirects: 0,
      });
      expect(response.status(), `${role} POST upload (${intent})`).toBe(403);
    }
    await context.dispose();
  }
  await signIn(page, "lab_lead");
  expect(await revisionCount(page)).toBe(3);
});

test("an upload over 5 MB is refused with 413 while the request is read, and nothing is stored", async ({
  page,
}) => {
  const lab = await apiContextFor("lab_lead");
  const big = Buffer.alloc(6 * 1024 * 1024, "1,2,3\n");
  const response = await lab.post(`${samplePath}/upload`, {
    multipart: {
      intent: "preview",
      file: { name: "huge.csv", mimeType: "text/csv", buffer: big },
    },
    maxRedirects: 0,
  });
  expect(response.status()).toBe(413);
  expect(await response.text()).toContain(
    "is over the 5 MB limit, so it was not read and nothing was stored",
  );
  await lab.dispose();

  // In the browser, the page says so before sending anything.
  await signIn(page, "lab_lead");
  await page.goto(`${samplePath}/upload`);
  await page
    .getByLabel(/Results file/)
    .setInputFiles({ name: "huge.csv", mimeType: "text/csv", buffer: big });
  await expect(page.getByText("huge.csv is over the 5 MB limit")).toBeVisible();
  await expect(page.getByRole("button", { name: "Check file" })).toBeDisabled();
  expect(await revisionCount(page)).toBe(3);
});

test("templates download in both layouts, and the audit log records upload, approval and rejection", async ({
  page,
}) => {
  const viewer = await apiContextFor("viewer");
  const csv = await viewer.get("/upload-templates/isopleth-template-long.csv");
  expect(csv.status()).toBe(200);
  expect(csv.headers()["content-disposition"]).toContain(
    "isopleth-template-long.csv",
  );
  expect(await csv.text()).toContain("INVENTED");
  const xlsx = await viewer.get(
    "/upload-templates/isopleth-template-grid.xlsx",
  );
  expect(xlsx.status()).toBe(200);
  expect((await xlsx.body()).subarray(0, 2).toString()).toBe("PK");
  expect(
    (await viewer.get("/upload-templates/not-a-template.csv")).status(),
  ).toBe(404);
  // the first address redirects permanently to the new one
  const old = await viewer.get("/templates/isopleth-template-grid.xlsx", {
    maxRedirects: 0,
  });
  expect([old.status(), old.headers()["location"]]).toEqual([
    308,
    "/upload-templates/isopleth-template-grid.xlsx",
  ]);
  await viewer.dispose();

  await signIn(page, "admin");
  for (const action of [
    "revision_uploaded",
    "revision_approved",
    "revision_rejected",
    "sample_created",
  ]) {
    await page.goto(`/admin/audit?action=${action}`);
    await expect(
      page.getByRole("table").locator("tbody tr").first(),
      action,
    ).toContainText(action.replaceAll("_", " "));
  }
});
