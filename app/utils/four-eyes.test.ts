import { expect, test } from "vitest";
import { describeFourEyes, fourEyesRequired } from "./four-eyes";

test("automatic mode is on with two or more active lab leads, off with fewer; on and off are fixed", () => {
  expect([0, 1, 2, 3].map((n) => fourEyesRequired("auto", n))).toEqual([
    false,
    false,
    true,
    true,
  ]);
  expect([0, 1, 5].map((n) => fourEyesRequired("on", n))).toEqual([
    true,
    true,
    true,
  ]);
  expect([0, 1, 5].map((n) => fourEyesRequired("off", n))).toEqual([
    false,
    false,
    false,
  ]);
  expect(
    describeFourEyes({ mode: "auto", activeLabLeads: 1, required: false }),
  ).toBe("Off (automatic: 1 active lab lead)");
  expect(
    describeFourEyes({ mode: "on", activeLabLeads: 1, required: true }),
  ).toBe("On (set by an administrator)");
});
