import { describe, expect, test } from "vitest";
import {
  MAX_TABLE_ROWS,
  parsePressureSpec,
  TableError,
  tableConditionsToCanonical,
} from "./index";

function failure(spec: string): string {
  try {
    parsePressureSpec(spec);
  } catch (e) {
    if (e instanceof TableError) return `${e.code}: ${e.message}`;
    throw e;
  }
  return "no error";
}

describe("parsePressureSpec", () => {
  test("a range includes its stop when the steps land on it", () => {
    expect(parsePressureSpec("500:5000:250")).toEqual({
      kind: "range",
      pressures: Array.from({ length: 19 }, (_, i) => 500 + 250 * i),
    });
    expect(parsePressureSpec("500:1000:300").pressures).toEqual([500, 800]);
    expect(parsePressureSpec(" 1000 : 1000 : 5 ").pressures).toEqual([1000]);
  });

  test("decimal steps come out as the decimals written, not with accumulated rounding", () => {
    const p = parsePressureSpec("10:11:0.1").pressures;
    expect(p).toEqual([
      10, 10.1, 10.2, 10.3, 10.4, 10.5, 10.6, 10.7, 10.8, 10.9, 11,
    ]);
  });

  test("a list: commas, semicolons or spaces; exponents allowed", () => {
    expect(parsePressureSpec("500,1000,1500")).toEqual({
      kind: "list",
      pressures: [500, 1000, 1500],
    });
    expect(parsePressureSpec("500; 1e3 ,  1.5e3\n2000").pressures).toEqual([
      500, 1000, 1500, 2000,
    ]);
    expect(parsePressureSpec("3250").pressures).toEqual([3250]);
  });

  test.each([
    ["", /^MALFORMED_PRESSURES: No pressures were given/],
    ["   ", /^MALFORMED_PRESSURES: No pressures were given/],
    [
      "500:5000",
      /^MALFORMED_PRESSURES: A range is written start:stop:step, e\.g\. "500:5000:250"; "500:5000" has 2 parts\./,
    ],
    [
      "500:5000:250:1",
      /^MALFORMED_PRESSURES: A range is written start:stop:step/,
    ],
    [
      "500,abc,1500",
      /^INVALID_NUMBER: Pressure 2 of the list is "abc", which is not a number/,
    ],
    [
      "500,1 000",
      /^NOT_INCREASING: Pressures must be listed in increasing order, but 500 \(entry 1\) is followed by 1 \(entry 2\)\./,
    ],
    [
      "500,NaN",
      /^NOT_FINITE: Pressure 2 of the list is "NaN"; pressures must be finite numbers\./,
    ],
    ["500,Infinity", /^NOT_FINITE:/],
    ["1e400", /^NOT_FINITE: Pressure 1 of the list is "1e400", too large/],
    [
      "500,0,1500",
      /^NOT_POSITIVE: Pressure 2 of the list is 0; pressures are absolute and must be above zero\./,
    ],
    ["-500:5000:250", /^NOT_POSITIVE: The start of the range is -500/],
    [
      "500:5000:0",
      /^INVALID_STEP: The step of the range is 0; it must be above zero\./,
    ],
    ["500:5000:-250", /^INVALID_STEP:/],
    [
      "5000:500:250",
      /^INVALID_RANGE: The range stops at 500, below its start 5000/,
    ],
    [
      "1000,500",
      /^NOT_INCREASING: Pressures must be listed in increasing order, but 1000 \(entry 1\) is followed by 500 \(entry 2\)\./,
    ],
    ["500,500", /^NOT_INCREASING: Pressure 500 is listed twice/],
    [
      "500:1500:0.01",
      /^TOO_MANY_ROWS: That makes 100001 pressures; a table has at most 10000 rows\./,
    ],
    ["500:x:250", /^INVALID_NUMBER: The stop of the range is "x"/],
    ["500 psia", /^INVALID_NUMBER: Pressure 2 of the list is "psia"/],
  ])("%j is refused: %s", (spec, message) => {
    expect(failure(spec)).toMatch(message);
  });

  test("exactly MAX_TABLE_ROWS rows are allowed, one more is not", () => {
    expect(parsePressureSpec(`1:${MAX_TABLE_ROWS}:1`).pressures).toHaveLength(
      MAX_TABLE_ROWS,
    );
    expect(failure(`1:${MAX_TABLE_ROWS + 1}:1`)).toMatch(/^TOO_MANY_ROWS/);
    const list = Array.from(
      { length: MAX_TABLE_ROWS + 1 },
      (_, i) => i + 1,
    ).join(",");
    expect(failure(list)).toMatch(/^TOO_MANY_ROWS/);
  });

  test("text that is not a string is refused", () => {
    expect(failure(500 as unknown as string)).toMatch(/^MALFORMED_PRESSURES/);
  });
});

describe("tableConditionsToCanonical", () => {
  test("field numbers pass through; metric bara and °C become psia and °F (1 bar = 14.503774 psi, °F = 1.8 °C + 32)", () => {
    expect(
      tableConditionsToCanonical(
        { pressures: [500, 1000], temperature: 212 },
        "field",
      ),
    ).toEqual({ pressures: [500, 1000], temperature: 212 });
    const m = tableConditionsToCanonical(
      {
        pressures: parsePressureSpec("100:200:100").pressures,
        temperature: 100,
      },
      "metric",
    );
    expect(m.pressures[0]!).toBeCloseTo(1450.3774, 4);
    expect(m.pressures[1]!).toBeCloseTo(2900.7548, 4);
    expect(m.temperature).toBeCloseTo(212, 10);
  });
});
