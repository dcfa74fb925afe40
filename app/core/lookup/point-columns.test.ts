import { describe, expect, test } from "vitest";
import { readLookupText } from "./point-columns";

// The lookup body reader that runs in the server's worker threads: the same verdicts as the API schema's
// (app/.server/api/schemas.test.ts compares that schema with zod's), and bounded depth per OWASP's Input
// Validation cheat sheet (bound the nesting of structured input).
describe("readLookupText", () => {
  test("columns hold the points in order; head is the rest of the body", () => {
    const r = readLookupText(
      JSON.stringify({
        property: "oil_fvf",
        points: [
          { pressure: 3000, temperature: 212 },
          { pressure: 1e3, temperature: -40.5 },
        ],
      }),
      32,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect([...r.pressures]).toEqual([3000, 1000]);
    expect([...r.temperatures]).toEqual([212, -40.5]);
    expect(r.head).toEqual({ property: "oil_fvf" });
    expect(r.count).toBe(2);
  });

  test("bad points are named by their path; at most 20 issues", () => {
    const points = Array.from({ length: 50 }, (_, i) =>
      i === 3
        ? { pressure: "1", temperature: 2 }
        : i === 7
          ? { pressure: 1, temperature: 2, x: 1 }
          : i >= 10
            ? null
            : { pressure: 1, temperature: 2 },
    );
    const r = readLookupText(
      JSON.stringify({ property: "oil_fvf", points }),
      32,
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues![0]).toEqual({
      path: ["points", 3, "pressure"],
      message: 'Expected a finite number, received "1".',
    });
    expect(r.issues![1]).toEqual({
      path: ["points", 7],
      message: 'Unrecognized key: "x"',
    });
    expect(r.issues![2]!.path).toEqual(["points", 10]);
    expect(r.issues!.length).toBe(20);
  });

  test("invalid JSON and a value nested 10,000 deep are refused without throwing", () => {
    expect(readLookupText("{", 32)).toMatchObject({
      ok: false,
      message: expect.stringMatching(/^The body is not valid JSON/),
    });
    const deep = `{"points":[{"pressure":${"[".repeat(10_000)}1${"]".repeat(10_000)},"temperature":1}]}`;
    expect(readLookupText(deep, 32)).toMatchObject({
      ok: false,
      message: expect.stringMatching(/more than 32 levels deep/),
    });
    expect(readLookupText("[1,2]", 32)).toMatchObject({
      ok: false,
      issues: [{ path: [], message: "Expected an object." }],
    });
  });

  test("points that are not a list are left in the head for the schema to refuse", () => {
    expect(
      readLookupText('{"property":"oil_fvf","points":"x"}', 32),
    ).toMatchObject({ ok: true, head: { points: "x" }, count: 0 });
  });
});
