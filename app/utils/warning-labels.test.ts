import { expect, test } from "vitest";
import { LOOKUP_WARNING_CODES } from "~/core/lookup";
import {
  NEAR_BUBBLE_POINT,
  WARNING_LABELS,
  warningLabel,
} from "./warning-labels";

// Every warning code the engine can give has a badge label, and no label names a code that does not exist
// (the type checks the keys; this checks the same at run time, for codes arriving as strings).
test("badge labels cover exactly the engine's warning codes plus the browser's near-bubble-point flag", () => {
  expect(Object.keys(WARNING_LABELS).sort()).toEqual(
    // near-bubble-point is now one of the lookup's own codes (computed on the server)
    [...new Set<string>([...LOOKUP_WARNING_CODES, NEAR_BUBBLE_POINT])].sort(),
  );
  expect(warningLabel("pchip-fallback")).toBe("pchip used (overshoot)");
  expect(warningLabel("a-code-from-a-newer-server")).toBe(
    "a-code-from-a-newer-server",
  );
  expect(warningLabel("toString")).toBe("toString");
});
