// The tables library is pure (code style, "keep the numerics pure"): besides its own files it imports only
// the interpolation engine, the lookup, the units library and the CSV cell writer — no framework, database, node built-ins or
// environment.
import { expect, test } from "vitest";

const sources = import.meta.glob(["./*.ts", "!./*.test.ts"], {
  query: "?raw",
  import: "default",
  eager: true,
}) as Record<string, string>;

test("table modules import only their own files, ../interpolation, ../lookup, ../units, ../csv and ../format", () => {
  expect(Object.keys(sources)).toContain("./index.ts");
  for (const [file, text] of Object.entries(sources)) {
    for (const m of text.matchAll(
      /^\s*(?:import|export)\b[^;]*?\bfrom\s+"([^"]+)"/gm,
    )) {
      expect(m[1], `${file} imports ${m[1]}`).toMatch(
        /^(\.\/[a-z-]+|\.\.\/interpolation|\.\.\/lookup|\.\.\/units|\.\.\/csv|\.\.\/format)$/,
      );
    }
    expect(text, file).not.toMatch(
      /process\.env|require\(|import\(|from "node:|from "react|drizzle|\.server/,
    );
  }
});
