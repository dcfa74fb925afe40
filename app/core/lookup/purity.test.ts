// The lookup is pure (code style, "keep the numerics pure"): besides its own files it imports only the
// interpolation engine and the units library — no framework, database, node built-ins or environment.
import { expect, test } from "vitest";

const sources = import.meta.glob(["./*.ts", "!./*.test.ts"], {
  query: "?raw",
  import: "default",
  eager: true,
}) as Record<string, string>;

test("lookup modules import only their own files, ../interpolation, ../units and ../format", () => {
  expect(Object.keys(sources)).toContain("./index.ts");
  for (const [file, text] of Object.entries(sources)) {
    for (const m of text.matchAll(
      /^\s*(?:import|export)\b[^;]*?\bfrom\s+"([^"]+)"/gm,
    )) {
      expect(m[1], `${file} imports ${m[1]}`).toMatch(
        /^(\.\/[a-z-]+|\.\.\/interpolation|\.\.\/units|\.\.\/format)$/,
      );
    }
    expect(text, file).not.toMatch(
      /process\.env|require\(|import\(|from "node:|from "react|drizzle|\.server/,
    );
  }
});
