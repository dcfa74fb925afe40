import { expect, test } from "vitest";
import { QUANTITIES } from "./catalogue";
import {
  PROPERTIES,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  keyWithAbbreviation,
  quotedHeader,
} from "./properties";

test("the catalogue has one entry for every property key and no other", () => {
  expect(Object.keys(PROPERTIES).sort()).toEqual([...PROPERTY_KEYS].sort());
  for (const key of PROPERTY_KEYS) {
    const p = PROPERTIES[key];
    expect(QUANTITIES as readonly string[], key).toContain(p.quantity);
    for (const text of [
      p.name,
      p.symbol,
      p.short,
      p.phrase,
      p.header,
      p.subject,
    ])
      expect(text.trim(), key).not.toBe("");
    expect(PROPERTY_QUANTITIES[key]).toBe(p.quantity);
  }
});

test("names are distinct, so no two properties read alike", () => {
  for (const field of [
    "name",
    "symbol",
    "short",
    "phrase",
    "header",
  ] as const) {
    const values = PROPERTY_KEYS.map((k) => PROPERTIES[k][field]);
    expect(new Set(values).size, field).toBe(values.length);
  }
});

test("the words each place shows", () => {
  expect(PROPERTIES.oil_fvf).toMatchObject({
    name: "Oil formation volume factor",
    symbol: "Bo",
    phrase: "oil formation volume factor (Bo)",
    header: "oil formation volume factor",
  });
  expect(PROPERTIES.z_factor).toMatchObject({
    symbol: "Z",
    short: "z",
    subject: "Z",
    column: { name: "z-factor", word: "z" },
  });
  expect(PROPERTIES.oil_density.column).toBeNull();
  expect(PROPERTY_KEYS.map(keyWithAbbreviation).join(", ")).toBe(
    "oil_fvf (Bo), solution_gor (Rs), oil_viscosity, oil_density, gas_fvf (Bg), gas_viscosity, z_factor",
  );
  expect(quotedHeader("solution_gor")).toBe('"solution GOR" (Rs)');
  expect(quotedHeader("z_factor")).toBe('"Z factor"');
});
