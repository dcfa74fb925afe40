import { expect, test } from "vitest";
import { LookupBody, parseLookupBody, zodIssues } from "./schemas";

// The fast check of lookup bodies must accept and refuse exactly what the documented zod schema does.
const cases: unknown[] = [
  { property: "oil_fvf", points: [{ pressure: 3000, temperature: 212 }] },
  {
    property: "oil_fvf",
    points: [{ pressure: 3000, temperature: 212 }],
    method: "newton",
    degree: [3, 2],
    units: "metric",
    extrapolate: true,
  },
  { property: "oil_fvf", points: [{ pressure: "3000", temperature: 212 }] },
  { property: "oil_fvf", points: [{ pressure: 3000 }] },
  {
    property: "oil_fvf",
    points: [{ pressure: 3000, temperature: 212, depth: 1 }],
  },
  { property: "oil_fvf", points: [null] },
  { property: "oil_fvf", points: [] },
  { property: "porosity", points: [{ pressure: 3000, temperature: 212 }] },
  {
    property: "oil_fvf",
    points: [{ pressure: 3000, temperature: 212 }],
    extra: 1,
  },
  { property: "oil_fvf", points: [{ pressure: Infinity, temperature: 212 }] },
];

test.each(cases.map((c, i) => [i, c] as const))(
  "case %i: same verdict and paths as the zod schema",
  (_i, input) => {
    const fast = parseLookupBody(input);
    const reference = LookupBody.safeParse(input);
    expect(fast.success).toBe(reference.success);
    if (!fast.success && !reference.success) {
      expect(fast.issues.map((x) => x.path)).toEqual(
        zodIssues(reference.error).map((x) => x.path),
      );
    }
    if (fast.success && reference.success)
      expect(fast.data).toEqual(reference.data);
  },
);
