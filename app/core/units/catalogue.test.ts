import fc from "fast-check";
import { expect, test } from "vitest";
import {
  CANONICAL_UNITS,
  DEFAULT_BAROMETRIC_PSIA,
  QUANTITIES,
  UNITS,
  convert,
  fromCanonical,
  getUnit,
  listUnits,
  toCanonical,
  type Quantity,
  type UnitId,
} from "./catalogue";
import { UnitError } from "./errors";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function expectUnitError(
  fn: () => unknown,
  code: UnitError["code"],
): UnitError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(UnitError);
    expect((error as UnitError).code).toBe(code);
    expect((error as UnitError).message.length).toBeGreaterThan(10);
    return error as UnitError;
  }
  throw new Error(`expected UnitError ${code}`);
}

// Pressure — NIST SP 811 definitions (bar = 10⁵ Pa, psi = lbf/in²); printed values from domain brief §5.
test("pressure factors: 1 bar = 14.503774 psi, 1 MPa = 145.03774 psi, 1 kPa = 0.14503774 psi (NIST SP 811; 1e-7 relative)", () => {
  expect(rel(convert(1, "pressure", "bara", "psia"), 14.503774)).toBeLessThan(
    1e-7,
  );
  expect(rel(convert(1, "pressure", "MPa", "psia"), 145.03774)).toBeLessThan(
    1e-7,
  );
  expect(rel(convert(1, "pressure", "kPa", "psia"), 0.14503774)).toBeLessThan(
    1e-7,
  );
  expect(
    rel(convert(1, "pressure", "psia", "kPa"), 6.894757293168),
  ).toBeLessThan(1e-12);
  expect(rel(convert(1, "pressure", "atm", "kPa"), 101.325)).toBeLessThan(
    1e-14,
  );
  expect(rel(convert(100, "pressure", "kPa", "bara"), 1)).toBeLessThan(1e-14);
});

test("gauge ↔ absolute: default barometric is 1 standard atmosphere (101.325 kPa = 1.01325 bar; 1e-12)", () => {
  expect(DEFAULT_BAROMETRIC_PSIA).toBeCloseTo(14.696, 3);
  expect(rel(convert(0, "pressure", "barg", "bara"), 1.01325)).toBeLessThan(
    1e-12,
  );
  expect(rel(convert(0, "pressure", "psig", "psia"), 14.695949)).toBeLessThan(
    1e-7,
  );
  expect(rel(convert(0, "pressure", "kPag", "kPa"), 101.325)).toBeLessThan(
    1e-12,
  );
  expect(rel(convert(1, "pressure", "MPag", "MPa"), 1.101325)).toBeLessThan(
    1e-12,
  );
  // psig → barg is a pure scale change when both use the same barometric pressure
  expect(
    rel(convert(100, "pressure", "psig", "barg"), 100 / 14.503773773),
  ).toBeLessThan(1e-9);
});

test("gauge ↔ absolute with a stated barometric pressure (domain §4: book convention psia = psig + 14.7)", () => {
  expect(
    convert(2620, "pressure", "psig", "psia", { barometricPsia: 14.7 }),
  ).toBeCloseTo(2634.7, 10);
  expect(
    convert(2634.7, "pressure", "psia", "psig", { barometricPsia: 14.7 }),
  ).toBeCloseTo(2620, 10);
  // psig-vs-psia at 159 psig is a ~9 % error (domain §5)
  const psia = convert(159, "pressure", "psig", "psia", {
    barometricPsia: 14.696,
  });
  expect((psia - 159) / psia).toBeGreaterThan(0.08);
  expectUnitError(
    () => convert(1, "pressure", "psig", "psia", { barometricPsia: -1 }),
    "NEGATIVE_ABSOLUTE_PRESSURE",
  );
  expectUnitError(
    () =>
      convert(1, "pressure", "psig", "psia", { barometricPsia: Number.NaN }),
    "NOT_FINITE",
  );
});

// Temperature — exact scale definitions (NIST SP 811 §4.2.1.1; K = °C + 273.15, °R = °F + 459.67).
test("temperature: 60 °F = 15.556 °C = 288.706 K = 519.67 °R; 15 °C = 59 °F; −40 °C = −40 °F (exact; 1e-3 / 1e-12)", () => {
  expect(convert(60, "temperature", "degF", "degC")).toBeCloseTo(15.556, 3);
  expect(convert(60, "temperature", "degF", "K")).toBeCloseTo(288.706, 3);
  expect(convert(60, "temperature", "degF", "degR")).toBeCloseTo(519.67, 10);
  expect(convert(15, "temperature", "degC", "degF")).toBeCloseTo(59, 12);
  expect(convert(-40, "temperature", "degC", "degF")).toBeCloseTo(-40, 12);
  expect(convert(0, "temperature", "K", "degR")).toBeCloseTo(0, 12);
  expect(convert(273.15, "temperature", "K", "degC")).toBeCloseTo(0, 12);
  expect(convert(491.67, "temperature", "degR", "degF")).toBeCloseTo(32, 12);
});

// Volume ratios — 1 bbl = 42 US gal = 5.614583 ft³ (NIST SP 811); domain §5 table.
test("gas–oil ratio: 1 scf/STB = 0.1781076 sm³/sm³; 1 Mscf/STB = 1000 scf/STB (NIST SP 811; 1e-7 relative)", () => {
  expect(
    rel(convert(1, "gas_oil_ratio", "scf/STB", "sm3/sm3"), 0.1781076),
  ).toBeLessThan(1e-6);
  expect(
    rel(convert(1, "gas_oil_ratio", "sm3/sm3", "scf/STB"), 5.614583),
  ).toBeLessThan(1e-7);
  expect(convert(1, "gas_oil_ratio", "Mscf/STB", "scf/STB")).toBe(1000);
});

test("gas FVF: rb/scf = (ft³/scf)/5.614583; rb/Mscf = 1000 × rb/scf; rm³/sm³ = ft³/scf (NIST SP 811; 1e-12)", () => {
  expect(
    rel(convert(5.614583333333333, "gas_fvf", "ft3/scf", "rb/scf"), 1),
  ).toBeLessThan(1e-12);
  expect(rel(convert(0.001, "gas_fvf", "rb/scf", "rb/Mscf"), 1)).toBeLessThan(
    1e-12,
  );
  expect(
    rel(convert(0.00685, "gas_fvf", "ft3/scf", "rm3/sm3"), 0.00685),
  ).toBeLessThan(1e-12);
  expect(convert(1.2, "oil_fvf", "rb/STB", "rm3/sm3")).toBe(1.2);
});

test("viscosity, density, compressibility factors (NIST SP 811; domain §5; 1e-7 relative)", () => {
  expect(convert(1, "viscosity", "cP", "mPa.s")).toBe(1);
  expect(rel(convert(1, "viscosity", "cP", "Pa.s"), 0.001)).toBeLessThan(1e-12);
  expect(rel(convert(1, "density", "g/cm3", "lb/ft3"), 62.42796)).toBeLessThan(
    1e-7,
  );
  expect(
    rel(convert(1, "density", "lb/ft3", "kg/m3"), 16.01846337),
  ).toBeLessThan(1e-9);
  expect(rel(convert(1, "density", "g/cm3", "kg/m3"), 1000)).toBeLessThan(
    1e-12,
  );
  // domain §5: 1 psi⁻¹ = 145.03774 MPa⁻¹ = 14.503774 bar⁻¹; 10×10⁻⁶ psi⁻¹ = 1.450×10⁻³ MPa⁻¹
  expect(
    rel(convert(1, "compressibility", "1/psi", "1/MPa"), 145.03774),
  ).toBeLessThan(1e-7);
  expect(
    rel(convert(1, "compressibility", "1/psi", "1/bar"), 14.503774),
  ).toBeLessThan(1e-7);
  expect(
    rel(convert(10, "compressibility", "1e-6/psi", "1/MPa"), 1.4503774e-3),
  ).toBeLessThan(1e-7);
});

test("every quantity has its canonical unit in the catalogue with scale 1 and offset 0", () => {
  for (const q of QUANTITIES) {
    const def = getUnit(q, CANONICAL_UNITS[q]);
    expect(def.scale).toBe(1);
    expect(def.offset).toBe(0);
    expect(def.gauge).toBe(false);
    expect(listUnits(q).length).toBe(Object.keys(UNITS[q]).length);
  }
});

// Physical ranges for round-trip values per quantity (canonical units).
const RANGES: Record<Quantity, [number, number]> = {
  pressure: [0.5, 30_000],
  temperature: [-400, 700],
  oil_fvf: [0.5, 4],
  gas_fvf: [1e-5, 0.2],
  gas_oil_ratio: [0, 20_000],
  viscosity: [0.005, 1e5],
  density: [0.01, 80],
  compressibility: [1e-7, 1e-2],
  dimensionless: [0, 3],
};

test("round trip unit A → B → A for every pair of units of every quantity (fast-check; 1e-12 relative)", () => {
  for (const q of QUANTITIES) {
    const ids = Object.keys(UNITS[q]) as UnitId<typeof q>[];
    const [lo, hi] = RANGES[q];
    fc.assert(
      fc.property(
        fc.double({ min: lo, max: hi, noNaN: true }),
        fc.constantFrom(...ids),
        fc.constantFrom(...ids),
        fc.double({ min: 10, max: 15, noNaN: true }),
        (canonical, a, b, baro) => {
          const options = { barometricPsia: baro };
          const inA = fromCanonical(canonical, q, a, options);
          const inB = convert(inA, q, a, b, options);
          const back = convert(inB, q, b, a, options);
          const scale = Math.max(
            Math.abs(inA),
            1e-9 + (q === "temperature" ? 1000 : q === "pressure" ? 30 : 0),
          );
          expect(Math.abs(back - inA) / scale).toBeLessThan(1e-12);
          expect(
            Math.abs(toCanonical(back, q, a, options) - canonical),
          ).toBeLessThanOrEqual(
            1e-12 *
              Math.max(
                Math.abs(canonical),
                q === "temperature" ? 1000 : q === "pressure" ? 30 : 1e-9,
              ),
          );
        },
      ),
      { numRuns: 300 },
    );
  }
});

test("bad input: negative absolute pressure, below absolute zero, NaN, infinity, unknown unit → UnitError", () => {
  expectUnitError(
    () => toCanonical(-1, "pressure", "psia"),
    "NEGATIVE_ABSOLUTE_PRESSURE",
  );
  expectUnitError(
    () => convert(-20, "pressure", "psig", "psia"),
    "NEGATIVE_ABSOLUTE_PRESSURE",
  );
  expectUnitError(
    () => convert(-0.5, "pressure", "bara", "bara"),
    "NEGATIVE_ABSOLUTE_PRESSURE",
  );
  expect(convert(-10, "pressure", "psig", "psia")).toBeCloseTo(4.69595, 5); // a vacuum gauge reading is fine
  expectUnitError(
    () => convert(-460, "temperature", "degF", "degC"),
    "BELOW_ABSOLUTE_ZERO",
  );
  expectUnitError(
    () => convert(-1, "temperature", "K", "degF"),
    "BELOW_ABSOLUTE_ZERO",
  );
  expectUnitError(
    () => convert(-274, "temperature", "degC", "degC"),
    "BELOW_ABSOLUTE_ZERO",
  );
  expectUnitError(
    () => fromCanonical(-500, "temperature", "degC"),
    "BELOW_ABSOLUTE_ZERO",
  );
  expectUnitError(
    () => convert(Number.NaN, "viscosity", "cP", "Pa.s"),
    "NOT_FINITE",
  );
  expectUnitError(
    () => convert(Number.POSITIVE_INFINITY, "density", "lb/ft3", "kg/m3"),
    "NOT_FINITE",
  );
  const e = expectUnitError(
    () => getUnit("pressure", "furlongs"),
    "UNKNOWN_UNIT",
  );
  expect(e.message).toContain("psia");
  expectUnitError(
    () => convert(1, "pressure", "psia", "inHg" as UnitId<"pressure">),
    "UNKNOWN_UNIT",
  );
});
