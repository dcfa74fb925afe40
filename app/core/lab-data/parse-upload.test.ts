import { expect, test } from "vitest";
import { MAX_UPLOAD_BYTES, parseUpload } from "./parse-upload";
import {
  bytesOf,
  datasetOf,
  errorsOf,
  findingAt,
  parseText,
} from "./uploads.test-helpers";
import type { ParsedDataset } from "./types";

// The numbers in these files are invented for the tests.
const LONG = [
  "pressure (psia),temperature (°F),bubble point (psia),Bo (rb/STB),Rs (scf/STB),oil viscosity (cP)",
  "5000,220,2635,1.440,768,0.52",
  "3000,220,,1.460,768,0.45",
  "2635,220,,1.474,768,0.42",
  "2000,220,,1.400,610,0.50",
  "1000,220,,1.280,380,0.70",
].join("\n");

function column(
  dataset: ParsedDataset,
  key: keyof ParsedDataset["properties"],
  j = 0,
): (number | null)[] {
  const grid = dataset.properties[key];
  if (!grid) throw new Error(`no ${key} grid`);
  return grid.values.map((row) => row[j] ?? null);
}

// ---------------------------------------------------------------------------------------------------
// Layouts, delimiters, decimal marks, encodings

test("long layout: grids per property in canonical units, sorted by pressure, with sources", async () => {
  const d = datasetOf(await parseText("long.csv", LONG));
  expect(d.file).toMatchObject({
    format: "csv",
    layout: "long",
    delimiter: ",",
    decimalMark: ".",
    encoding: "utf-8",
  });
  const bo = d.properties.oil_fvf;
  expect(bo?.pressures).toEqual([1000, 2000, 2635, 3000, 5000]);
  expect(bo?.temperatures).toEqual([220]);
  expect(column(d, "oil_fvf")).toEqual([1.28, 1.4, 1.474, 1.46, 1.44]);
  expect(bo?.unit).toMatchObject({ id: "rb/STB", label: "rb/STB" });
  expect(bo?.canonicalUnit).toBe("rb/STB");
  expect(bo?.sources?.[0]?.[0]).toEqual({ row: 6, column: 4 });
  expect(d.bubblePoints).toEqual([
    { temperature: 220, pressure: 2635, source: { row: 2, column: 3 } },
  ]);
  expect(d.properties.solution_gor?.unit.id).toBe("scf/STB");
  expect(d.properties.oil_viscosity?.values.length).toBe(5);
});

test("long layout: columns in any order, header synonyms, quoted 'name, unit' headers and CRLF line ends", async () => {
  const text = [
    '"oil viscosity, cP",T (°F),P (psia),Z factor,Bg (rb/Mscf)',
    "0.5,200,3000,0.87,0.95",
    "0.6,200,2000,0.86,1.4",
  ].join("\r\n");
  const d = datasetOf(await parseText("any-order.csv", text));
  expect(d.properties.oil_viscosity?.pressures).toEqual([2000, 3000]);
  expect(column(d, "z_factor")).toEqual([0.86, 0.87]);
  expect(column(d, "gas_fvf")).toEqual([0.0014, 0.00095]); // rb/Mscf → rb/scf
  expect(d.properties.z_factor?.unit.id).toBe("-");
});

test("semicolon-separated with decimal commas, metric units converted to canonical", async () => {
  const text = [
    "pressure (bara);temperature (°C);Rs (sm3/sm3);oil density (kg/m3);oil viscosity (mPa.s)",
    "200;90;120,5;700,0;0,61",
    "100;90;70,25;740,0;0,85",
  ].join("\n");
  const outcome = await parseText("metric.csv", text);
  const d = datasetOf(outcome);
  expect(d.file).toMatchObject({ delimiter: ";", decimalMark: "," });
  expect(outcome.warnings.some((w) => w.code === "DECIMAL_COMMA")).toBe(true);
  const rs = d.properties.solution_gor;
  expect(rs?.temperatures[0]).toBeCloseTo(194, 9);
  expect(rs?.pressures[0]).toBeCloseTo(100 * 14.503773773, 6);
  expect(rs?.values[1]?.[0]).toBeCloseTo(120.5 * 5.614583333, 6);
  expect(d.properties.oil_density?.values[0]?.[0]).toBeCloseTo(
    740 / 16.01846337,
    6,
  );
  expect(d.properties.oil_viscosity?.unit.label).toBe("mPa.s");
});

test("tab-separated text, UTF-8 with a byte-order mark", async () => {
  const text =
    "\uFEFFpressure (psia)\ttemperature (degF)\tgas viscosity (cP)\n1000\t200\t0.0144\n2000\t200\t0.0171\n";
  const d = datasetOf(await parseText("tabs.txt", text));
  expect(d.file?.delimiter).toBe("\t");
  expect(column(d, "gas_viscosity")).toEqual([0.0144, 0.0171]);
});

test("UTF-16 (Excel 'Unicode text') and Windows-1252 ('°' as one byte) are read, the latter with a warning", async () => {
  const text =
    "pressure (psia)\ttemperature (°F)\tBo (rb/STB)\n1000\t200\t1.15\n";
  const utf16 = new Uint8Array(2 + text.length * 2);
  utf16.set([0xff, 0xfe]);
  for (let i = 0; i < text.length; i++) utf16[2 + 2 * i] = text.charCodeAt(i);
  const d16 = datasetOf(
    await parseUpload({ filename: "unicode.txt", bytes: utf16 }),
  );
  expect(d16.file?.encoding).toBe("utf-16");
  expect(column(d16, "oil_fvf")).toEqual([1.15]);

  const latin = Uint8Array.from([...text].map((c) => c.charCodeAt(0))); // "°" is 0xB0
  const outcome = await parseUpload({ filename: "ansi.csv", bytes: latin });
  expect(datasetOf(outcome).file?.encoding).toBe("windows-1252");
  expect(outcome.warnings.map((w) => w.code)).toContain("LEGACY_ENCODING");
});

test("gauge pressures use the barometric pressure given (default one atmosphere)", async () => {
  const text =
    "pressure (psig),temperature (°F),bubble point (psig),Bo (rb/STB)\n2620,220,2620,1.6\n0,220,,1.075\n";
  const d = datasetOf(await parseText("gauge.csv", text));
  expect(d.properties.oil_fvf?.pressures).toEqual([
    14.6959487755, 2634.69594878,
  ]);
  expect(d.bubblePoints[0]?.pressure).toBeCloseTo(2634.6959, 4);
  const book = datasetOf(
    await parseText("gauge.csv", text, { barometricPsia: 14.7 }),
  );
  expect(book.properties.oil_fvf?.pressures).toEqual([14.7, 2634.7]);
  expect(book.properties.oil_fvf?.pressureUnit.id).toBe("psig");
});

test("long layout: a row with only a temperature and a bubble point states pb where nothing was measured", async () => {
  const text = `${LONG}\n,250,2800,,,\n`;
  const d = datasetOf(await parseText("pb-only.csv", text));
  expect(d.bubblePoints.map((b) => [b.temperature, b.pressure])).toEqual([
    [220, 2635],
    [250, 2800],
  ]);
});

test("comment lines (#) and a repeated, agreeing bubble point are accepted", async () => {
  const text = LONG.replace("3000,220,,", "3000,220,2635,").replace(
    "pressure",
    "# invented numbers, for a test\npressure",
  );
  const d = datasetOf(await parseText("comments.csv", text));
  expect(d.bubblePoints).toHaveLength(1);
});

test("grid layout: blocks with title, temperature row and pressure rows; a bubble-point block", async () => {
  const text = [
    "bubble point (psia),temperature (°F)",
    ",180,220",
    "bubble point,2400,2635",
    "",
    "oil viscosity (cP),pressure (psia),temperature (°F)",
    "p \\ T,180,220",
    "5000,0.61,0.52",
    "3000,0.55,",
    "",
    "",
    "Z factor,temperature (°F),pressure (psia)",
    ",220",
    "3000,0.87",
    "1000,0.91",
  ].join("\n");
  const d = datasetOf(await parseText("grid.csv", text));
  expect(d.file?.layout).toBe("grid");
  const mu = d.properties.oil_viscosity;
  expect(mu?.pressures).toEqual([3000, 5000]);
  expect(mu?.temperatures).toEqual([180, 220]);
  expect(mu?.values).toEqual([
    [0.55, null],
    [0.61, 0.52],
  ]);
  expect(mu?.sources?.[1]?.[1]).toEqual({ row: 7, column: 3 });
  expect(d.properties.z_factor?.values).toEqual([[0.91], [0.87]]);
  expect(d.bubblePoints.map((b) => b.pressure)).toEqual([2400, 2635]);
});

test("grid layout in a semicolon file with decimal commas and °C", async () => {
  const text =
    "Bo (rm3/sm3);pressure (MPa);temperature (°C)\n;80;100\n30;1,40;1,43\n20;1,42;1,46\n";
  const d = datasetOf(await parseText("grid-metric.csv", text));
  const bo = d.properties.oil_fvf;
  expect(bo?.temperatures).toEqual([176, 212]);
  expect(bo?.pressures[0]).toBeCloseTo(20 * 145.0377377, 5);
  expect(bo?.values[0]).toEqual([1.42, 1.46]);
});

// ---------------------------------------------------------------------------------------------------
// Every bad input gets a message naming file, (sheet,) row, column and value

test("wrong type: a name we do not accept, a PDF, an image named .csv, an old .xls, a Word document", async () => {
  findingAt(
    errorsOf(await parseText("results.json", "{}")),
    "WRONG_FILE_TYPE",
    { file: "results.json", value: ".json" },
  );
  const pdf = errorsOf(
    await parseUpload({
      filename: "report.csv",
      bytes: bytesOf("%PDF-1.7 ..."),
    }),
  );
  expect(pdf[0]?.message).toBe(
    "In report.csv, the file is a PDF document, not a CSV or XLSX table; save the results as .csv or .xlsx.",
  );
  const png = errorsOf(
    await parseUpload({
      filename: "plot.csv",
      bytes: Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 13, 10, 26, 10]),
    }),
  );
  expect(png[0]?.message).toContain("PNG image");
  const xls = errorsOf(
    await parseUpload({
      filename: "old.xls",
      bytes: Uint8Array.from([
        0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0,
      ]),
    }),
  );
  expect(xls[0]?.code).toBe("WRONG_FILE_TYPE");
  expect(xls[0]?.message).toContain("Excel 97–2003 (.xls)");
});

test("wrong type: a ZIP archive that is not a workbook, and a damaged one", async () => {
  const ExcelJS = (await import("exceljs")).default;
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet("a").addRow([1]);
  const good = new Uint8Array(await wb.xlsx.writeBuffer());
  // Rename the workbook part inside the archive's directory: still a ZIP, no longer a workbook.
  const renamed = Uint8Array.from(good);
  const text = new TextDecoder("latin1").decode(renamed);
  for (
    let at = text.indexOf("xl/workbook.xml");
    at >= 0;
    at = text.indexOf("xl/workbook.xml", at + 1)
  )
    renamed[at] = "y".charCodeAt(0);
  const notBook = errorsOf(
    await parseUpload({ filename: "archive.xlsx", bytes: renamed }),
  );
  expect(notBook[0]?.code).toBe("WRONG_FILE_TYPE");
  expect(notBook[0]?.message).toBe(
    "In archive.xlsx, the file is a ZIP archive, not an Excel workbook; save the results as .xlsx or .csv.",
  );
  const damaged = errorsOf(
    await parseUpload({ filename: "cut.xlsx", bytes: good.subarray(0, 200) }),
  );
  expect(damaged[0]?.code).toBe("UNREADABLE_WORKBOOK");
}, 30_000);

test("over 5 MB is refused before anything is read", async () => {
  const big = new Uint8Array(MAX_UPLOAD_BYTES + 1).fill(0x31);
  const errors = errorsOf(
    await parseUpload({ filename: "big.csv", bytes: big }),
  );
  expect(errors).toHaveLength(1);
  expect(errors[0]?.code).toBe("FILE_TOO_LARGE");
  expect(errors[0]?.message).toBe(
    "In big.csv, the file is 5.0 MB, over the 5.0 MB limit; upload only the results table.",
  );
  expect(MAX_UPLOAD_BYTES).toBe(5 * 1024 * 1024);
});

test("empty: no bytes, only blanks, only comments, an empty workbook", async () => {
  expect(
    errorsOf(
      await parseUpload({ filename: "e.csv", bytes: new Uint8Array() }),
    )[0]?.message,
  ).toBe("In e.csv, the file is empty.");
  expect(errorsOf(await parseText("blank.csv", " \n\r\n\t\n"))[0]?.code).toBe(
    "EMPTY_FILE",
  );
  expect(
    errorsOf(await parseText("notes.csv", "# only a note\n\n"))[0]?.code,
  ).toBe("EMPTY_FILE");
  const ExcelJS = (await import("exceljs")).default;
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet("empty");
  const bytes = new Uint8Array(await wb.xlsx.writeBuffer());
  expect(
    errorsOf(await parseUpload({ filename: "e.xlsx", bytes }))[0]?.message,
  ).toBe("In e.xlsx, the workbook's sheets hold no table.");
}, 30_000);

test("binary junk is refused with the position of the first non-text character", async () => {
  const junk = Uint8Array.from([
    0x70, 0x72, 0x65, 0x00, 0x01, 0x02, 0xff, 0x10,
  ]);
  const errors = errorsOf(
    await parseUpload({ filename: "junk.csv", bytes: junk }),
  );
  expect(errors[0]?.code).toBe("BINARY_CONTENT");
  expect(errors[0]?.message).toMatch(
    /^In junk\.csv, the file is not a text table: .*character 4 has code 0/,
  );
});

test("unknown unit, missing unit, ambiguous 'psi', a unit of the wrong quantity", async () => {
  const unknown = errorsOf(
    await parseText(
      "u.csv",
      "pressure (furlongs),temperature (°F),Bo (rb/STB)\n1,2,3\n",
    ),
  );
  const f = findingAt(unknown, "UNKNOWN_UNIT", {
    file: "u.csv",
    row: 1,
    column: 1,
    value: "pressure (furlongs)",
  });
  expect(f.message).toContain("psia, psig, bara");
  findingAt(
    errorsOf(
      await parseText("m.csv", "pressure (psia),temperature (°F),Bo\n1,2,3\n"),
    ),
    "MISSING_UNIT",
    { row: 1, column: 3, value: "Bo" },
  );
  const psi = findingAt(
    errorsOf(
      await parseText(
        "a.csv",
        "pressure (psi),temperature (°F),Bo (rb/STB)\n1,2,3\n",
      ),
    ),
    "AMBIGUOUS_UNIT",
    {
      row: 1,
      column: 1,
      value: "pressure (psi)",
    },
  );
  expect(psi.message).toContain('write "psia" or "psig"');
  findingAt(
    errorsOf(
      await parseText(
        "w.csv",
        "pressure (psia),temperature (°F),oil viscosity (rb/STB)\n1,2,3\n",
      ),
    ),
    "WRONG_UNIT",
    {
      row: 1,
      column: 3,
      value: "oil viscosity (rb/STB)",
    },
  );
});

test("a property name we do not know, and a title line that is not a comment", async () => {
  const errors = errorsOf(
    await parseText(
      "p.csv",
      "pressure (psia),temperature (°F),water cut (%)\n1000,200,5\n",
    ),
  );
  const f = findingAt(errors, "UNKNOWN_COLUMN", {
    file: "p.csv",
    row: 1,
    column: 3,
    value: "water cut (%)",
  });
  expect(f.message).toContain('"oil formation volume factor" (Bo)');
  const title = errorsOf(
    await parseText(
      "t.csv",
      "Results of well X\npressure (psia),temperature (°F),Bo (rb/STB)\n1,2,3\n",
    ),
  );
  expect(
    findingAt(title, "UNKNOWN_COLUMN", {
      row: 1,
      column: 1,
      value: "Results of well X",
    }).message,
  ).toContain('start it with "#"');
});

test("missing pressure or temperature column, duplicate column", async () => {
  findingAt(
    errorsOf(
      await parseText("m.csv", "temperature (°F),Bo (rb/STB)\n200,1.2\n"),
    ),
    "MISSING_COLUMN",
    { row: 1, value: "temperature (°F), Bo (rb/STB)" },
  );
  const dup = errorsOf(
    await parseText(
      "d.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB),oil FVF (rb/STB)\n1,2,3,4\n",
    ),
  );
  findingAt(dup, "DUPLICATE_COLUMN", {
    row: 1,
    column: 4,
    value: "oil FVF (rb/STB)",
  });
});

test("ragged rows: too few fields, a value beyond the header, a value under an empty header", async () => {
  const few = errorsOf(
    await parseText(
      "r.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB),Rs (scf/STB)\n1000,200,1.2\n",
    ),
  );
  expect(
    findingAt(few, "RAGGED_ROW", {
      file: "r.csv",
      row: 2,
      column: 3,
      value: "1.2",
    }).message,
  ).toContain("has 3 fields");
  const many = errorsOf(
    await parseText(
      "r.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB)\n1000,200,1.2,7\n",
    ),
  );
  findingAt(many, "RAGGED_ROW", { row: 2, column: 4, value: "7" });
  const gap = errorsOf(
    await parseText(
      "g.csv",
      "pressure (psia),,Bo (rb/STB),temperature (°F)\n1000,9,1.2,200\n",
    ),
  );
  findingAt(gap, "MISSING_COLUMN", { row: 2, column: 2, value: "9" });
  const grid = errorsOf(
    await parseText(
      "rg.csv",
      "Bo (rb/STB),pressure (psia),temperature (°F)\n,180,220\n1000,1.2,1.3,1.4\n",
    ),
  );
  findingAt(grid, "RAGGED_ROW", { row: 3, column: 4, value: "1.4" });
});

test("non-numeric cells, with a hint for units in cells, thousands separators and placeholders", async () => {
  const text = [
    "pressure (psia),temperature (°F),Bo (rb/STB),Rs (scf/STB),oil viscosity (cP)",
    '5000 psia,220,abc,"1,234.5",n/a',
  ].join("\n");
  const errors = errorsOf(await parseText("n.csv", text));
  expect(
    findingAt(errors, "NOT_A_NUMBER", { row: 2, column: 1, value: "5000 psia" })
      .message,
  ).toContain("put the unit in the column header");
  expect(
    findingAt(errors, "NOT_A_NUMBER", { row: 2, column: 3, value: "abc" })
      .message,
  ).toBe(
    'In n.csv, row 2, column C, the oil formation volume factor "abc" is not a number; write a plain number.',
  );
  expect(
    findingAt(errors, "NOT_A_NUMBER", { row: 2, column: 4, value: "1,234.5" })
      .message,
  ).toContain("thousands separators");
  expect(
    findingAt(errors, "NOT_A_NUMBER", { row: 2, column: 5, value: "n/a" })
      .message,
  ).toContain("leave the cell empty");
});

test("ambiguous decimal commas: in a comma-separated file, or mixed with decimal points", async () => {
  const comma = errorsOf(
    await parseText(
      "c.csv",
      'pressure (psia),temperature (°F),Bo (rb/STB)\n1000,200,"1,2"\n',
    ),
  );
  findingAt(comma, "AMBIGUOUS_DECIMAL", { row: 2, column: 3, value: "1,2" });
  const mixed = errorsOf(
    await parseText(
      "x.csv",
      "pressure (psia);temperature (°F);Bo (rb/STB)\n1000;200;1,2\n2000;200;1.3\n",
    ),
  );
  expect(
    findingAt(mixed, "AMBIGUOUS_DECIMAL", { row: 2, column: 3, value: "1,2" })
      .message,
  ).toContain('row 3 writes "1.3"');
});

test("duplicate pressure–temperature pairs (long), pressures and temperatures (grid), properties", async () => {
  const long = errorsOf(
    await parseText(
      "d.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB)\n1000,200,1.2\n2000,200,1.3\n1000.0,200,1.25\n",
    ),
  );
  expect(
    findingAt(long, "DUPLICATE_POINT", { row: 4, column: 1, value: "1000.0" })
      .message,
  ).toContain("repeats row 2");
  // The same pair in other units is still the same pair.
  const units = errorsOf(
    await parseText(
      "u.csv",
      "pressure (bara),temperature (°C),Bo (rb/STB)\n100,100,1.2\n100,100.0,1.25\n",
    ),
  );
  findingAt(units, "DUPLICATE_POINT", { row: 3, column: 1, value: "100" });
  const gridP = errorsOf(
    await parseText(
      "g.csv",
      "Bo (rb/STB),pressure (psia),temperature (°F)\n,200\n1000,1.2\n1000,1.3\n",
    ),
  );
  findingAt(gridP, "DUPLICATE_POINT", { row: 4, column: 1, value: "1000" });
  const gridT = errorsOf(
    await parseText(
      "g.csv",
      "Bo (rb/STB),pressure (psia),temperature (°F)\n,200,200\n1000,1.2,1.3\n",
    ),
  );
  findingAt(gridT, "DUPLICATE_POINT", { row: 2, column: 3, value: "200" });
  const blocks = errorsOf(
    await parseText(
      "b.csv",
      "Bo (rb/STB),pressure (psia),temperature (°F)\n,200\n1000,1.2\n\nBo (rb/STB),pressure (psia),temperature (°F)\n,250\n1000,1.3\n",
    ),
  );
  findingAt(blocks, "DUPLICATE_PROPERTY", {
    row: 5,
    column: 1,
    value: "Bo (rb/STB)",
  });
});

test("negative (or zero) absolute pressure, in absolute and in gauge units; temperature below absolute zero", async () => {
  const abs = errorsOf(
    await parseText(
      "n.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB)\n-20,200,1.2\n0,200,1.1\n",
    ),
  );
  expect(
    findingAt(abs, "NEGATIVE_ABSOLUTE_PRESSURE", {
      row: 2,
      column: 1,
      value: "-20",
    }).message,
  ).toContain("gauge pressures");
  findingAt(abs, "NEGATIVE_ABSOLUTE_PRESSURE", {
    row: 3,
    column: 1,
    value: "0",
  });
  const gauge = errorsOf(
    await parseText(
      "g.csv",
      "pressure (psig),temperature (°F),Bo (rb/STB)\n-20,200,1.2\n",
    ),
  );
  expect(
    findingAt(gauge, "NEGATIVE_ABSOLUTE_PRESSURE", {
      row: 2,
      column: 1,
      value: "-20",
    }).message,
  ).toContain("below a vacuum");
  const cold = errorsOf(
    await parseText(
      "c.csv",
      "pressure (psia),temperature (K),Bo (rb/STB)\n1000,-3,1.2\n",
    ),
  );
  findingAt(cold, "BELOW_ABSOLUTE_ZERO", { row: 2, column: 2, value: "-3" });
});

test("conflicting bubble points for one temperature", async () => {
  const text = LONG.replace("3000,220,,", "3000,220,2700,");
  findingAt(
    errorsOf(await parseText("pb.csv", text)),
    "CONFLICTING_BUBBLE_POINT",
    { row: 3, column: 3, value: "2700" },
  );
});

test("missing values: empty pressure or temperature on a measurement row", async () => {
  const errors = errorsOf(
    await parseText(
      "mv.csv",
      "pressure (psia),temperature (°F),Bo (rb/STB)\n,200,1.2\n1000,,1.3\n",
    ),
  );
  findingAt(errors, "MISSING_VALUE", { row: 2, column: 1, value: "" });
  findingAt(errors, "MISSING_VALUE", { row: 3, column: 2, value: "" });
});

test("an unmatched quote is a CSV syntax error naming the line", async () => {
  const errors = errorsOf(
    await parseText(
      "q.csv",
      'pressure (psia),temperature (°F),Bo (rb/STB)\n1000,200,"1.2\n',
    ),
  );
  expect(errors[0]?.code).toBe("CSV_SYNTAX");
  expect(errors[0]?.message).toMatch(
    /^In q\.csv, row 2, the line "1000,200,\\?"1\.2" cannot be read/,
  );
});

test("grid layout problems: no temperature row, unknown block title, missing units in the title row", async () => {
  const noTemperatures =
    "Bo (rb/STB),pressure (psia),temperature (°F)\n,200\n1000,1.2\n\nZ factor,pressure (psia),temperature (°F)\n1000,0.9\n";
  findingAt(
    errorsOf(await parseText("g.csv", noTemperatures)),
    "MISSING_VALUE",
    { row: 6, column: 1, value: "1000" },
  );
  findingAt(
    errorsOf(
      await parseText(
        "g.csv",
        "Bo (rb/STB),pressure (psia)\n,200\n1000,1.2\n\nBo (rb/STB)\n,1\n",
      ),
    ),
    "MISSING_UNIT",
    { row: 1, column: 1, value: "Bo (rb/STB)" },
  );
  const text =
    "Bo (rb/STB),pressure (psia),temperature (°F)\n,200\n1000,1.2\n\nsalinity (ppm),pressure (psia),temperature (°F)\n,200\n1000,3\n";
  findingAt(errorsOf(await parseText("g.csv", text)), "UNKNOWN_COLUMN", {
    row: 5,
    column: 1,
    value: "salinity (ppm)",
  });
});

test("too many problems are listed up to 100, then summarised", async () => {
  const rows = ["pressure (psia),temperature (°F),Bo (rb/STB)"];
  for (let i = 1; i <= 150; i++) rows.push(`${i * 10},200,x`);
  const errors = errorsOf(await parseText("many.csv", rows.join("\n")));
  expect(errors).toHaveLength(101);
  expect(errors[100]?.message).toBe(
    "In many.csv, 50 more problems were found and are not listed; fix the ones above and upload again.",
  );
}, 30_000);

// ---------------------------------------------------------------------------------------------------
// XLSX

async function workbook(
  build: (wb: import("exceljs").Workbook) => void,
): Promise<Uint8Array> {
  const ExcelJS = (await import("exceljs")).default;
  const wb = new ExcelJS.Workbook();
  build(wb);
  return new Uint8Array(await wb.xlsx.writeBuffer());
}

test("XLSX long layout: numbers, text numbers, formulas with results; detected by content even when named .csv", async () => {
  const bytes = await workbook((wb) => {
    const ws = wb.addWorksheet("Lab");
    ws.addRow(["pressure (psia)", "temperature (°F)", "Bo (rb/STB)"]);
    ws.addRow([5000, 220, 1.44]);
    ws.addRow(["3000", 220, { formula: "1.4+0.06", result: 1.46 }]);
  });
  const outcome = await parseUpload({
    filename: "really-a-workbook.csv",
    bytes,
  });
  const d = datasetOf(outcome);
  expect(d.file).toMatchObject({
    format: "xlsx",
    layout: "long",
    sheets: ["Lab"],
  });
  expect(column(d, "oil_fvf")).toEqual([1.46, 1.44]);
  expect(d.properties.oil_fvf?.sources?.[0]?.[0]).toEqual({
    sheet: "Lab",
    row: 3,
    column: 3,
  });
  expect(outcome.warnings.map((w) => w.code)).toContain(
    "CONTENT_TYPE_MISMATCH",
  );
}, 30_000);

test("XLSX grid layout: one sheet per property, merged title cells, a hidden sheet ignored", async () => {
  const bytes = await workbook((wb) => {
    const bo = wb.addWorksheet("Bo");
    bo.addRow(["Bo (rb/STB)", "pressure (psia)", "temperature (°F)"]);
    bo.addRow([null, 180, 220]);
    bo.addRow([3000, 1.3, 1.33]);
    const mu = wb.addWorksheet("Viscosity");
    mu.addRow(["oil viscosity (cP)", "pressure (psia)", "temperature (°F)"]);
    mu.addRow(["pressure ↓ temperature →", 220]);
    mu.addRow([3000, 0.5]);
    mu.addRow([2000, 0.45]);
    mu.mergeCells("D1:E1");
    const hidden = wb.addWorksheet("scratch");
    hidden.state = "hidden";
    hidden.addRow(["anything"]);
  });
  const outcome = await parseUpload({ filename: "grids.xlsx", bytes });
  const d = datasetOf(outcome);
  expect(d.file).toMatchObject({ layout: "grid", sheets: ["Bo", "Viscosity"] });
  expect(d.properties.oil_fvf?.values).toEqual([[1.3, 1.33]]);
  expect(d.properties.oil_viscosity?.pressures).toEqual([2000, 3000]);
  expect(outcome.warnings.map((w) => w.code)).toContain("HIDDEN_SHEET_IGNORED");
}, 30_000);

test("XLSX: messages name the sheet; dates, booleans, errors and formulas without results are not numbers", async () => {
  const bytes = await workbook((wb) => {
    const ws = wb.addWorksheet("Viscosity data");
    ws.addRow([
      "pressure (psia)",
      "temperature (°F)",
      "oil viscosity (cP)",
      "Bo (rb/STB)",
    ]);
    ws.addRow([5000, 220, new Date(Date.UTC(2024, 0, 2)), true]);
    ws.addRow([4000, 220, { error: "#N/A" }, { formula: "A1*2" }]);
  });
  const errors = errorsOf(await parseUpload({ filename: "bad.xlsx", bytes }));
  expect(
    findingAt(errors, "NOT_A_NUMBER", {
      file: "bad.xlsx",
      sheet: "Viscosity data",
      row: 2,
      column: 3,
      value: "2024-01-02",
    }).message,
  ).toBe(
    'In bad.xlsx, sheet "Viscosity data", row 2, column C, the oil viscosity "2024-01-02" is a date, not a number; write a plain number.',
  );
  findingAt(errors, "NOT_A_NUMBER", {
    sheet: "Viscosity data",
    row: 2,
    column: 4,
    value: "TRUE",
  });
  findingAt(errors, "NOT_A_NUMBER", {
    sheet: "Viscosity data",
    row: 3,
    column: 3,
    value: "#N/A",
  });
  expect(
    findingAt(errors, "NOT_A_NUMBER", {
      sheet: "Viscosity data",
      row: 3,
      column: 4,
      value: "=A1*2",
    }).message,
  ).toContain("formula without a stored result");
}, 30_000);

test("XLSX: a property given on two sheets is refused", async () => {
  const bytes = await workbook((wb) => {
    for (const name of ["one", "two"]) {
      const ws = wb.addWorksheet(name);
      ws.addRow(["pressure (psia)", "temperature (°F)", "Bo (rb/STB)"]);
      ws.addRow([name === "one" ? 1000 : 2000, 200, 1.2]);
    }
  });
  const errors = errorsOf(await parseUpload({ filename: "twice.xlsx", bytes }));
  expect(
    findingAt(errors, "DUPLICATE_PROPERTY", {
      sheet: "two",
      row: 1,
      column: 3,
      value: "Bo (rb/STB)",
    }).message,
  ).toContain('first at sheet "one", row 1');
}, 30_000);

test("a bad header does not hide bad cells: one upload lists both", async () => {
  const errors = errorsOf(
    await parseText(
      "both.csv",
      "pressure (psi),temperature (°F),Bo (rb/STB)\n1000,200,n/a\n",
    ),
  );
  findingAt(errors, "AMBIGUOUS_UNIT", {
    row: 1,
    column: 1,
    value: "pressure (psi)",
  });
  findingAt(errors, "NOT_A_NUMBER", { row: 2, column: 3, value: "n/a" });
});
