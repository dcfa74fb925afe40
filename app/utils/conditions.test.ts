import { expect, test } from "vitest";
import { depletionPath, parseConditionList, parseNumber } from "./conditions";

// Reference: common practice for numbers pasted from spreadsheets (thousands separators, decimal commas).
test("numbers as people type them", () => {
  expect(parseNumber("3250")).toBe(3250);
  expect(parseNumber("3,250.5")).toBe(3250.5);
  expect(parseNumber("3250,5")).toBe(3250.5);
  expect(parseNumber("1e3")).toBe(1000);
  expect(parseNumber("abc")).toBeNull();
  expect(parseNumber("")).toBeNull();
  expect(parseNumber("12.3.4")).toBeNull();
});

test("a list pasted from a spreadsheet: tabs, semicolons with decimal commas, a header line", () => {
  expect(
    parseConditionList("pressure\ttemperature\n3250\t212\n2000\t180.5\n"),
  ).toEqual({
    ok: true,
    conditions: [
      { pressure: 3250, temperature: 212 },
      { pressure: 2000, temperature: 180.5 },
    ],
  });
  expect(parseConditionList("224,1;100,5")).toEqual({
    ok: true,
    conditions: [{ pressure: 224.1, temperature: 100.5 }],
  });
  expect(parseConditionList("3250, 212\n3000 200")).toEqual({
    ok: true,
    conditions: [
      { pressure: 3250, temperature: 212 },
      { pressure: 3000, temperature: 200 },
    ],
  });
});

test("bad lines are named", () => {
  expect(parseConditionList("3250\t212\n3000")).toEqual({
    ok: false,
    error: "Line 2 (“3000”) should hold two numbers: pressure and temperature.",
  });
  expect(parseConditionList("3250\tx1")).toMatchObject({
    ok: false,
    error: expect.stringContaining("“x1” is not a number"),
  });
  expect(parseConditionList("  \n")).toMatchObject({ ok: false });
});

// The lookup hint says "tabs, semicolons, commas or spaces", the compare hint "a comma, tab or space". Expected values are the numbers as
// written (no outside reference needed: the cases are about reading text, not about fluid properties).
const ok = (...pairs: [number, number][]) => ({
  ok: true,
  conditions: pairs.map(([pressure, temperature]) => ({
    pressure,
    temperature,
  })),
});

test.each([
  ["3250,212", ok([3250, 212])],
  ["3250, 212", ok([3250, 212])],
  ["3250 ,212", ok([3250, 212])],
  ["3250.5,212.25", ok([3250.5, 212.25])],
  ["-10,60", ok([-10, 60])],
  ["1.5e3,212", ok([1500, 212])],
  ["3250,212\n3000,200\r\n2750,180", ok([3250, 212], [3000, 200], [2750, 180])],
  ["3250\t212", ok([3250, 212])],
  ["3250\t\t212", ok([3250, 212])],
  ["3250;212", ok([3250, 212])],
  ["3250 ; 212", ok([3250, 212])],
  ["3250 212", ok([3250, 212])],
  ["3250    212", ok([3250, 212])],
  ["224,1\t100,5", ok([224.1, 100.5])],
  ["224,1;100,5", ok([224.1, 100.5])],
  ["3250,5 212", ok([3250.5, 212])],
  ["3,250.5\t212", ok([3250.5, 212])],
  ["3 250\t212", ok([3250, 212])],
  ["pressure,temperature\n3250,212", ok([3250, 212])],
  ["Pressure (psia)\tTemperature (°F)\n3250\t212", ok([3250, 212])],
  ["\n\n3250,212\n\n", ok([3250, 212])],
  // a comma between two plain numbers is the separator, even with three digits after it (100 psia, 212 °F)
  ["100,212", ok([100, 212])],
] as const)("accepted: %j", (text, expected) => {
  expect(parseConditionList(text)).toEqual(expected);
});

test.each([
  // a thousands separator inside a tab- or semicolon-separated cell: 3250 or 3.25?
  [
    "3,250\t212",
    "Line 1 (“3,250\t212”): “3,250” could be 3250 (a thousands separator) or 3.250 (a decimal comma). Write it without a thousands separator, or with a decimal point.",
  ],
  [
    "3250\t212\n3,000\t212",
    "Line 2 (“3,000\t212”): “3,000” could be 3000 (a thousands separator) or 3.000 (a decimal comma). Write it without a thousands separator, or with a decimal point.",
  ],
  [
    "3250;2,120",
    "Line 1 (“3250;2,120”): “2,120” could be 2120 (a thousands separator) or 2.120 (a decimal comma). Write it without a thousands separator, or with a decimal point.",
  ],
  [
    "3,250 212",
    "Line 1 (“3,250 212”): “3,250” could be 3250 (a thousands separator) or 3.250 (a decimal comma). Write it without a thousands separator, or with a decimal point.",
  ],
  [
    "1,250,000\t212",
    "Line 1 (“1,250,000\t212”): “1,250,000” could be 1250000 (thousands separators). Write it without a thousands separator, or with a decimal point.",
  ],
  // commas that both separate and group
  [
    "3,250,212",
    "Line 1 (“3,250,212”): its commas could separate the two numbers or group thousands. Write each number without a thousands separator and separate the two with one comma, a tab or a semicolon (e.g. “3250, 212”).",
  ],
  [
    "3250,212\n\n3,000, 200",
    "Line 3 (“3,000, 200”): its commas could separate the two numbers or group thousands. Write each number without a thousands separator and separate the two with one comma, a tab or a semicolon (e.g. “3250, 212”).",
  ],
  [
    "3,250.5,212",
    expect.stringContaining("Line 1 (“3,250.5,212”): its commas"),
  ],
  // other mistakes, with the line counted from 1
  [
    "3250,212\n3000",
    "Line 2 (“3000”) should hold two numbers: pressure and temperature.",
  ],
  [
    "3250\t212\t5",
    "Line 1 (“3250\t212\t5”) should hold two numbers: pressure and temperature.",
  ],
  [
    "3250,x",
    "Line 1 (“3250,x”) should hold two numbers: pressure and temperature.",
  ],
  ["3250;x1", "Line 1: “x1” is not a number (temperature)."],
  ["p;212\n3250;212", "Line 1: “p” is not a number (pressure)."],
  ["3250\t212\nabc\tdef", "Line 2: “abc” is not a number (pressure)."],
  ["", "Paste at least one line with a pressure and a temperature."],
  [
    "pressure\ttemperature",
    "Paste at least one line with a pressure and a temperature.",
  ],
] as const)("refused: %j", (text, error) => {
  expect(parseConditionList(text)).toEqual({ ok: false, error });
});

test("a depletion path of 50 pressures", () => {
  const path = depletionPath(5000, 100, 100, 212);
  expect(path.ok && path.conditions.length).toBe(50);
  expect(path.ok && path.conditions[0]).toEqual({
    pressure: 5000,
    temperature: 212,
  });
  expect(path.ok && path.conditions[49]).toEqual({
    pressure: 100,
    temperature: 212,
  });
  expect(depletionPath(100, 200, 0, 212)).toMatchObject({ ok: false });
});
