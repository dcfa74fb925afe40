// Warning codes, bits and sentences (reference: the library's own contract, README "Warnings").
import { expect, test } from "vitest";
import {
  describeWarning,
  WARNING_CODES,
  WARNING_FLAGS,
  warningsFromFlags,
} from "./index";

test("every warning has its own bit and a sentence, and bitmasks expand back to codes", () => {
  const bits = WARNING_CODES.map((c) => WARNING_FLAGS[c]);
  expect(new Set(bits).size).toBe(WARNING_CODES.length);
  for (const b of bits) expect(Math.log2(b) % 1).toBe(0);
  // the batch result stores warnings in a Uint16Array; bits from 1 << 12 up belong to the lookup layer
  expect(Math.max(...bits)).toBeLessThan(1 << 12);
  for (const c of WARNING_CODES) {
    expect(describeWarning(c).length).toBeGreaterThan(40);
    expect(warningsFromFlags(WARNING_FLAGS[c])).toEqual([c]);
  }
  expect(
    warningsFromFlags(WARNING_FLAGS.overshoot | WARNING_FLAGS.extrapolated),
  ).toEqual(["extrapolated", "overshoot"]);
  expect(warningsFromFlags(0)).toEqual([]);
});
