import { expect, test } from "vitest";
import { guideSections } from "~/components/samples/guide";
import { parseGuide, uploadGuide } from "~/.server/samples/upload-guide";

/* The upload page shows the user part of app/core/lab-data/README.md; these are the parts it relies on. */

test("the guide has both layouts, what is refused and the QC rules, and stops before the developer notes", () => {
  const { intro, sections } = guideSections(uploadGuide());
  expect(intro.length).toBeGreaterThan(0);
  const titles = sections.map((s) => s.title);
  expect(titles.some((t) => /^Long layout/.test(t))).toBe(true);
  expect(titles.some((t) => /^Grid layout/.test(t))).toBe(true);
  expect(titles.some((t) => /refused/i.test(t))).toBe(true);
  expect(titles.some((t) => /Quality checks/.test(t))).toBe(true);
  expect(titles.some((t) => /developers/i.test(t))).toBe(false);
  const qc = sections.find((s) => /Quality checks/.test(s.title))!;
  const rules = qc.blocks.find((b) => b.kind === "table");
  expect(
    rules && rules.kind === "table" ? rules.rows.length : 0,
  ).toBeGreaterThan(10);
});

test("the Markdown reader: tables with pipes inside code, wrapped list items, code blocks", () => {
  const blocks = parseGuide(
    [
      "# T",
      "",
      "Para one",
      "continues.",
      "",
      "- item **a**",
      "  wraps",
      "- item b",
      "",
      "| a | b |",
      "|---|---|",
      "| `x|y` | 2 |",
      "",
      "```",
      "code, here",
      "```",
      "",
      "---",
      "",
      "## Hidden",
    ].join("\n"),
  );
  expect(blocks).toEqual([
    { kind: "heading", level: 1, text: "T" },
    { kind: "paragraph", text: "Para one continues." },
    { kind: "list", items: ["item **a** wraps", "item b"] },
    { kind: "table", head: ["a", "b"], rows: [["`x|y`", "2"]] },
    { kind: "code", text: "code, here" },
  ]);
});
