// The CSV writer neutralises text a spreadsheet would run as a formula (OWASP "CSV Injection", ASVS 5.0
// V1.2.10) and keeps numbers as numbers; the templates' comment lines stay comments.
import { expect, test } from "vitest";
import { buildTemplateCsv } from "./templates";
import { toCsv } from "./write-tables";

test("text cells starting with = + - @ are written with a leading quote; numbers, negative ones too, are not", () => {
  const csv = toCsv([
    ["pressure (psia)", "label"],
    [-1.5, '=HYPERLINK("http://evil.example","x")'],
    [2, "@SUM(A1)"],
  ]);
  expect(csv.split("\r\n")).toEqual([
    "pressure (psia),label",
    `-1.5,"'=HYPERLINK(""http://evil.example"",""x"")"`,
    `2,"'@SUM(A1)"`,
    "",
  ]);
});

test("a comment holding a comma is written as one quoted cell, so no part of it becomes a cell", () => {
  expect(toCsv([["# sample x,=1+1"], ["a"]])).toBe(
    '"# sample x,=1+1"\r\na\r\n',
  );
});

test("every comment line of both templates is a bare comment line (read back as a comment)", () => {
  for (const layout of ["long", "grid"] as const) {
    const comments = buildTemplateCsv(layout)
      .split("\r\n")
      .filter((l) => l.includes("INVENTED") || l.includes("template"));
    expect(comments.length, layout).toBeGreaterThan(0);
    for (const line of comments) expect(line, layout).toMatch(/^# [^",]*$/);
  }
});
