import type { RouteConfigEntry } from "@react-router/dev/routes";
import { expect, test, type Page } from "@playwright/test";
import routes from "../../app/routes";
import { CORE_RULES } from "../support/access-rules/core";
import { LOOKUP_RULES } from "../support/access-rules/lookup";
import { SAMPLE_RULES } from "../support/access-rules/samples";
import type { DemoRoleName, Rule } from "../support/access-rules/types";
import { signIn } from "../support/e2e";

/*
 * Every page at a phone's width (390 × 844 CSS pixels, an iPhone 12–15 in portrait): none scrolls sideways,
 * i.e. document.documentElement.scrollWidth ≤ 390 once the page has settled. The pages are the page routes of
 * app/routes.ts (their access rules say who may open them), so a new page is measured too; each is opened as
 * the first role its rule allows (public pages signed out), with the data that makes it widest where that
 * matters (a lookup's results, two compared samples with their plots, a saved set). Screenshots go to
 * test-results/phone-width/ for a person to look at.
 *
 * WebGL pages hang under Playwright's trace screenshots on these machines: traces are off here (as plots.spec).
 */
test.use({ trace: "off", viewport: { width: 390, height: 844 } });

const WIDTH = 390;
const RULES: Record<string, Rule> = {
  ...CORE_RULES,
  ...SAMPLE_RULES,
  ...LOOKUP_RULES,
};

/** Where a page is measured when its rule's path is not the widest view of it ($setId: filled in by the test). */
const PATHS: Record<string, string> = {
  "routes/_app/compare/index.tsx": "/compare?samples=1&samples=3",
  "routes/_app/lookup/sets/$setId.tsx": "/lookup/sets/$setId",
};

/** A page route: a `.tsx` module of app/routes.ts that a browser opens (not a layout, a file or a redirect). */
function pageRoutes(): string[] {
  const flatten = (entries: RouteConfigEntry[]): string[] =>
    entries.flatMap((e) => [e.file, ...flatten(e.children ?? [])]);
  return flatten(routes as RouteConfigEntry[]).filter(
    (f) => f.endsWith(".tsx") && !f.endsWith("/layout.tsx"),
  );
}

type Visit = { file: string; path: string; role: DemoRoleName | null };

function visits(): Visit[] {
  return pageRoutes().map((file) => {
    const rule = RULES[file];
    if (!rule || !("path" in rule))
      throw new Error(`${file} has no access rule with a path`);
    const role = rule.kind === "page" ? rule.allowed[0]! : null;
    return { file, path: PATHS[file] ?? rule.path, role };
  });
}

/** The page's width and the elements that stick out past the screen's right edge (for the message). */
async function measure(page: Page) {
  return page.evaluate((width) => {
    const wide = [...document.querySelectorAll("body *")]
      .filter((e) => {
        const r = e.getBoundingClientRect();
        return r.right > width + 0.5 && r.width > 0;
      })
      // the outermost ones only
      .filter((e) => {
        const parent = e.parentElement;
        return !parent || parent.getBoundingClientRect().right <= width + 0.5;
      })
      .slice(0, 5)
      .map(
        (e) =>
          `${e.tagName.toLowerCase()}${e.id ? `#${e.id}` : ""}.${[...e.classList].slice(0, 4).join(".")} right=${Math.round(e.getBoundingClientRect().right)}`,
      );
    return { scrollWidth: document.documentElement.scrollWidth, wide };
  }, WIDTH);
}

async function expectFits(page: Page, name: string) {
  await page.waitForLoadState("networkidle");
  await page.screenshot({
    path: `test-results/phone-width/${name}.png`,
    fullPage: true,
  });
  const { scrollWidth, wide } = await measure(page);
  expect(
    scrollWidth,
    `${name}: ${page.url()} is ${scrollWidth} px wide at ${WIDTH} px; sticking out: ${wide.join(", ")}`,
  ).toBeLessThanOrEqual(WIDTH);
}

const slug = (path: string) =>
  path.replace(/^\//, "").replace(/[^a-z0-9]+/gi, "-") || "home";

test("every page fits a 390 px wide phone screen without sideways scrolling", async ({
  browser,
}) => {
  test.setTimeout(240_000);
  const all = visits();
  expect(all.length).toBeGreaterThan(15);
  const failures: string[] = [];
  const byRole = new Map<DemoRoleName | null, Visit[]>();
  for (const v of all) byRole.set(v.role, [...(byRole.get(v.role) ?? []), v]);

  for (const [role, list] of byRole) {
    const context = await browser.newContext({
      viewport: { width: WIDTH, height: 844 },
      deviceScaleFactor: 1,
    });
    const page = await context.newPage();
    if (role) await signIn(page, role);
    let setId: string | null = null;
    for (const v of list) {
      let path = v.path;
      if (path.includes("$setId")) {
        setId ??= await saveSet(page);
        path = path.replace("$setId", setId);
      }
      await page.goto(path);
      if (v.file === "routes/_app/compare/index.tsx")
        await expect(page.getByTestId("property-slices")).toHaveAttribute(
          "data-state",
          "drawn",
          { timeout: 90_000 },
        );
      const name = `${role ?? "signed-out"}-${slug(v.path)}`;
      try {
        await expectFits(page, name);
      } catch (error) {
        failures.push((error as Error).message.split("\n")[0]!);
      }
      if (v.file === "routes/_app/lookup/index.tsx") {
        // with its results: the widest table of the app
        await page.getByRole("button", { name: "Look up" }).click();
        await expect(page.getByRole("table").first()).toBeVisible();
        try {
          await expectFits(page, `${name}-results`);
        } catch (error) {
          failures.push((error as Error).message.split("\n")[0]!);
        }
      }
    }
    if (setId) await deleteSet(page, setId);
    await context.close();
  }
  // public pages: the 404 page too
  const context = await browser.newContext({
    viewport: { width: WIDTH, height: 844 },
  });
  const page = await context.newPage();
  await page.goto("/no-such-page");
  try {
    await expectFits(page, "signed-out-not-found");
  } catch (error) {
    failures.push((error as Error).message.split("\n")[0]!);
  }
  await context.close();
  expect(failures, "pages wider than the screen").toEqual([]);
});

/** Saves a lookup set of sample 1 through the lookup page's action; returns its id (from its "Runs" link). */
async function saveSet(page: Page): Promise<string> {
  const name = `phone width ${Date.now()}`;
  const response = await page.request.post("/lookup?index", {
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
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(response.status()).toBe(200);
  await page.goto("/lookup");
  const runs = page
    .getByRole("listitem")
    .filter({ hasText: name })
    .getByRole("link", { name: "Runs" });
  const href = await runs.getAttribute("href");
  return /\/lookup\/sets\/(\d+)/.exec(href ?? "")![1]!;
}

async function deleteSet(page: Page, setId: string) {
  const response = await page.request.post("/lookup?index", {
    form: { intent: "delete-set", setId },
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(response.status()).toBe(200);
}

test("on a phone the menu is folded behind a button, opens, and folds again on the next page", async ({
  page,
}) => {
  await signIn(page, "admin");
  await page.goto("/samples");
  const menu = page.getByRole("button", { name: "Menu" });
  const main = page.getByRole("navigation", { name: "Main" });
  await expect(menu).toHaveAttribute("aria-expanded", "false");
  await expect(main).toBeHidden();
  await menu.click();
  await expect(menu).toHaveAttribute("aria-expanded", "true");
  await expect(
    page.getByRole("navigation", { name: "Administration" }),
  ).toBeVisible();
  await main.getByRole("link", { name: "Lookup" }).click();
  await expect(page).toHaveURL(/\/lookup$/);
  await expect(main).toBeHidden();
  await expect(menu).toHaveAttribute("aria-expanded", "false");
  expect(
    await page.evaluate(() => document.documentElement.scrollWidth),
  ).toBeLessThanOrEqual(WIDTH);
});
