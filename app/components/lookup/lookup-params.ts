/*
 * The lookup page's choices in its address (?sample=3&units=metric&method=newton&degree=2,3&extrapolate=1
 * &property=oil_fvf&property=solution_gor): a reload or a shared link shows the same page, and choosing on the
 * page never changes the account. What the address leaves out is the default: the account's unit system, the
 * automatic method with degree [3, 3], no extrapolation, Bo, Rs and oil viscosity. Pure and client-safe.
 */
import type { Method } from "~/core/interpolation";
import {
  isOutputSystem,
  PROPERTY_KEYS,
  type OutputSystem,
  type PropertyKey,
} from "~/core/units";

export type LookupMethodChoice = "auto" | Method;

const METHOD_CHOICES: readonly LookupMethodChoice[] = [
  "auto",
  "newton",
  "pchip",
  "linear",
];
const DEFAULT_PROPERTIES: readonly PropertyKey[] = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
];
const DEFAULT_DEGREE: [number, number] = [3, 3];

export type LookupChoices = {
  /** null when the address names no sample. */
  sampleId: number | null;
  units: OutputSystem;
  method: LookupMethodChoice;
  degree: [number, number];
  extrapolate: boolean;
  properties: PropertyKey[];
};

/** The unit system the address asks for, or null when it says nothing (or something else). */
export function unitsInAddress(params: URLSearchParams): OutputSystem | null {
  const units = params.get("units");
  return isOutputSystem(units) ? units : null;
}

/**
 * The choices of the address; `accountUnits` where it names no unit system. Values that are not choices are
 * ignored. The degree is read as typed (whole numbers 0–99) so a half-typed degree stays on screen; the lookup
 * service says what degree it accepts.
 */
export function readLookupChoices(
  params: URLSearchParams,
  accountUnits: OutputSystem,
): LookupChoices {
  const sample = params.get("sample") ?? "";
  const method = params.get("method");
  const degree = /^(\d{1,2}),(\d{1,2})$/.exec(params.get("degree") ?? "");
  return {
    sampleId: /^[1-9]\d{0,14}$/.test(sample) ? Number(sample) : null,
    units: unitsInAddress(params) ?? accountUnits,
    method: METHOD_CHOICES.find((m) => m === method) ?? "auto",
    degree: degree ? [Number(degree[1]), Number(degree[2])] : DEFAULT_DEGREE,
    extrapolate: params.get("extrapolate") === "1",
    properties: params.has("property")
      ? PROPERTY_KEYS.filter((p) => params.getAll("property").includes(p))
      : [...DEFAULT_PROPERTIES],
  };
}

/** The address with `patch` written into it; other parameters (e.g. ?revision) are kept. */
export function writeLookupChoices(
  params: URLSearchParams,
  patch: Partial<LookupChoices>,
): URLSearchParams {
  const next = new URLSearchParams(params);
  if (patch.sampleId !== undefined)
    if (patch.sampleId === null) next.delete("sample");
    else next.set("sample", String(patch.sampleId));
  if (patch.units) next.set("units", patch.units);
  if (patch.method)
    if (patch.method === "auto") next.delete("method");
    else next.set("method", patch.method);
  if (patch.degree) next.set("degree", patch.degree.join(","));
  if (patch.extrapolate !== undefined)
    if (patch.extrapolate) next.set("extrapolate", "1");
    else next.delete("extrapolate");
  if (patch.properties) {
    next.delete("property");
    // none chosen is written as one empty value, so the defaults do not come back
    if (patch.properties.length === 0) next.append("property", "");
    for (const p of patch.properties) next.append("property", p);
  }
  return next;
}
