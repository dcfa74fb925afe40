// The lookup page's choices in its address: read with defaults, written back without losing other parameters.
import { expect, test } from "vitest";
import {
  readLookupChoices,
  unitsInAddress,
  writeLookupChoices,
} from "./lookup-params";

const read = (query: string, account: "field" | "metric" = "field") =>
  readLookupChoices(new URLSearchParams(query), account);

test("an address that says nothing: the account's unit system and the page's defaults", () => {
  expect(read("", "metric")).toEqual({
    sampleId: null,
    units: "metric",
    method: "auto",
    degree: [3, 3],
    extrapolate: false,
    properties: ["oil_fvf", "solution_gor", "oil_viscosity"],
  });
  expect(unitsInAddress(new URLSearchParams(""))).toBeNull();
});

test("an address with every choice overrides the account", () => {
  expect(
    read(
      "sample=7&units=metric&method=newton&degree=2,4&extrapolate=1&property=gas_fvf&property=oil_fvf",
    ),
  ).toEqual({
    sampleId: 7,
    units: "metric",
    method: "newton",
    degree: [2, 4],
    extrapolate: true,
    // in the catalogue's order
    properties: ["oil_fvf", "gas_fvf"],
  });
});

test("values that are not choices are ignored", () => {
  expect(
    read(
      "sample=0&units=imperial&method=cubic&degree=3&extrapolate=yes&property=nope",
    ),
  ).toEqual({
    sampleId: null,
    units: "field",
    method: "auto",
    degree: [3, 3],
    extrapolate: false,
    properties: [],
  });
  expect(read("sample=-3").sampleId).toBeNull();
  expect(read("sample=1e3").sampleId).toBeNull();
});

test("written back: other parameters kept, defaults left out, no property written as one empty value", () => {
  const start = new URLSearchParams("revision=2&sample=1");
  const next = writeLookupChoices(start, {
    units: "metric",
    method: "pchip",
    extrapolate: true,
    properties: ["z_factor"],
  });
  expect(next.toString()).toBe(
    "revision=2&sample=1&units=metric&method=pchip&extrapolate=1&property=z_factor",
  );
  expect(start.toString()).toBe("revision=2&sample=1");
  const back = writeLookupChoices(next, {
    method: "auto",
    extrapolate: false,
    properties: [],
    degree: [1, 2],
  });
  expect(back.toString()).toBe(
    "revision=2&sample=1&units=metric&degree=1%2C2&property=",
  );
  expect(readLookupChoices(back, "field")).toMatchObject({
    method: "auto",
    extrapolate: false,
    properties: [],
    degree: [1, 2],
    units: "metric",
  });
  expect(writeLookupChoices(back, { sampleId: 9 }).get("sample")).toBe("9");
});
