import { expect, test } from "vitest";
import { LOOKUP_WARNING_CODES } from "~/core/lookup";
import { WARNING_LABELS, warningLabel } from "./warning-labels";

// Every warning code the engine can give has a badge label, and no label names a code that does not exist
// (the type checks the keys; this checks the same at run time, for codes arriving as strings).
test("badge labels cover exactly the lookup's warning codes (near-bubble-point among them, from the server)", () => {
  expect(Object.keys(WARNING_LABELS).sort()).toEqual(
    [...LOOKUP_WARNING_CODES].sort(),
  );
  expect(LOOKUP_WARNING_CODES).toContain("near-bubble-point");
  expect(warningLabel("pchip-fallback")).toBe("pchip used (overshoot)");
  expect(warningLabel("a-code-from-a-newer-server")).toBe(
    "a-code-from-a-newer-server",
  );
  expect(warningLabel("toString")).toBe("toString");
});
