// The heavy-work pool with real worker threads (piscina running heavy-worker.ts through tsx): a job gives
// the same answer in a worker as inline, errors of the core library come back as their own classes, and the
// bound refuses the job past workers + queue limit with 503 and Retry-After (RFC 9110 §15.6.4 and §10.2.3;
// problem details RFC 9457). All data are invented (generated from published correlations).
import { fileURLToPath } from "node:url";
import { threadId } from "node:worker_threads";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { isLookupError, LookupError, runLookup } from "~/core/lookup";
import {
  buildBlackOilTable,
  isTableError,
  parsePressureSpec,
} from "~/core/tables";
import {
  inventedPoints,
  inventedSample,
  inventedUploadCsv,
} from "../../../tests/support/heavy-fixtures";
import { HeavyPool, MIN_WORKER_SIZE } from "./pool";
import { serialiseResults, type ApiLookupInput } from "./tasks";

const WORKER_TS = fileURLToPath(new URL("./heavy-worker.ts", import.meta.url));
const pool = new HeavyPool({
  workers: 2,
  queueLimit: 4,
  filename: WORKER_TS,
  execArgv: ["--import", "tsx"],
  minSize: { "api-lookup": 1, lookup: 1, table: 1, "check-upload": 1 },
});
const inline = new HeavyPool({ workers: 1, queueLimit: 0, filename: null });
// Starting a worker thread that compiles TypeScript takes a few seconds on a busy machine.
beforeAll(
  () =>
    pool.run("lookup", {
      grid: inventedSample().grids.z_factor,
      points: [{ pressure: 1000, temperature: 200 }],
      options: { property: "z_factor", method: "auto", units: "field" },
    }),
  60_000,
);
afterAll(() => pool.close());

const sample = inventedSample();
const grid = sample.grids.oil_fvf;
const options = {
  property: "oil_fvf",
  method: "auto",
  units: "metric",
  extrapolate: false,
  messages: false,
} as const;
const fieldOptions = { ...options, units: "field" } as const;
const points = inventedPoints(5_000);
const columns = (): ApiLookupInput => ({
  grid,
  pressures: Float64Array.from(points, (p) => p.pressure / 14.503773773022), // psia → bara (from memory: 1 bar = 14.5038 psi)
  temperatures: Float64Array.from(
    points,
    (p) => ((p.temperature - 32) * 5) / 9,
  ), // °F → °C
  options,
});

describe(
  "a job gives the same answer in a worker thread as inline",
  { timeout: 60_000 },
  () => {
    test("API lookup: the same results JSON as the inline path and as the object-per-point lookup", async () => {
      const worker = await pool.run("api-lookup", columns());
      const here = await inline.run("api-lookup", columns());
      expect(worker.where).toBe("worker");
      expect(here.where).toBe("inline");
      expect(worker.value).toStrictEqual(here.value);
      const metricPoints = points.map((p) => ({
        pressure: p.pressure / 14.503773773022,
        temperature: ((p.temperature - 32) * 5) / 9,
      }));
      const direct = runLookup(grid, metricPoints, options);
      const json = new TextDecoder().decode(worker.value.resultsUtf8);
      expect(json).toBe(serialiseResults(direct.results).json);
      expect(JSON.parse(json)).toHaveLength(5_000);
      // no sample basis given: the report is taken to be on 60 °F and 14.696 psia, pressures absolute
      expect(worker.value.units).toStrictEqual({
        pressure: "bara",
        temperature: "°C",
        value: "rm³/sm³",
        standardConditions: "15 °C, 101.325 kPa",
        reportStandardConditions: "60 °F, 14.696 psia",
        pressureBasis: "absolute",
        barometricPressurePsia: 14.696,
      });
    });

    test("API lookup, columnar and CSV forms: the worker's answer is the inline one, with the per-point form's numbers", async () => {
      const input = (format: "columns" | "csv"): ApiLookupInput => ({
        ...columns(),
        format,
      });
      const worker = await pool.run("api-lookup", input("columns"));
      const here = await inline.run("api-lookup", input("columns"));
      expect(worker.where).toBe("worker");
      expect(worker.value).toStrictEqual(here.value);
      const perPoint = JSON.parse(
        new TextDecoder().decode(
          (await inline.run("api-lookup", columns())).value.resultsUtf8,
        ),
      ) as { value: number | null; errorEstimate: number | null }[];
      const block = JSON.parse(
        `{${new TextDecoder().decode(worker.value.resultsUtf8)}}`,
      ) as {
        count: number;
        columns: { value: (number | null)[]; errorEstimate: (number | null)[] };
      };
      expect(block.count).toBe(5_000);
      expect(block.columns.value).toEqual(perPoint.map((r) => r.value));
      expect(block.columns.errorEstimate).toEqual(
        perPoint.map((r) => r.errorEstimate),
      );
      const csv = await pool.run("api-lookup", input("csv"));
      expect(csv.value.csvCells).toHaveLength(5_000);
      expect(Number(csv.value.csvCells![0]!.split(",")[0])).toBe(
        perPoint[0]!.value,
      );
    });

    test("lookup: the full result object, plain data with the same shape and prototypes", async () => {
      const input = {
        grid,
        points: points.slice(0, 500),
        options: { ...fieldOptions, messages: true },
      } as const;
      const worker = await pool.run("lookup", input);
      expect(worker.where).toBe("worker");
      expect(worker.value).toStrictEqual(
        runLookup(grid, input.points, input.options),
      );
    });

    test("table: 2,000 rows built in a worker equal the inline build", async () => {
      const input = {
        grids: sample.grids,
        temperature: 212,
        pressures: parsePressureSpec("600:5400:2.4").pressures,
        method: "auto",
      } as const;
      expect(input.pressures.length).toBeGreaterThan(1_900);
      const worker = await pool.run("table", input);
      expect(worker.where).toBe("worker");
      expect(worker.value).toStrictEqual(buildBlackOilTable(input));
      expect(worker.value.rows.length).toBeGreaterThan(1_900);
    });

    test("upload QC: a CSV parsed and checked in a worker equals the inline check", async () => {
      const bytes = new TextEncoder().encode(inventedUploadCsv(60));
      const meta = {
        apiGravity: 35,
        gasGravity: 0.75,
        standardConditions: { pressurePsia: 14.696, temperatureF: 60 },
      };
      const worker = await pool.run("check-upload", {
        filename: "invented.csv",
        bytes,
        meta,
      });
      const here = await inline.run("check-upload", {
        filename: "invented.csv",
        bytes,
        meta,
      });
      expect(worker.where).toBe("worker");
      expect(worker.value).toStrictEqual(here.value);
      if (!worker.value.ok)
        throw new Error(worker.value.errors.map((e) => e.message).join("\n"));
      expect(Object.keys(worker.value.dataset.properties)).toHaveLength(7);
      expect(worker.value.findings.length).toBeGreaterThan(0);
      expect(worker.value.dataset.properties.oil_fvf?.sources).toBeUndefined();
    });

    test("upload QC: a refused file comes back with the same findings", async () => {
      const bytes = new TextEncoder().encode(
        "pressure (psia),temperature (degF),Bo (rb/STB)\n1000,200,abc\n",
      );
      const worker = await pool.run("check-upload", {
        filename: "bad.csv",
        bytes,
        meta: {},
      });
      const here = await inline.run("check-upload", {
        filename: "bad.csv",
        bytes,
        meta: {},
      });
      expect(worker.value.ok).toBe(false);
      expect(worker.value).toStrictEqual(here.value);
    });

    test("a core error thrown in the worker is rethrown as its own class with code and details", async () => {
      // a malformed point (a point outside the range is refused in place, not thrown)
      const negative = {
        ...columns(),
        pressures: Float64Array.of(-1, 2),
        temperatures: Float64Array.of(100, 100),
      }; // bara: absolute pressures are above zero
      const error = await pool
        .run("api-lookup", negative)
        .catch((e: unknown) => e);
      expect(error).toBeInstanceOf(LookupError);
      expect(isLookupError(error) && error.code).toBe("INVALID_POINT");
      expect(isLookupError(error) && error.details.pointIndex).toBe(0);
      const table = await pool
        .run("table", {
          grids: {},
          temperature: 212,
          pressures: [1000, 2000],
          method: "auto",
        })
        .catch((e: unknown) => e);
      expect(isTableError(table) && table.code).toBe("NO_GRIDS");
    });

    test("the job really runs on another thread; both workers take jobs", async () => {
      const runs = await Promise.all(
        [1, 2, 3, 4].map(() => pool.run("api-lookup", columns())),
      );
      const threads = new Set(runs.map((r) => r.thread));
      expect(threads.has(threadId)).toBe(false);
      expect(threads.size).toBe(2);
      expect(runs.every((r) => r.runMs > 0 && r.waitMs >= 0)).toBe(true);
    });
  },
);

describe("small jobs stay inline", { timeout: 60_000 }, () => {
  test("below MIN_WORKER_SIZE a job does not go to a worker", async () => {
    const defaults = new HeavyPool({
      workers: 1,
      queueLimit: 0,
      filename: WORKER_TS,
      execArgv: ["--import", "tsx"],
    });
    const small = await defaults.run("lookup", {
      grid,
      points: points.slice(0, MIN_WORKER_SIZE.lookup - 1),
      options: fieldOptions,
    });
    expect(small.where).toBe("inline");
    expect(
      defaults.usesWorker("lookup", {
        grid,
        points: points.slice(0, MIN_WORKER_SIZE.lookup),
        options: fieldOptions,
      }),
    ).toBe(true);
    await defaults.close();
  });
});

describe("the bound on concurrent heavy jobs", () => {
  // Admission is counted when run() is called, so the jobs need not be slow for the third to be refused.
  const slow = columns;

  test("past workers + queue limit the API gets 503 problem details with Retry-After; admitted jobs finish", async () => {
    const bounded = new HeavyPool({
      workers: 1,
      queueLimit: 1,
      filename: WORKER_TS,
      execArgv: ["--import", "tsx"],
      minSize: { "api-lookup": 1 },
    });
    const first = bounded.run("api-lookup", slow());
    const second = bounded.run("api-lookup", slow());
    expect(bounded.admitted).toBe(2);
    const refused = await bounded
      .run("api-lookup", slow())
      .catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(Response);
    const response = refused as Response;
    expect(response.status).toBe(503);
    expect(Number(response.headers.get("Retry-After"))).toBeGreaterThanOrEqual(
      1,
    );
    expect(response.headers.get("Content-Type")).toContain(
      "application/problem+json",
    );
    expect(await response.json()).toMatchObject({
      status: 503,
      code: "server_busy",
      type: "/api-docs#problem-server_busy",
    });
    const done = await Promise.all([first, second]);
    expect(done.map((d) => d.where)).toEqual(["worker", "worker"]);
    expect(bounded.admitted).toBe(0);
    // Room again once they are done.
    expect((await bounded.run("api-lookup", { ...columns() })).where).toBe(
      "worker",
    );
    await bounded.close();
  }, 60_000);

  test("a page gets a plain 503 message saying nothing was changed; a closed pool refuses too", async () => {
    const bounded = new HeavyPool({
      workers: 1,
      queueLimit: 0,
      filename: WORKER_TS,
      execArgv: ["--import", "tsx"],
      minSize: { "check-upload": 1, "api-lookup": 1 },
    });
    const first = bounded.run("api-lookup", slow());
    const refused = (await bounded
      .run(
        "check-upload",
        {
          filename: "a.csv",
          bytes: new TextEncoder().encode(inventedUploadCsv(10)),
          meta: {},
        },
        { surface: "page" },
      )
      .catch((e: unknown) => e)) as Response;
    expect(refused.status).toBe(503);
    expect(refused.headers.get("Retry-After")).toMatch(/^\d+$/);
    expect(await refused.text()).toMatch(
      /^The server is at its limit of 1 large computation at once, so this was not done and nothing was changed\. Try again in \d+ seconds?\.$/,
    );
    await first;
    await bounded.close();
    const closed = (await bounded
      .run("api-lookup", columns())
      .catch((e: unknown) => e)) as Response;
    expect(closed.status).toBe(503);
    expect(await closed.json()).toMatchObject({
      code: "server_busy",
      detail: expect.stringContaining("shutting down"),
    });
  }, 60_000);
});

describe("what runs in a worker is pure computation", () => {
  const sources = import.meta.glob(["./tasks.ts", "./heavy-worker.ts"], {
    query: "?raw",
    import: "default",
    eager: true,
  }) as Record<string, string>;
  test("tasks.ts imports only app/core; heavy-worker.ts only tasks.ts and node:worker_threads", () => {
    expect(Object.keys(sources).sort()).toEqual([
      "./heavy-worker.ts",
      "./tasks.ts",
    ]);
    for (const [file, text] of Object.entries(sources)) {
      const allowed =
        file === "./tasks.ts"
          ? /^~\/core\/[a-z-]+$/
          : /^(\.\/tasks|node:worker_threads)$/;
      for (const m of text.matchAll(
        /^\s*(?:import|export)\b[^;]*?\bfrom\s+"([^"]+)"/gm,
      ))
        expect(m[1], `${file} imports ${m[1]}`).toMatch(allowed);
      expect(text, file).not.toMatch(/process\.env|require\(|import\(/);
    }
  });
});
