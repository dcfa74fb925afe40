/**
 * Column and block names we recognise, and the property each stands for. Matching ignores case, spaces,
 * dots, hyphens, underscores and slashes between words ("Solution GOR" = "solution-gor" = "solution_gor").
 */
import {
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
  type Quantity,
} from "../units";

export type AxisName = "pressure" | "temperature" | "bubble_point";
export type HeaderName = PropertyKey | AxisName;

/** The name the templates write, then accepted synonyms. */
export const HEADER_NAMES: Readonly<Record<HeaderName, readonly string[]>> = {
  pressure: ["pressure", "p"],
  temperature: ["temperature", "temp", "t"],
  bubble_point: [
    "bubble point",
    "bubble-point pressure",
    "bubblepoint",
    "bubble point pressure",
    "saturation pressure",
    "pb",
    "psat",
  ],
  oil_fvf: [
    "oil formation volume factor",
    "oil FVF",
    "Bo",
    "oil volume factor",
  ],
  solution_gor: [
    "solution GOR",
    "solution gas-oil ratio",
    "solution gas/oil ratio",
    "dissolved gas-oil ratio",
    "Rs",
  ],
  oil_viscosity: [
    "oil viscosity",
    "viscosity of oil",
    "live oil viscosity",
    "muo",
    "μo",
  ],
  oil_density: [
    "oil density",
    "density of oil",
    "live oil density",
    "rhoo",
    "ρo",
  ],
  gas_fvf: [
    "gas formation volume factor",
    "gas FVF",
    "Bg",
    "gas volume factor",
  ],
  gas_viscosity: ["gas viscosity", "viscosity of gas", "mug", "μg"],
  z_factor: [
    "Z factor",
    "z",
    "gas compressibility factor",
    "gas deviation factor",
    "compressibility factor",
    "gas z factor",
  ],
};

/** Quantity of every recognised name. */
export const HEADER_QUANTITIES: Readonly<Record<HeaderName, Quantity>> = {
  pressure: "pressure",
  temperature: "temperature",
  bubble_point: "pressure",
  ...PROPERTY_QUANTITIES,
};

/** Plain-words label used in messages. */
export const HEADER_LABELS: Readonly<Record<HeaderName, string>> = {
  pressure: "pressure",
  temperature: "temperature",
  bubble_point: "bubble point",
  oil_fvf: "oil formation volume factor",
  solution_gor: "solution GOR",
  oil_viscosity: "oil viscosity",
  oil_density: "oil density",
  gas_fvf: "gas formation volume factor",
  gas_viscosity: "gas viscosity",
  z_factor: "Z factor",
};

export function normalizeHeaderName(name: string): string {
  return name
    .normalize("NFKC")
    .toLowerCase()
    .replace(/[\s._\-–—/]+/g, "")
    .replace(/[μµ]/g, "mu")
    .replace(/ρ/g, "rho");
}

const LOOKUP: ReadonlyMap<string, HeaderName> = (() => {
  const map = new Map<string, HeaderName>();
  for (const [key, names] of Object.entries(HEADER_NAMES) as [
    HeaderName,
    readonly string[],
  ][]) {
    for (const name of names) map.set(normalizeHeaderName(name), key);
  }
  return map;
})();

/** The property or axis a header name stands for, or null when we do not know it. */
export function resolveHeaderName(name: string): HeaderName | null {
  return LOOKUP.get(normalizeHeaderName(name)) ?? null;
}

export function isPropertyName(name: HeaderName): name is PropertyKey {
  return (PROPERTY_KEYS as readonly string[]).includes(name);
}
