import { expect, test } from "vitest";
import {
  CUBIC_FOOT_PER_BARREL,
  CUBIC_METRE_PER_BARREL,
  CUBIC_METRE_PER_CUBIC_FOOT,
  GAS_CONSTANT_FIELD,
  KG_PER_M3_PER_LB_PER_FT3,
  LB_PER_FT3_PER_G_PER_CM3,
  PASCAL_PER_PSI,
  PSI_PER_ATMOSPHERE,
} from "./definitions";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

// Source for every check in this file: NIST SP 811 (2008) appendix B and the 1959 international yard and
// pound definitions (1 in = 0.0254 m, 1 lb = 0.45359237 kg, g = 9.80665 m/s², 1 gal = 231 in³,
// 1 bbl = 42 gal, 1 atm = 101 325 Pa). Expected values are the printed digits of domain brief §4 C24 and §5.

test("1 psi = 6894.757293168 Pa (NIST SP 811; C24; tolerance 1e-12 relative)", () => {
  expect(rel(PASCAL_PER_PSI, 6894.757293168)).toBeLessThan(1e-12);
  // the definition itself: lbf / in²
  expect(PASCAL_PER_PSI).toBe((0.45359237 * 9.80665) / 0.0254 ** 2);
});

test("1 bbl = 42 US gal = 0.158987294928 m³ (NIST SP 811; C24; tolerance 1e-14 relative)", () => {
  expect(rel(CUBIC_METRE_PER_BARREL, 0.158987294928)).toBeLessThan(1e-14);
});

test("1 ft³ = 0.028316846592 m³ and 1 bbl = 5.614583 ft³ (NIST SP 811; domain §5; 1e-14 / 1e-7 relative)", () => {
  expect(rel(CUBIC_METRE_PER_CUBIC_FOOT, 0.028316846592)).toBeLessThan(1e-14);
  expect(rel(CUBIC_FOOT_PER_BARREL, 5.614583)).toBeLessThan(1e-7);
  // 9702 in³ / 1728 in³ per ft³ exactly
  expect(rel(CUBIC_FOOT_PER_BARREL, 9702 / 1728)).toBeLessThan(1e-14);
});

test("1 lb/ft³ = 16.01846337 kg/m³ and 1 g/cm³ = 62.42796 lb/ft³ (NIST SP 811; C24; 1e-9 / 1e-7 relative)", () => {
  expect(rel(KG_PER_M3_PER_LB_PER_FT3, 16.01846337)).toBeLessThan(1e-9);
  expect(rel(LB_PER_FT3_PER_G_PER_CM3, 62.42796)).toBeLessThan(1e-7);
});

test("1 atm = 14.695949 psi (NIST SP 811, 1 atm = 101 325 Pa; domain §5; 1e-7 relative)", () => {
  expect(rel(PSI_PER_ATMOSPHERE, 14.695949)).toBeLessThan(1e-7);
});

test("R = 10.7316 psia·ft³/(lbmol·°R) from the exact SI value 8.314462618 J/(mol·K) (domain §5; 1e-5 relative)", () => {
  expect(rel(GAS_CONSTANT_FIELD, 10.7316)).toBeLessThan(1e-5);
});
