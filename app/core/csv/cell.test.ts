// CSV cells: RFC 4180 section 2 (fields holding quotes, commas or line breaks are quoted, a quote is doubled) and
// OWASP "CSV Injection" / ASVS 5.0 V1.2.10 (text starting with = + - @ tab CR NUL is prefixed with ' and quoted).
import { expect, test } from "vitest";
import { csvCell, csvCommentLine, csvRow } from "./index";

const csvParse = async () => (await import("csv-parse/sync")).parse;

test("text a spreadsheet would run as a formula is prefixed with a single quote and quoted (OWASP CSV Injection)", () => {
  expect(csvCell('=HYPERLINK("http://evil.example","x")')).toBe(
    `"'=HYPERLINK(""http://evil.example"",""x"")"`,
  );
  expect(csvCell("+1+2")).toBe(`"'+1+2"`);
  expect(csvCell("-2+3")).toBe(`"'-2+3"`);
  expect(csvCell("@SUM(A1:A2)")).toBe(`"'@SUM(A1:A2)"`);
  expect(csvCell("\t=1")).toBe(`"'\t=1"`);
  expect(csvCell("\r=1")).toBe(`"'\r=1"`);
  expect(csvCell("\0=1")).toBe(`"'\0=1"`);
  // Text that merely looks like a negative number is text: it is neutralised too.
  expect(csvCell("-1.5")).toBe(`"'-1.5"`);
});

test("numbers stay numbers, negative ones included", () => {
  expect(csvCell(-1.5)).toBe("-1.5");
  expect(csvCell(1e-7)).toBe("1e-7");
  expect(csvCell(-1.5, { decimalMark: ",", delimiter: ";" })).toBe("-1,5");
  expect(csvCell(null)).toBe("");
  expect(csvCell(undefined)).toBe("");
});

test("ordinary text is quoted only when RFC 4180 needs it", () => {
  expect(csvCell("pressure (psia)")).toBe("pressure (psia)");
  expect(csvCell("a,b")).toBe('"a,b"');
  expect(csvCell("a;b", { delimiter: ";" })).toBe('"a;b"');
  expect(csvCell("a;b")).toBe("a;b");
  expect(csvCell('say "x"')).toBe('"say ""x"""');
  expect(csvCell("two\nlines")).toBe('"two\nlines"');
  expect(csvCell("a = b")).toBe("a = b");
  expect(csvCell("")).toBe("");
});

test("a comment line is one cell: a label after a comma cannot become a cell of its own", async () => {
  const line = csvCommentLine(
    'sample x,=HYPERLINK("http://evil.example","x")\nnext',
  );
  const cells = (await csvParse())(line, { relax_quotes: true }) as string[][];
  expect(cells).toEqual([
    ['# sample x,=HYPERLINK("http://evil.example","x") next'],
  ]);
  expect(csvCommentLine("plain note")).toBe("# plain note");
});

test("a row read back by a CSV parser gives the text with its leading quote, and the numbers", async () => {
  const row = csvRow(["=1+1", -1.5, "ok", null, "a,b"]);
  expect((await csvParse())(row) as string[][]).toEqual([
    ["'=1+1", "-1.5", "ok", "", "a,b"],
  ]);
});
