import { expect, test } from "vitest";
import { UNITS, QUANTITIES, type Quantity } from "./catalogue";
import { UnitError } from "./errors";
import { parseHeaderUnit, parseUnitLabel } from "./parse-unit-label";

// Labels as written in laboratory spreadsheets (issue 4 list plus common variants) → catalogue unit.
const CASES: ReadonlyArray<[string, Quantity, string]> = [
  ["psia", "pressure", "psia"],
  ["PSIA", "pressure", "psia"],
  ["psi(a)", "pressure", "psia"],
  ["psi (a)", "pressure", "psia"],
  ["psi abs", "pressure", "psia"],
  ["psig", "pressure", "psig"],
  ["psi(g)", "pressure", "psig"],
  ["bar a", "pressure", "bara"],
  ["bar(a)", "pressure", "bara"],
  ["bara", "pressure", "bara"],
  ["barg", "pressure", "barg"],
  ["bar g", "pressure", "barg"],
  ["kPa", "pressure", "kPa"],
  ["kPa(g)", "pressure", "kPag"],
  ["MPa", "pressure", "MPa"],
  ["MPag", "pressure", "MPag"],
  ["degF", "temperature", "degF"],
  ["°F", "temperature", "degF"],
  ["deg F", "temperature", "degF"],
  ["º F", "temperature", "degF"],
  ["℉", "temperature", "degF"],
  ["F", "temperature", "degF"],
  ["deg C", "temperature", "degC"],
  ["°C", "temperature", "degC"],
  ["degrees C", "temperature", "degC"],
  ["K", "temperature", "K"],
  ["°R", "temperature", "degR"],
  ["cp", "viscosity", "cP"],
  ["cP", "viscosity", "cP"],
  ["mPa.s", "viscosity", "mPa.s"],
  ["mPa·s", "viscosity", "mPa.s"],
  ["mPa s", "viscosity", "mPa.s"],
  ["Pa.s", "viscosity", "Pa.s"],
  ["scf/stb", "gas_oil_ratio", "scf/STB"],
  ["SCF/STB", "gas_oil_ratio", "scf/STB"],
  ["scf/bbl", "gas_oil_ratio", "scf/STB"],
  ["Mscf/STB", "gas_oil_ratio", "Mscf/STB"],
  ["Sm3/Sm3", "gas_oil_ratio", "sm3/sm3"],
  ["sm³/sm³", "gas_oil_ratio", "sm3/sm3"],
  ["rb/stb", "oil_fvf", "rb/STB"],
  ["RB/STB", "oil_fvf", "rb/STB"],
  ["bbl/STB", "oil_fvf", "rb/STB"],
  ["ft3/scf", "gas_fvf", "ft3/scf"],
  ["ft³/scf", "gas_fvf", "ft3/scf"],
  ["cf/scf", "gas_fvf", "ft3/scf"],
  ["rb/scf", "gas_fvf", "rb/scf"],
  ["rb/Mscf", "gas_fvf", "rb/Mscf"],
  ["bbl/mcf", "gas_fvf", "rb/Mscf"],
  ["lb/ft3", "density", "lb/ft3"],
  ["lb/ft³", "density", "lb/ft3"],
  ["kg/m3", "density", "kg/m3"],
  ["g/cc", "density", "g/cm3"],
  ["g/cm³", "density", "g/cm3"],
  ["gm/cc", "density", "g/cm3"],
  ["1/psi", "compressibility", "1/psi"],
  ["psi-1", "compressibility", "1/psi"],
  ["psi⁻¹", "compressibility", "1/psi"],
  ["1/bar", "compressibility", "1/bar"],
  ["1/MPa", "compressibility", "1/MPa"],
  ["10^-6/psi", "compressibility", "1e-6/psi"],
  ["10⁻⁶ psi⁻¹", "compressibility", "1e-6/psi"],
  ["1/psi x 10^-6", "compressibility", "1e-6/psi"],
  ["x10-6 1/psi", "compressibility", "1e-6/psi"],
  ["dimensionless", "dimensionless", "-"],
];

test.each(CASES)("label %j → %s %s", (label, quantity, unit) => {
  const parsed = parseUnitLabel(label);
  expect(parsed.quantity).toBe(quantity);
  expect(parsed.unit).toBe(unit);
  expect(parsed.warnings).toEqual([]);
  // the same label with the quantity stated gives the same unit
  expect(parseUnitLabel(label, { quantity }).unit).toBe(unit);
});

test("every catalogue unit id parses back to itself when the quantity is given", () => {
  for (const q of QUANTITIES) {
    for (const id of Object.keys(UNITS[q])) {
      const parsed = parseUnitLabel(id, { quantity: q });
      expect(parsed.unit).toBe(id);
    }
  }
});

function errorOf(fn: () => unknown): UnitError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(UnitError);
    return error as UnitError;
  }
  throw new Error("expected a UnitError");
}

test('"psi" and "bar" alone are rejected by default and read as absolute with a warning only on request', () => {
  const e = errorOf(() => parseUnitLabel("psi"));
  expect(e.code).toBe("AMBIGUOUS_UNIT");
  expect(e.message).toContain("psia");
  expect(e.message).toContain("psig");
  expect(
    errorOf(() => parseUnitLabel("PSI", { quantity: "pressure" })).code,
  ).toBe("AMBIGUOUS_UNIT");
  expect(errorOf(() => parseUnitLabel("bar")).message).toContain("barg");
  const lenient = parseUnitLabel("psi", { barePressure: "absolute" });
  expect(lenient.unit).toBe("psia");
  expect(lenient.warnings).toHaveLength(1);
  expect(lenient.warnings[0]).toMatch(/absolute/);
  expect(parseUnitLabel("bar", { barePressure: "absolute" }).unit).toBe("bara");
  expect(
    errorOf(() => parseUnitLabel("psi", { quantity: "temperature" })).code,
  ).toBe("WRONG_QUANTITY");
});

test("labels shared by several quantities need the quantity", () => {
  const e = errorOf(() => parseUnitLabel("m3/m3"));
  expect(e.code).toBe("AMBIGUOUS_UNIT");
  expect(e.details["candidates"]).toEqual([
    "oil_fvf",
    "gas_fvf",
    "gas_oil_ratio",
  ]);
  expect(parseUnitLabel("m3/m3", { quantity: "gas_oil_ratio" }).unit).toBe(
    "sm3/sm3",
  );
  expect(parseUnitLabel("rm3/sm3", { quantity: "oil_fvf" }).unit).toBe(
    "rm3/sm3",
  );
  expect(parseUnitLabel("rm3/sm3", { quantity: "gas_fvf" }).unit).toBe(
    "rm3/sm3",
  );
  expect(errorOf(() => parseUnitLabel("rm3/sm3")).code).toBe("AMBIGUOUS_UNIT");
});

test("unknown, empty, wrong-quantity and millipascal labels → typed errors with clear messages", () => {
  const unknown = errorOf(() => parseUnitLabel("furlongs/fortnight"));
  expect(unknown.code).toBe("UNKNOWN_UNIT");
  expect(unknown.message).toContain("furlongs/fortnight");
  expect(errorOf(() => parseUnitLabel("  ")).code).toBe("MISSING_UNIT");
  const wrong = errorOf(() =>
    parseUnitLabel("rb/stb", { quantity: "gas_fvf" }),
  );
  expect(wrong.code).toBe("WRONG_QUANTITY");
  expect(wrong.message).toMatch(
    /oil .*formation volume factor.*not of gas formation volume factor/,
  );
  expect(errorOf(() => parseUnitLabel("mPa")).code).toBe("AMBIGUOUS_UNIT");
  expect(errorOf(() => parseUnitLabel("10^-6/bar")).code).toBe("UNKNOWN_UNIT");
  expect(
    errorOf(() => parseUnitLabel("10^-6/psi", { quantity: "pressure" })).code,
  ).toBe("WRONG_QUANTITY");
});

test("column headers: name and unit split from brackets or a trailing comma", () => {
  expect(parseHeaderUnit("Pressure (psia)")).toMatchObject({
    name: "Pressure",
    unit: "psia",
    quantity: "pressure",
  });
  expect(parseHeaderUnit("Pressure (psi(a))")).toMatchObject({
    name: "Pressure",
    unit: "psia",
  });
  expect(parseHeaderUnit("Bo [rb/stb]")).toMatchObject({
    name: "Bo",
    unit: "rb/STB",
  });
  expect(parseHeaderUnit("Viscosity, cp")).toMatchObject({
    name: "Viscosity",
    unit: "cP",
  });
  expect(
    parseHeaderUnit("Rs (m3/m3)", { quantity: "gas_oil_ratio" }),
  ).toMatchObject({ unit: "sm3/sm3" });
  expect(errorOf(() => parseHeaderUnit("Pressure")).code).toBe("MISSING_UNIT");
  expect(errorOf(() => parseHeaderUnit("Pressure (psi)")).code).toBe(
    "AMBIGUOUS_UNIT",
  );
});
