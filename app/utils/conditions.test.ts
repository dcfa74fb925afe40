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
