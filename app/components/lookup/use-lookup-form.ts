import { useState } from "react";
import type { Method } from "~/core/interpolation";
import {
  outputPressureUnit,
  type OutputSystem,
  type PressureBasis,
  type PropertyKey,
  unitLabel,
} from "~/core/units";
import type { SampleSummary } from "~/utils/api/client";
import {
  depletionPath,
  parseConditionList,
  parseNumber,
  type Condition,
} from "~/utils/conditions";
import type { SavedLookupSet } from "./saved-sets";
import type { LookupQuery } from "./use-lookup-run";

/** How the conditions are entered: one pair, a pasted list, or a depletion path. */
export type ConditionMode = "single" | "list" | "path";
export type LookupMethodChoice = "auto" | Method;

const DEFAULT_PROPERTIES: PropertyKey[] = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
];
/** The conditions offered at first, in each unit system (switching systems offers the other's). */
const SINGLE_DEFAULTS: Record<OutputSystem, SinglePoint> = {
  field: { pressure: "3250", temperature: "212" },
  metric: { pressure: "224", temperature: "100" },
};
const PATH_DEFAULTS: Record<OutputSystem, PathFields> = {
  field: { from: "5000", to: "500", step: "250", temperature: "212" },
  metric: { from: "345", to: "35", step: "15", temperature: "100" },
};

type SinglePoint = { pressure: string; temperature: string };
type PathFields = {
  from: string;
  to: string;
  step: string;
  temperature: string;
};

/**
 * The state of the lookup form, as typed: the sample, the properties, the conditions in one of three modes, the
 * method (with the Newton degree), the unit system and whether to extrapolate. `query` reads it into a lookup
 * (or says what is missing); `changeUnits` offers the other system's example conditions; `applySet` fills the
 * form from a saved set (its conditions are in field units: the caller switches to field units too).
 */
export function useLookupForm({
  samples,
  requestedSampleId,
  unitSystem,
}: {
  samples: readonly SampleSummary[];
  /** ?sample=N, when given. */
  requestedSampleId: number | null;
  unitSystem: OutputSystem;
}) {
  const [sampleId, setSampleId] = useState<number | null>(
    requestedSampleId ||
      samples.find((s) => s.approvedRevision !== null)?.id ||
      null,
  );
  const [properties, setProperties] =
    useState<PropertyKey[]>(DEFAULT_PROPERTIES);
  const [mode, setMode] = useState<ConditionMode>("single");
  const [single, setSingle] = useState<SinglePoint>(SINGLE_DEFAULTS.field);
  const [list, setList] = useState("");
  const [path, setPath] = useState<PathFields>(PATH_DEFAULTS.field);
  const [method, setMethod] = useState<LookupMethodChoice>("auto");
  const [degree, setDegree] = useState<[number, number]>([3, 3]);
  const [units, setUnits] = useState<OutputSystem>(unitSystem);
  const [extrapolate, setExtrapolate] = useState(false);
  const [pressureBasis, setPressureBasis] = useState<PressureBasis>("absolute");

  const sample = samples.find((s) => s.id === sampleId) ?? null;

  function changeUnits(next: OutputSystem) {
    setUnits(next);
    if (next !== units) {
      setSingle(SINGLE_DEFAULTS[next]);
      setPath(PATH_DEFAULTS[next]);
    }
  }

  /** The conditions as entered, or what is wrong with them. */
  function conditions(): Condition[] | string {
    if (mode === "single") {
      const pressure = parseNumber(single.pressure);
      const temperature = parseNumber(single.temperature);
      if (pressure === null || temperature === null)
        return "Enter a pressure and a temperature.";
      return [{ pressure, temperature }];
    }
    const parsed =
      mode === "list"
        ? parseConditionList(list)
        : depletionPath(
            parseNumber(path.from) ?? NaN,
            parseNumber(path.to) ?? NaN,
            parseNumber(path.step) ?? NaN,
            parseNumber(path.temperature) ?? NaN,
          );
    return parsed.ok ? parsed.conditions : parsed.error;
  }

  /** The lookup the form asks for, or what is missing. */
  function query(revision: number | undefined): LookupQuery | string {
    const conds = conditions();
    if (typeof conds === "string") return conds;
    if (!sample) return "Choose a sample.";
    if (properties.length === 0) return "Choose at least one property.";
    return {
      sampleId: sample.id,
      properties,
      conditions: conds,
      method,
      degree,
      units,
      pressureBasis,
      extrapolate,
      revision,
    };
  }

  /** "Save as set": what the form would save under `name`, or null while its conditions or sample are missing. */
  function setToSave(name: string) {
    const conds = conditions();
    if (typeof conds === "string" || !sample) return null;
    return {
      name,
      sampleId: sample.id,
      properties,
      units,
      pressureBasis,
      method,
      degree: method === "newton" ? degree : null,
      conditions: conds,
    };
  }

  function applySet(set: SavedLookupSet) {
    setSampleId(set.sampleId);
    setProperties(set.properties);
    setMethod(set.method as LookupMethodChoice);
    if (Array.isArray(set.degree)) setDegree(set.degree);
    setMode("list");
    setList(
      set.conditions
        .map((c) => `${c.pressurePsia}\t${c.temperatureF}`)
        .join("\n"),
    );
  }

  return {
    sample,
    sampleId,
    setSampleId,
    properties,
    setProperties,
    mode,
    setMode,
    single,
    setSingle,
    list,
    setList,
    path,
    setPath,
    method,
    setMethod,
    degree,
    setDegree,
    units,
    changeUnits,
    extrapolate,
    setExtrapolate,
    pressureBasis,
    setPressureBasis,
    unitLabels: {
      pressure: outputPressureUnit(units, pressureBasis).symbol,
      temperature: unitLabel(units, "temperature"),
    },
    query,
    setToSave,
    applySet,
  };
}

export type LookupFormState = ReturnType<typeof useLookupForm>;
