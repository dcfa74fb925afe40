import { describe, expect, test } from "vitest";
import { nestedDeeperThan } from "./body";
import { parseApiPath, parseApiQuery } from "./request";
import { NoQuery, SampleIdParams, SampleQuery, TableQuery } from "./schemas";

/*
 * Strict query strings and paths (OWASP Input Validation and REST Security cheat sheets: allow-list
 * parameters, bound sizes, refuse rather than reinterpret); problem details per RFC 9457.
 */
async function refused(fn: () => unknown): Promise<{
  status: number;
  code: string;
  detail: string;
  issues: { path: unknown[]; message: string }[];
}> {
  try {
    fn();
  } catch (thrown) {
    if (thrown instanceof Response)
      return { status: thrown.status, ...(await thrown.json()) };
    throw thrown;
  }
  throw new Error("not refused");
}
const req = (query: string) => new Request(`http://x/api/v1/samples/1${query}`);

describe("parseApiQuery", () => {
  test("reads known parameters with their defaults", () => {
    expect(
      parseApiQuery(req("?units=metric&revision=12"), SampleQuery),
    ).toEqual({ units: "metric", revision: 12 });
    expect(parseApiQuery(req(""), SampleQuery)).toEqual({ units: "field" });
    expect(
      parseApiQuery(req("?temperature=-40.5&pressures=1000,2000"), TableQuery),
    ).toMatchObject({ temperature: -40.5, format: "json", extrapolate: false });
  });

  test("refuses an unknown parameter, naming it (unit=metric used to give field units)", async () => {
    const p = await refused(() =>
      parseApiQuery(req("?unit=metric"), SampleQuery),
    );
    expect(p).toMatchObject({ status: 400, code: "invalid_query" });
    expect(p.issues).toEqual([
      {
        path: ["unit"],
        message: "Unknown parameter; this endpoint takes revision, units.",
      },
    ]);
    expect(p.detail).toMatch(/`unit`/);
    expect(
      (await refused(() => parseApiQuery(req("?a=1"), NoQuery))).issues[0]!
        .message,
    ).toMatch(/no query parameters/);
  });

  test("refuses a parameter given twice", async () => {
    const p = await refused(() =>
      parseApiQuery(req("?units=field&units=metric"), SampleQuery),
    );
    expect(p.issues).toEqual([
      {
        path: ["units"],
        message: "Given more than once (2 times); give it once.",
      },
    ]);
  });

  test.each([
    "0x1",
    "1e0",
    "+1",
    "01",
    "1.0",
    " 1",
    "-1",
    "0",
    "9".repeat(16),
    "",
  ])("refuses the revision %j", async (odd) => {
    const p = await refused(() =>
      parseApiQuery(req(`?revision=${encodeURIComponent(odd)}`), SampleQuery),
    );
    expect(p.issues[0]!.path).toEqual(["revision"]);
  });

  test.each(["0x10", "1e2", "212abc", "NaN", "Infinity", ".5", "9".repeat(40)])(
    "refuses the temperature %j",
    async (odd) => {
      const p = await refused(() =>
        parseApiQuery(req(`?temperature=${odd}&pressures=1000`), TableQuery),
      );
      expect(p.issues[0]!.path).toEqual(["temperature"]);
    },
  );

  test("refuses a temperature at or below absolute zero in either system", async () => {
    expect(
      (
        await refused(() =>
          parseApiQuery(req("?temperature=-459.67&pressures=1000"), TableQuery),
        )
      ).detail,
    ).toMatch(/absolute zero/);
    expect(
      (
        await refused(() =>
          parseApiQuery(
            req("?temperature=-273.15&pressures=1000&units=metric"),
            TableQuery,
          ),
        )
      ).detail,
    ).toMatch(/absolute zero/);
    expect(
      parseApiQuery(
        req("?temperature=-273&pressures=1000&units=metric"),
        TableQuery,
      ).temperature,
    ).toBe(-273);
  });

  test("refuses a query string over its bound, quoting none of it", async () => {
    const p = await refused(() =>
      parseApiQuery(req(`?pressures=${"Zq".repeat(5_000)}`), TableQuery),
    );
    expect(JSON.stringify(p)).not.toMatch(/ZqZq/);
  });
});

describe("parseApiPath", () => {
  test.each(["0x1", "1e0", "+1", "01", "1.0", "abc"])(
    "refuses the sample id %j",
    async (odd) => {
      const p = await refused(() =>
        parseApiPath({ sampleId: odd }, SampleIdParams),
      );
      expect(p).toMatchObject({ status: 400, code: "invalid_path" });
      expect(p.issues[0]!.path).toEqual(["sampleId"]);
    },
  );

  test("reads a decimal id", () => {
    expect(parseApiPath({ sampleId: "42" }, SampleIdParams)).toEqual({
      sampleId: 42,
    });
  });
});

describe("nestedDeeperThan", () => {
  test("counts nesting of lists and objects without recursion", () => {
    expect(nestedDeeperThan({ points: [{ pressure: 1 }] }, 3)).toBe(false);
    expect(nestedDeeperThan({ points: [{ pressure: [1] }] }, 3)).toBe(true);
    expect(
      nestedDeeperThan(
        JSON.parse(`${"[".repeat(100_000)}${"]".repeat(100_000)}`),
        32,
      ),
    ).toBe(true);
    expect(nestedDeeperThan(12, 0)).toBe(false);
  });
});
