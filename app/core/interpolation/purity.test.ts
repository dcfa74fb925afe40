// The engine is a pure library (reference: the project's code style, "keep the numerics pure"): its
// modules import only each other and the number formats (../format) — no framework, database, node built-ins or environment.
import { expect, test } from "vitest";

const sources = import.meta.glob(
  ["./*.ts", "!./*.test.ts", "!./test-helpers.ts"],
  {
    query: "?raw",
    import: "default",
    eager: true,
  },
) as Record<string, string>;

test("library modules import only sibling modules and the number formats, and read no environment", () => {
  const files = Object.keys(sources);
  expect(files).toContain("./index.ts");
  expect(files.length).toBeGreaterThan(8);
  for (const [file, text] of Object.entries(sources)) {
    const specifiers = [
      ...text.matchAll(/^\s*(?:import|export)\b[^;]*?\bfrom\s+"([^"]+)"/gm),
    ].map((m) => m[1]!);
    for (const s of specifiers)
      expect(s, `${file} imports ${s}`).toMatch(/^(\.\/[a-z-]+|\.\.\/format)$/);
    expect(text, file).not.toMatch(/process\.env|require\(/);
  }
});
