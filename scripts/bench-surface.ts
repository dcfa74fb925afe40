// Time from navigation to the first drawn 3D surface on /compare, in headless Debian Chromium.
//
//   npx tsx scripts/bench-surface.ts [base URL] [--runs N] [--samples 1,2] [--property oil_fvf] [--side-by-side]
//
// Default base URL http://127.0.0.1:3000 (a running `npm start`, production build, demo seed). Each run uses a
// fresh browser context (empty cache, as on a first visit), signs in as the demo engineer, then navigates to
// /compare?samples=…&property=… and records, inside the page (performance.now(), so the page's busy main thread
// does not delay the reading): the plot chunk's arrival, the 3D canvas in the DOM, and the surface drawn
// (Plotly's first plot done plus two animation frames). It measures; it never fails on a slow result.
import { chromium } from "@playwright/test";
import { CHROMIUM_ARGS, CHROMIUM_PATH } from "../tests/support/chromium";

const args = process.argv.slice(2);
const option = (name: string) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const VALUED = ["--runs", "--samples", "--property"];
const positional = args.filter(
  (a, i) => !a.startsWith("--") && !(i > 0 && VALUED.includes(args[i - 1]!)),
);
const baseUrl = (positional[0] ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const runs = Number(option("--runs") ?? 3);
const samples = option("--samples") ?? "1,2";
const property = option("--property") ?? "oil_fvf";
const sideBySide = args.includes("--side-by-side");
const email = process.env.BENCH_EMAIL ?? "engineer@calder.example";
const password = process.env.BENCH_PASSWORD ?? "isopleth-demo-2026";

type Marks = {
  chunk: number | null;
  chunkStart: number | null;
  plotly: number | null;
  canvas: number | null;
  drawn: number | null;
  html: number | null;
};

declare global {
  interface Window {
    __benchMarks?: { canvas: number | null; drawn: number | null };
  }
}

/**
 * Runs in the page before its scripts: watches for the surface's canvas and its "drawn" state. A string, not a
 * function: tsx would add its own helpers to a function's body, which do not exist inside the page.
 */
const WATCH_SURFACE = `(() => {
  const marks = { canvas: null, drawn: null };
  window.__benchMarks = marks;
  const check = () => {
    const box = document.querySelector('[data-testid="property-surface"]');
    if (!box) return;
    if (marks.canvas === null && box.querySelector("canvas")) marks.canvas = performance.now();
    if (marks.drawn === null && box.getAttribute("data-state") === "drawn" && box.querySelector("canvas")) {
      marks.drawn = -1;
      requestAnimationFrame(() => requestAnimationFrame(() => (marks.drawn = performance.now())));
    }
  };
  new MutationObserver(check).observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ["data-state"] });
})();`;

/** Reads the marks inside the page (a string for the same reason as WATCH_SURFACE). */
const READ_MARKS = `(() => {
  const chunk = performance.getEntriesByType("resource").find((e) => /plots\\.client/.test(e.name));
  const nav = performance.getEntriesByType("navigation")[0];
  const mark = (name) => { const m = performance.getEntriesByName(name)[0]; return m ? m.startTime : null; };
  return {
    chunk: chunk ? chunk.responseEnd : null,
    chunkStart: chunk ? chunk.startTime : null,
    html: nav ? nav.responseEnd : null,
    plotly: mark("isopleth:plotly-ready"),
    canvas: window.__benchMarks.canvas,
    drawn: window.__benchMarks.drawn,
  };
})()`;

async function oneRun(run: number): Promise<Marks> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_ARGS,
  });
  try {
    const context = await browser.newContext({
      viewport: { width: 1280, height: 900 },
    });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), {
      timeout: 30_000,
    });
    // a new page in the same context: the cookie is kept, the memory cache of the sign-in page is not reused
    await page.close();
    const bench = await context.newPage();
    await bench.addInitScript({ content: WATCH_SURFACE });
    const url = `${baseUrl}/compare?samples=${samples}&property=${property}${sideBySide ? "&view=side-by-side" : ""}`;
    await bench.goto(url, { waitUntil: "commit", timeout: 60_000 });
    await bench.waitForFunction(
      () =>
        typeof window.__benchMarks?.drawn === "number" &&
        window.__benchMarks.drawn > 0,
      undefined,
      {
        timeout: 120_000,
        polling: 250,
      },
    );
    const marks = (await bench.evaluate(READ_MARKS)) as Marks;
    await context.close();
    const s = (v: number | null) =>
      v === null ? "—" : `${(v / 1000).toFixed(2)} s`;
    console.log(
      `run ${run}: HTML ${s(marks.html)}, plot chunk requested ${s(marks.chunkStart)} and received ${s(marks.chunk)}, Plotly evaluated ${s(marks.plotly)}, 3D canvas in the page ${s(marks.canvas)}, surface drawn ${s(marks.drawn)}`,
    );
    return marks;
  } finally {
    await browser.close();
  }
}

async function main() {
  console.log(
    `Time to the first drawn 3D surface: ${baseUrl}/compare?samples=${samples}&property=${property}, ${runs} runs, fresh browser context each`,
  );
  const drawn: number[] = [];
  for (let run = 1; run <= runs; run++) {
    try {
      const marks = await oneRun(run);
      if (marks.drawn !== null) drawn.push(marks.drawn / 1000);
    } catch (error) {
      console.log(
        `run ${run}: no surface measured (${error instanceof Error ? error.message.split("\n")[0] : String(error)})`,
      );
    }
  }
  if (drawn.length > 0) {
    const sorted = [...drawn].sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)]!;
    console.log(
      `surface drawn after: ${drawn.map((d) => d.toFixed(2)).join(", ")} s (median ${median.toFixed(2)} s, best ${sorted[0]!.toFixed(2)} s, worst ${sorted.at(-1)!.toFixed(2)} s)`,
    );
  }
}

void main();
