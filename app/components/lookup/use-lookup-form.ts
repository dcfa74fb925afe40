import { useState } from "react";
import { useSearchParams } from "react-router";
import {
  outputPressureUnit,
  type OutputSystem,
  type PressureBasis,
  toOutputPressure,
  toOutputTemperature,
  unitLabel,
} from "~/core/units";
import { roundSignificant } from "~/core/format";
import type { SampleSummary } from "~/utils/api/client";
import {
  depletionPath,
  parseConditionList,
  parseNumber,
  type Condition,
} from "~/utils/conditions";
import {
  readLookupChoices,
  writeLookupChoices,
  type LookupChoices,
} from "./lookup-params";
import type { SavedLookupSet } from "./saved-sets";
import type { LookupQuery } from "./use-lookup-run";

export type { LookupMethodChoice } from "./lookup-params";

/** How the conditions are entered: one pair, a pasted list, or a depletion path. */
export type ConditionMode = "single" | "list" | "path";

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
 * The state of the lookup form. The choices (sample, properties, method and Newton degree, unit system,
 * extrapolation) live in the page's address (lookup-params.ts), starting from the account's unit system where
 * it names none; choosing never changes the account. The conditions, in one of three modes, are typed state.
 * `query` reads it into a lookup (or says what is missing); a change of unit system offers the other system's
 * example conditions; `applySet` fills the form from a saved set, its conditions converted to the page's units.
 */
export function useLookupForm({
  samples,
  accountUnits,
}: {
  samples: readonly SampleSummary[];
  /** The account's unit system: the page's while its address names none. */
  accountUnits: OutputSystem;
}) {
  const [params, setParams] = useSearchParams();
  // The choices as shown: read from the address, and set at once when the person chooses (the address follows a
  // moment later; a controlled input waiting for it would lose keystrokes). A change of address from elsewhere
  // (back, forward, a link) is read again while rendering.
  const search = params.toString();
  const [choices, setChoices] = useState(() =>
    readLookupChoices(params, accountUnits),
  );
  // not kept in the address: a gauge lookup is asked for on purpose, each time
  const [pressureBasis, setPressureBasis] = useState<PressureBasis>("absolute");
  // the address at the last render, and the one last written (which the router shows a moment later)
  const [shown, setShown] = useState(search);
  const [written, setWritten] = useState(search);
  if (search !== shown) {
    setShown(search);
    if (search !== written) {
      setWritten(search);
      setChoices(readLookupChoices(params, accountUnits));
    }
  }
  const { properties, method, degree, units, extrapolate } = choices;
  const sampleId =
    choices.sampleId ||
    samples.find((s) => s.approvedRevision !== null)?.id ||
    null;
  const choose = (patch: Partial<LookupChoices>) => {
    const next = writeLookupChoices(new URLSearchParams(written), patch);
    setChoices({ ...choices, ...patch });
    setWritten(next.toString());
    setParams(next, { replace: true, preventScrollReset: true });
  };

  const [mode, setMode] = useState<ConditionMode>("single");
  const [single, setSingle] = useState<SinglePoint>(SINGLE_DEFAULTS[units]);
  const [list, setList] = useState("");
  const [path, setPath] = useState<PathFields>(PATH_DEFAULTS[units]);
  // the unit system the example conditions were offered in; adjusted while rendering when the address changes it
  const [typedUnits, setTypedUnits] = useState(units);
  if (typedUnits !== units) {
    setTypedUnits(units);
    setSingle(SINGLE_DEFAULTS[units]);
    setPath(PATH_DEFAULTS[units]);
  }

  const sample = samples.find((s) => s.id === sampleId) ?? null;

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
      method,
      degree: method === "newton" ? degree : null,
      extrapolate,
      pressureBasis,
      conditions: conds,
    };
  }

  function applySet(set: SavedLookupSet) {
    choose({
      sampleId: set.sampleId,
      properties: set.properties,
      method: set.method as LookupChoices["method"],
      ...(Array.isArray(set.degree) ? { degree: set.degree } : {}),
      extrapolate: set.extrapolate,
    });
    setMode("list");
    // saved in psia and °F: written in the page's units, which loading a set leaves as they are
    setList(
      set.conditions
        .map(
          (c) =>
            `${roundSignificant(toOutputPressure(c.pressurePsia, units), 10)}\t${roundSignificant(toOutputTemperature(c.temperatureF, units), 10)}`,
        )
        .join("\n"),
    );
  }

  return {
    sample,
    sampleId,
    setSampleId: (id: number) => choose({ sampleId: id }),
    properties,
    setProperties: (next: LookupChoices["properties"]) =>
      choose({ properties: next }),
    mode,
    setMode,
    single,
    setSingle,
    list,
    setList,
    path,
    setPath,
    method,
    setMethod: (next: LookupChoices["method"]) => choose({ method: next }),
    degree,
    setDegree: (next: [number, number]) => choose({ degree: next }),
    units,
    /** The page's unit system (in its address); the example conditions follow. */
    changeUnits: (next: OutputSystem) => choose({ units: next }),
    extrapolate,
    setExtrapolate: (next: boolean) => choose({ extrapolate: next }),
    /** The account's unit system, for "Make this my default". */
    accountUnits,
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
