import { describe, expect, test } from "vitest";
import {
  describeWarning,
  WARNING_CODES,
  WARNING_FLAGS,
} from "../interpolation";
import {
  describeWarningCode,
  expandWarningFlags,
  LOOKUP_WARNING_CODES,
  lookupWarningsFromFlags,
  W_PCHIP_FALLBACK,
} from "./warnings";

describe("warning texts", () => {
  test("every code has a plain sentence; the engine's codes keep the engine's words", () => {
    for (const code of LOOKUP_WARNING_CODES)
      expect(describeWarningCode(code)).toMatch(/^[A-Z].{40,}\.$/);
    for (const code of WARNING_CODES)
      expect(describeWarningCode(code)).toBe(describeWarning(code));
  });

  test("masks expand in the engine's order, with the fallback last; the fallback sentence replaces the overshoot one", () => {
    const flags =
      WARNING_FLAGS.overshoot | WARNING_FLAGS.extrapolated | W_PCHIP_FALLBACK;
    expect(lookupWarningsFromFlags(flags)).toEqual([
      "extrapolated",
      "overshoot",
      "pchip-fallback",
    ]);
    expect(expandWarningFlags(flags).messages).toEqual([
      describeWarning("extrapolated"),
      describeWarningCode("pchip-fallback"),
    ]);
    expect(expandWarningFlags(WARNING_FLAGS.overshoot).messages).toEqual([
      describeWarning("overshoot"),
    ]);
    expect(expandWarningFlags(0).warnings).toEqual([]);
    expect(expandWarningFlags(flags)).toBe(expandWarningFlags(flags)); // shared, not rebuilt
  });

  test("the fallback bit lies above every engine bit", () => {
    for (const bit of Object.values(WARNING_FLAGS))
      expect(bit & W_PCHIP_FALLBACK).toBe(0);
    expect(Math.max(...Object.values(WARNING_FLAGS))).toBeLessThan(
      W_PCHIP_FALLBACK,
    );
  });
});
