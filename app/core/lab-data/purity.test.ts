// The lab-data library is pure (the project's code style, "keep the numerics pure"): besides its own modules
// it imports only the units and properties libraries, the CSV cell writer (../csv), csv-parse (text) and exceljs (workbooks, loaded on
// demand) — no framework, database, node built-ins or environment.
import { expect, test } from "vitest";

const sources = import.meta.glob(
  ["./**/*.ts", "!./**/*.test.ts", "!./test-support.ts"],
  {
    query: "?raw",
    import: "default",
    eager: true,
  },
) as Record<string, string>;

const PACKAGES = ["csv-parse/sync", "exceljs"];

/** Where a relative import lands, seen from app/core: "lab-data/qc/context", "units", "properties/standing". */
function target(file: string, specifier: string): string {
  const parts = [
    "lab-data",
    ...file.replace(/^\.\//, "").split("/").slice(0, -1),
  ];
  for (const piece of specifier.split("/")) {
    if (piece === "..") parts.pop();
    else if (piece !== ".") parts.push(piece);
  }
  return parts.join("/");
}

test("library modules import only their own modules, units, properties, the number formats, the CSV cell writer, csv-parse and exceljs", () => {
  const files = Object.keys(sources);
  expect(files).toContain("./index.ts");
  expect(files).toContain("./qc/run-qc.ts");
  for (const [file, text] of Object.entries(sources)) {
    const specifiers = [
      ...[
        ...text.matchAll(/^\s*(?:import|export)\b[^;]*?\bfrom\s+"([^"]+)"/gm),
      ].map((m) => m[1] ?? ""),
      ...[...text.matchAll(/import\("([^"]+)"\)/g)].map((m) => m[1] ?? ""),
    ];
    for (const s of specifiers) {
      if (PACKAGES.includes(s)) continue;
      expect(s, `${file} imports ${s}`).toMatch(/^\.{1,2}\//);
      expect(target(file, s), `${file} imports ${s}`).toMatch(
        /^(lab-data|units|properties|csv|format)(\/[a-z-/]+)?$/,
      );
    }
    expect(text, file).not.toMatch(
      /process\.env|require\(|from "node:|from "react|drizzle|\.server/,
    );
  }
});
