import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { expect, test, type Page } from "@playwright/test";
import { apiContextFor, signIn } from "../support/e2e";
import { closeE2eDb, e2eDb } from "../support/e2e-db";

/*
 * Names, exports, four-eyes approval and failed confirms, end to end on the production build:
 *  - labels refuse control characters; a sample named like a spreadsheet formula is exported by the lookup page's
 *    "Export CSV" as text (OWASP "CSV Injection": a leading single quote, the cell quoted);
 *  - an administrator turns four-eyes approval on (audited); the server then refuses an uploader's own approval,
 *    someone else approves, and the revision page names both with their times;
 *  - a confirm the database refuses says that nothing was stored and keeps the file and the comment for a retry;
 *    an identical file is pointed out and stored only when confirmed.
 * The sample is new for each run; the example file is invented data (reference-data/examples).
 */

test.describe.configure({ mode: "serial" });

const EXAMPLES = fileURLToPath(
  new URL("../../reference-data/examples/", import.meta.url),
);
const RUN = Date.now().toString(36);
const EVIL = '=HYPERLINK("http://evil.example","x")';
let samplePath = "";
let sampleId = 0;
const TRIGGER = `e2e_refuse_revision_${RUN}`;

test.afterAll(async () => {
  // Safety nets: whatever failed above, leave the shared e2e database as the other specs expect it.
  await e2eDb().query(`DROP TRIGGER IF EXISTS ${TRIGGER}`);
  await e2eDb().query(
    "DELETE FROM lab_settings WHERE `key` = 'four_eyes_approval'",
  );
  await closeE2eDb();
});

async function setFourEyes(page: Page, label: RegExp) {
  await page.goto("/admin/settings");
  await page.getByLabel(label).check();
  await page.getByRole("button", { name: "Save lab policy" }).click();
  await expect(page.getByRole("status")).toContainText(
    "Four-eyes approval is now",
  );
}

async function uploadExample(page: Page, comment: string) {
  await page.goto(`${samplePath}/upload`);
  await page
    .getByLabel(/Results file/)
    .setInputFiles(`${EXAMPLES}lab-results-long.csv`);
  await page.getByRole("button", { name: "Check file" }).click();
  await expect(page.getByTestId("preview")).toBeVisible();
  await page.getByLabel("Comment").fill(comment);
}

test("a label with a control character is refused, naming the field; a formula-like label is accepted", async ({
  page,
}) => {
  await signIn(page, "lab_lead");
  await page.goto("/samples/new");
  await page
    .getByLabel("Field", { exact: true })
    .fill(`Invented Safety Field ${RUN}`);
  await page.getByLabel("Region (for a new field)").fill("Invented basin");
  await page.getByLabel("Well", { exact: true }).fill(`S-${RUN}`);
  // A tab survives in a text input (line breaks do not); the browser's check, from the shared schema, refuses it.
  await page.getByLabel("Sample label").fill("BH\t1");
  await page.getByLabel("Sample type").selectOption("bottomhole");
  await page.getByLabel("Stock-tank oil gravity (°API)").fill("38");
  await page.getByLabel("Gas specific gravity (air = 1)").fill("0.8");
  await page.getByRole("button", { name: "Create sample" }).click();
  await expect(
    page.getByText(
      "The sample label must be one line, without tabs or other control characters: it holds a tab (U+0009) at character 3.",
    ),
  ).toBeVisible();
  await expect(page.getByLabel("Sample label")).toHaveAttribute(
    "aria-invalid",
    "true",
  );

  // The server refuses a crafted request too (a line feed in the well name), and stores nothing.
  const lab = await apiContextFor("lab_lead");
  const crafted = await lab.post("/samples/new", {
    form: {
      fieldName: `Invented Safety Field ${RUN}`,
      wellName: "W\n2",
      label: `crafted ${RUN}`,
      sampleType: "bottomhole",
      standardConditions: "field",
    },
    maxRedirects: 0,
  });
  expect(crafted.status()).toBe(400);
  expect(await crafted.text()).toContain(
    "The well name must be one line, without tabs or other control characters: it holds a line break (U+000A) at character 2.",
  );
  await lab.dispose();
  const [rows] = await e2eDb().query(
    "SELECT COUNT(*) AS n FROM samples WHERE label = ?",
    [`crafted ${RUN}`],
  );
  expect(Number((rows as { n: number }[])[0]!.n)).toBe(0);

  await page.getByLabel("Sample label").fill(EVIL);
  await page.getByRole("button", { name: "Create sample" }).click();
  await expect(
    page.getByRole("heading", { level: 1, name: EVIL }),
  ).toBeVisible();
  samplePath = new URL(page.url()).pathname;
  sampleId = Number(samplePath.split("/").pop());
});

test("with four-eyes approval on, the uploader cannot approve their own revision; another person does, and both are named", async ({
  page,
  browser,
}) => {
  // The administrator turns it on; the page says how the default is computed, and the change is audited.
  const admin = await browser.newPage();
  await signIn(admin, "admin");
  await admin.goto("/admin/settings");
  await expect(admin.getByTestId("four-eyes-now")).toContainText(
    "Off (automatic: 1 active lab lead)",
  );
  await setFourEyes(admin, /Always on/);
  await expect(admin.getByTestId("four-eyes-now")).toContainText(
    "On (set by an administrator)",
  );
  await admin.goto("/admin/audit?action=setting_changed");
  await expect(
    admin.getByRole("table").locator("tbody tr").first(),
  ).toContainText("setting changed");
  await expect(
    admin.getByRole("table").locator("tbody tr").first(),
  ).toContainText("four_eyes_approval");

  await signIn(page, "lab_lead");
  await uploadExample(page, "Invented report SAFE-1.");
  await page.getByRole("button", { name: /Store as draft revision 1/ }).click();
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 1",
  );
  await expect(page.getByTestId("four-eyes")).toContainText(
    "a revision must be approved by someone other than its uploader",
  );
  await expect(
    page.getByRole("button", { name: "Approve revision 1" }),
  ).toBeDisabled();

  // The server refuses the crafted approval with a clear message, and nothing changes.
  const lab = await apiContextFor("lab_lead");
  const crafted = await lab.post(`${samplePath}/revisions/1`, {
    form: { intent: "approve", acknowledge: "yes" },
    maxRedirects: 0,
  });
  expect(crafted.status()).toBe(400);
  expect(await crafted.text()).toContain(
    "Four-eyes approval is on: a revision must be approved by someone other than the person who uploaded it",
  );
  await lab.dispose();
  await page.reload();
  await expect(
    page.getByText("Draft, awaiting review", { exact: true }).first(),
  ).toBeVisible();

  // The administrator approves it.
  await admin.goto(`${samplePath}/revisions/1`);
  const ack = admin.getByLabel(/I have read the/);
  if (await ack.count()) await ack.check();
  await admin.getByRole("button", { name: "Approve revision 1" }).click();
  await expect(admin.getByRole("status")).toContainText(
    "Revision 1 is approved",
  );
  await expect(admin.getByTestId("uploaded-by")).toHaveText(
    /^Lena Lablead, \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC$/,
  );
  await expect(admin.getByTestId("reviewed-by")).toHaveText(
    /^Avery Admin, \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC$/,
  );
  await expect(
    admin.getByText("Reviewed by the person who uploaded it."),
  ).toHaveCount(0);
  await page.goto(samplePath);
  await expect(
    page.getByText(
      /uploaded by Lena Lablead on \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC and approved by Avery Admin on \d{4}-/,
    ),
  ).toBeVisible();

  // Back to the default, as the other specs expect.
  await setFourEyes(admin, /Automatic/);
  await expect(admin.getByTestId("four-eyes-now")).toContainText(
    "Off (automatic: 1 active lab lead)",
  );
  await admin.close();
});

test("the lookup export writes the formula-like sample name as text (OWASP CSV Injection)", async ({
  page,
}) => {
  await signIn(page, "engineer");
  await page.goto(`/lookup?sample=${sampleId}`);
  await page.getByRole("tab", { name: "One point" }).click();
  await page.getByLabel("Pressure (psia)").fill("3000");
  await page.getByLabel("Temperature (°F)").fill("200");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByTestId("results-table")).toBeVisible();
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: "Export CSV" }).click(),
  ]);
  // The server's export: a UTF-8 byte-order mark, then CRLF lines.
  const csv = readFileSync((await download.path())!, "utf8").replace(
    /^\uFEFF/,
    "",
  );
  const lines = csv.split(/\r?\n/);
  // The "# …" line with the name is one quoted cell, so nothing after its commas becomes a cell (a formula).
  expect(lines[0]).toMatch(
    /^"# Isopleth lookup — sample =HYPERLINK\(""http:\/\/evil\.example"",""x""\) .*, revision 1"$/,
  );
  // No line has a cell that starts like a formula outside quotes.
  for (const line of lines) expect(line, line).not.toMatch(/(^|,)[=+@]/);
  // The export names the bases of its numbers (a comment line of its own).
  expect(
    lines.some((l) => l.includes("Gas volumes (Rs, Bg) at 60 °F, 14.696 psia")),
  ).toBe(true);
  // Numbers stay numbers: the first line under the header.
  const header = lines.findIndex((l) => /^"?Pressure \(psia\)/.test(l));
  expect(header).toBeGreaterThan(0);
  expect(lines[header + 1]).toMatch(/^3000,200,\d/);
});

test("a confirm the database refuses says nothing was stored, keeps file and comment, and the retry stores it", async ({
  page,
}) => {
  await signIn(page, "lab_lead");
  const countRevisions = async () => {
    const [rows] = await e2eDb().query(
      "SELECT COUNT(*) AS n FROM sample_revisions WHERE sample_id = ?",
      [sampleId],
    );
    return Number((rows as { n: number }[])[0]!.n);
  };
  // The database refuses the next revision row of this sample (a trigger), as a real write failure would.
  await e2eDb().query(
    `CREATE TRIGGER ${TRIGGER} BEFORE INSERT ON sample_revisions FOR EACH ROW BEGIN IF NEW.sample_id = ${sampleId} THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused by the e2e test'; END IF; END`,
  );
  const before = await countRevisions();
  const file = {
    name: "lab-results-long-retry.csv",
    mimeType: "text/csv",
    buffer: Buffer.concat([
      readFileSync(`${EXAMPLES}lab-results-long.csv`),
      Buffer.from("\r\n# retry copy\r\n"),
    ]),
  };
  await page.goto(`${samplePath}/upload`);
  await page.getByLabel(/Results file/).setInputFiles(file);
  await page.getByRole("button", { name: "Check file" }).click();
  await expect(page.getByTestId("preview")).toBeVisible();
  await page.getByLabel("Comment").fill("Invented report SAFE-2, retry.");
  await page.getByRole("button", { name: /Store as draft revision 2/ }).click();
  const alert = page
    .getByRole("alert")
    .filter({ hasText: "Nothing was stored" });
  await expect(alert).toContainText(
    "Nothing was stored: an upload is stored whole or not at all.",
  );
  await expect(alert).toContainText("Your file and comment are still here");
  await expect(alert).not.toContainText("refused by the e2e test");
  expect(await countRevisions()).toBe(before);
  await expect(page.getByLabel("Comment")).toHaveValue(
    "Invented report SAFE-2, retry.",
  );
  expect(
    await page
      .getByLabel(/Results file/)
      .evaluate((el: HTMLInputElement) => el.files?.[0]?.name),
  ).toBe("lab-results-long-retry.csv");
  await expect(page.getByTestId("preview")).toBeVisible();

  // The database is back: the same page, unchanged, stores it.
  await e2eDb().query(`DROP TRIGGER ${TRIGGER}`);
  await page.getByRole("button", { name: /Store as draft revision 2/ }).click();
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 2",
  );
  expect(await countRevisions()).toBe(before + 1);
});

test("an upload identical to a stored revision is pointed out and needs an explicit confirmation", async ({
  page,
}) => {
  await signIn(page, "lab_lead");
  await uploadExample(page, "Invented report SAFE-1 again.");
  const identical = page.getByTestId("identical");
  await expect(identical).toContainText(
    /identical \(same SHA-256\) to revision 1, uploaded by Lena Lablead on \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC \(approved\)/,
  );
  await page.getByRole("button", { name: /Store as draft revision 3/ }).click();
  await expect(page.getByRole("alert").first()).toContainText(
    "Nothing was stored. Tick “Store it anyway”",
  );
  await expect(page.getByLabel("Comment")).toHaveValue(
    "Invented report SAFE-1 again.",
  );
  await page.getByLabel("Store it anyway as revision 3").check();
  await page.getByRole("button", { name: /Store as draft revision 3/ }).click();
  await expect(page.getByRole("status")).toContainText(
    "Stored as draft revision 3",
  );
});
