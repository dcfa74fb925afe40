// Labels refuse control characters and line breaks (Unicode general category Cc, U+2028/U+2029) and the
// bidirectional controls of UAX #9 (U+202A–U+202E, U+2066–U+2069), naming the field and the character.
import { expect, test } from "vitest";
import { labelProblem, labelSchema, multilineTextSchema } from "./labels";

const label = labelSchema("sample label", 120, true);

test("a label with a line break, a tab, NUL, ESC, DEL or a direction override is refused with a message naming the field", () => {
  for (const [text, what] of [
    ["BH\n1", "a line break (U+000A) at character 3"],
    ["BH\r1", "a line break (U+000D) at character 3"],
    ["BH\t1", "a tab (U+0009) at character 3"],
    ["BH\u00001", "a control character (U+0000) at character 3"],
    ["\u001b[31mBH", "a control character (U+001B) at character 1"],
    ["BH\u007f", "a control character (U+007F) at character 3"],
    ["BH\u0085", "a line break (U+0085) at character 3"],
    ["BH\u2028", "a line break (U+2028) at character 3"],
    ["1-HB\u202e", "a text-direction control (U+202E) at character 5"],
  ] as const) {
    const r = label.safeParse(text);
    expect(r.success, JSON.stringify(text)).toBe(false);
    expect(r.error?.issues[0]?.message).toBe(
      `The sample label must be one line, without tabs or other control characters: it holds ${what}.`,
    );
  }
});

test("a trailing line break is refused too (it is not silently trimmed away)", () => {
  expect(label.safeParse("BH-1\n").success).toBe(false);
});

test("formula-like text, quotes, accents and other scripts are allowed in a label (exports neutralise them)", () => {
  for (const text of [
    '=HYPERLINK("http://evil.example","x")',
    "+1",
    "-2",
    "@x",
    "Sample «Ø» 7",
    "井 3",
    'O\'Brien, "B"',
  ]) {
    expect(label.safeParse(text), text).toEqual({ success: true, data: text });
  }
  expect(label.safeParse("  BH-1  ")).toEqual({ success: true, data: "BH-1" });
});

test("multi-line text keeps line breaks and tabs but refuses other control characters", () => {
  const comment = multilineTextSchema("comment");
  expect(comment.safeParse("line one\r\nline two\tend").success).toBe(true);
  expect(comment.safeParse("bell\u0007").error?.issues[0]?.message).toBe(
    "The comment may hold line breaks but no other control characters: it holds a control character (U+0007) at character 5.",
  );
  expect(labelProblem("ok", "name")).toBeNull();
});
