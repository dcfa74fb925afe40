/**
 * Column and block names we recognise (aliases of the catalogue's names), and the property each stands for. Matching ignores case, spaces,
 * dots, hyphens, underscores and slashes between words ("Solution GOR" = "solution-gor" = "solution_gor").
 */
import {
  PROPERTIES,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
  type Quantity,
} from "../units";

type AxisName = "pressure" | "temperature" | "bubble_point";
export type HeaderName = PropertyKey | AxisName;

/** The axes' names as the templates write them and as messages say them. */
const AXIS_LABELS: Readonly<Record<AxisName, string>> = {
  pressure: "pressure",
  temperature: "temperature",
  bubble_point: "bubble point",
};

/** The name the templates write (the catalogue's `header` for a property), then accepted synonyms. */
export const HEADER_NAMES: Readonly<Record<HeaderName, readonly string[]>> = {
  pressure: [AXIS_LABELS.pressure, "p"],
  temperature: [AXIS_LABELS.temperature, "temp", "t"],
  bubble_point: [
    AXIS_LABELS.bubble_point,
    "bubble-point pressure",
    "bubblepoint",
    "bubble point pressure",
    "saturation pressure",
    "pb",
    "psat",
  ],
  oil_fvf: [PROPERTIES.oil_fvf.header, "oil FVF", "Bo", "oil volume factor"],
  solution_gor: [
    PROPERTIES.solution_gor.header,
    "solution gas-oil ratio",
    "solution gas/oil ratio",
    "dissolved gas-oil ratio",
    "Rs",
  ],
  oil_viscosity: [
    PROPERTIES.oil_viscosity.header,
    "viscosity of oil",
    "live oil viscosity",
    "muo",
    "μo",
  ],
  oil_density: [
    PROPERTIES.oil_density.header,
    "density of oil",
    "live oil density",
    "rhoo",
    "ρo",
  ],
  gas_fvf: [PROPERTIES.gas_fvf.header, "gas FVF", "Bg", "gas volume factor"],
  gas_viscosity: [
    PROPERTIES.gas_viscosity.header,
    "viscosity of gas",
    "mug",
    "μg",
  ],
  z_factor: [
    PROPERTIES.z_factor.header,
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

/** Plain-words label used in messages: the axis name, or the catalogue's `header` for a property. */
export const HEADER_LABELS: Readonly<Record<HeaderName, string>> = {
  ...AXIS_LABELS,
  ...(Object.fromEntries(
    PROPERTY_KEYS.map((k) => [k, PROPERTIES[k].header]),
  ) as Record<PropertyKey, string>),
};

function normalizeHeaderName(name: string): string {
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
