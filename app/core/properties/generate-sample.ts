/**
 * Synthetic sample generator: from a short fluid description, a complete and plausible set of black-oil
 * property grids on a pressure × temperature grid, with a bubble point per temperature. The data are
 * INVENTED — computed from published correlations, optionally with seeded artificial noise — and every
 * result says so (`synthetic: true`, `notice`).
 *
 * Methods (all in canonical units: psia, °F, scf/STB, rb/STB, rb/scf, cP, lb/ft³):
 *   bubble point pb(T)      exact inverse of Standing's (1947) Rs form at the fluid's Rsb
 *   Rs (p ≤ pb)             Standing (1947);  Rs = Rsb above pb
 *   Bo (p ≤ pb)             Standing (1947), 0.9759 form;  above pb: Bob (pb/p)^A, Vasquez & Beggs (1980) co
 *   μo (p ≤ pb)             Beggs & Robinson (1975) dead + live oil;  above pb: Vasquez & Beggs (1980)
 *   ρo                      mass balance (stock-tank oil + dissolved gas over Bo)
 *   z                       Sutton (1985) pseudo-criticals + Dranchuk & Abou-Kassem (1975) (or Hall–Yarborough)
 *   Bg                      (psc/Tsc) zT/p at 60 °F, 14.696 psia
 *   μg                      Lee, Gonzalez & Eakin (1966)
 * The gas gravity is used as the total dissolved-gas gravity for Standing, as the 100 psig separator gravity
 * for Vasquez & Beggs, and as the free-gas gravity for z, Bg and μg. Gas properties are given at every grid
 * node (a gas table does not stop at the bubble point) and their grids carry no bubble points.
 *
 * Noise: each value is multiplied by (1 + noise · ε), ε standard normal truncated to ±3, from a seeded
 * generator (mulberry32); draws follow the fixed order property → pressure → temperature, so the same
 * description and seed always give the same numbers. Rs above pb stays exactly Rsb (a definition, not a
 * reading) and bubble points carry no noise.
 */
import {
  CANONICAL_UNIT_SYSTEM,
  FIELD_STANDARD_CONDITIONS,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  UNIT_SYSTEMS,
  apiToSpecificGravity,
  convertBetweenSystems,
  type PropertyKey,
  type StandardConditions,
  type UnitId,
  type UnitSystemId,
} from "../units";
import {
  beggsRobinsonDeadOilViscosity,
  beggsRobinsonLiveOilViscosity,
} from "./beggs-robinson";
import { PropertyInputError } from "./errors";
import {
  requireApi,
  requireFinite,
  requirePositive,
  requirePressure,
  type PropertyWarning,
} from "./estimate";
import {
  gasDensity,
  gasFvf,
  leeGonzalezEakinViscosity,
} from "./gas-properties";
import { massBalanceOilDensity } from "./oil-density";
import { createRandom } from "./prng";
import {
  standingOilFvf,
  standingSaturationPressure,
  standingSolutionGor,
} from "./standing";
import {
  vasquezBeggsUndersaturatedOilFvf,
  vasquezBeggsUndersaturatedViscosity,
} from "./vasquez-beggs";
import { gasZFactor, type ZFactorMethod } from "./z-factor";
import { formatDecimals } from "../format";

/** Same shape as the interpolation engine's Grid: values[i][j] at pressures[i], temperatures[j]. */
export interface PropertyGrid {
  pressures: number[];
  temperatures: number[];
  values: (number | null)[][];
  /** Per temperature column (oil properties only). */
  bubblePoints?: (number | null)[];
}

export interface FluidDescription {
  /** Stock-tank oil gravity, °API. */
  readonly apiGravity: number;
  /** Gas specific gravity, air = 1. */
  readonly gasGravity: number;
  /** Solution GOR at the bubble point, scf/STB. Give this or `bubblePoint`. */
  readonly rsb?: number;
  /** Bubble-point pressure (psia) at `bubblePointTemperature`. Give this or `rsb`. */
  readonly bubblePoint?: number;
  /** °F at which `bubblePoint` holds; default the lowest of `temperatures` (required without them). */
  readonly bubblePointTemperature?: number;
  /** z-factor equation; default Dranchuk–Abou-Kassem. */
  readonly zFactorMethod?: ZFactorMethod;
}

export interface SampleDescription extends FluidDescription {
  /** °F, strictly increasing, above 0 °F. */
  readonly temperatures: readonly number[];
  /** psia, strictly increasing, above 0. */
  readonly pressures: readonly number[];
  /** Relative standard deviation of multiplicative noise, 0 (default) to 0.1. */
  readonly noise?: number;
  /** Seed of the noise generator; default 1. */
  readonly seed?: number;
  /** Unit system of the output; default canonical (psia, °F, rb/STB, rb/scf, scf/STB, cP, lb/ft³). */
  readonly unitSystem?: UnitSystemId;
}

export interface SampleFluid {
  readonly apiGravity: number;
  readonly oilSpecificGravity: number;
  readonly gasGravity: number;
  /** scf/STB */
  readonly rsb: number;
  readonly zFactorMethod: ZFactorMethod;
}

/** All seven properties at one (p, T), canonical units. */
export type SamplePoint = Readonly<Record<PropertyKey, number>> & {
  readonly branch: "saturated" | "undersaturated";
  readonly bubblePoint: number;
};

export interface SampleModel {
  readonly fluid: SampleFluid;
  /** Bubble-point pressure (psia) at temperature °F. */
  bubblePoint(temperature: number): number;
  /** Noise-free property values at (pressure psia, temperature °F): the ground truth of a generated grid. */
  evaluate(pressure: number, temperature: number): SamplePoint;
  /** Correlation-range warnings met so far (deduplicated by method and input). */
  warnings(): PropertyWarning[];
}

export const SAMPLE_METHODS: Readonly<Record<PropertyKey, string>> = {
  solution_gor: "Standing (1947); Rsb above the bubble point",
  oil_fvf:
    "Standing (1947) 0.9759 form below pb; Vasquez & Beggs (1980) compressibility above pb",
  oil_viscosity:
    "Beggs & Robinson (1975) below pb; Vasquez & Beggs (1980) above pb",
  oil_density: "mass balance of stock-tank oil and dissolved gas",
  z_factor:
    "Sutton (1985) pseudo-criticals with Dranchuk & Abou-Kassem (1975) or Hall & Yarborough (1973)",
  gas_fvf: "Bg = (psc/Tsc) zT/p, 60 °F and 14.696 psia",
  gas_viscosity: "Lee, Gonzalez & Eakin (1966)",
};

function collect(
  store: Map<string, PropertyWarning>,
  warnings: readonly PropertyWarning[],
): void {
  for (const w of warnings) {
    const key = `${w.code}|${w.method}|${w.input ?? ""}`;
    if (!store.has(key)) store.set(key, w);
  }
}

/** Build the noise-free fluid model behind a generated sample. */
export function createSampleModel(description: FluidDescription): SampleModel {
  const api = requireApi("apiGravity", description.apiGravity);
  const gg = requirePositive("gasGravity", description.gasGravity);
  const store = new Map<string, PropertyWarning>();
  const base = { apiGravity: api, gasGravity: gg };

  let rsb: number;
  if (description.rsb !== undefined && description.bubblePoint !== undefined) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "rsb",
      description.rsb,
      "Give either rsb or bubblePoint, not both.",
    );
  } else if (description.rsb !== undefined) {
    rsb = requirePositive("rsb", description.rsb);
  } else if (description.bubblePoint !== undefined) {
    const pb = requirePressure("bubblePoint", description.bubblePoint);
    const t = description.bubblePointTemperature;
    if (t === undefined) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "bubblePointTemperature",
        t,
        "bubblePoint needs the temperature it holds at.",
      );
    }
    requireFinite("bubblePointTemperature", t);
    const rs = standingSolutionGor({ ...base, temperature: t, pressure: pb });
    collect(store, rs.warnings);
    rsb = rs.value;
  } else {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "rsb",
      undefined,
      "Give the solution GOR (rsb) or a bubble point.",
    );
  }

  const fluid: SampleFluid = {
    apiGravity: api,
    oilSpecificGravity: apiToSpecificGravity(api),
    gasGravity: gg,
    rsb,
    zFactorMethod: description.zFactorMethod ?? "dranchuk_abou_kassem",
  };

  const requireSampleTemperature = (t: number): void => {
    requireFinite("temperature", t);
    if (t <= 0) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "temperature",
        t,
        `Sample temperatures must be above 0 °F, got ${t}.`,
      );
    }
  };

  const bubblePoint = (t: number): number => {
    requireSampleTemperature(t);
    const pb = standingSaturationPressure({
      ...base,
      temperature: t,
      solutionGor: rsb,
    });
    collect(store, pb.warnings);
    if (!(pb.value > 0)) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "rsb",
        rsb,
        `Rsb = ${rsb} scf/STB is too small: no positive bubble point at ${t} °F.`,
      );
    }
    return pb.value;
  };

  const evaluate = (p: number, t: number): SamplePoint => {
    requirePressure("pressure", p);
    const pb = bubblePoint(t);
    const fl = { ...base, temperature: t };
    const saturated = p <= pb;
    let rs: number;
    let bo: number;
    let muo: number;
    const dead = beggsRobinsonDeadOilViscosity(fl);
    collect(store, dead.warnings);
    if (saturated) {
      const rsE = standingSolutionGor({ ...fl, pressure: p });
      rs = Math.min(rsE.value, rsb);
      const boE = standingOilFvf({ ...fl, solutionGor: rs });
      const muE = beggsRobinsonLiveOilViscosity({
        deadOilViscosity: dead.value,
        solutionGor: rs,
      });
      collect(store, [...rsE.warnings, ...boE.warnings, ...muE.warnings]);
      bo = boE.value;
      muo = muE.value;
    } else {
      rs = rsb;
      const bob = standingOilFvf({ ...fl, solutionGor: rsb });
      const boE = vasquezBeggsUndersaturatedOilFvf({
        ...fl,
        pressure: p,
        bubblePoint: pb,
        oilFvfAtBubblePoint: bob.value,
        solutionGorAtBubblePoint: rsb,
      });
      const mub = beggsRobinsonLiveOilViscosity({
        deadOilViscosity: dead.value,
        solutionGor: rsb,
      });
      const muE = vasquezBeggsUndersaturatedViscosity({
        pressure: p,
        bubblePoint: pb,
        viscosityAtBubblePoint: mub.value,
      });
      collect(store, [...bob.warnings, ...mub.warnings, ...muE.warnings]);
      const nonPhysical = boE.warnings.find(
        (w) => w.code === "NONPHYSICAL_RESULT",
      );
      if (nonPhysical) {
        throw new PropertyInputError(
          "OUT_OF_DOMAIN",
          "description",
          { apiGravity: api, gasGravity: gg, rsb, temperature: t },
          `The Vasquez–Beggs compressibility is not positive for this fluid at ${t} °F (low Rsb and temperature): ` +
            "the undersaturated branch cannot be generated.",
        );
      }
      collect(store, boE.warnings);
      bo = boE.value;
      muo = muE.value;
    }
    const rho = massBalanceOilDensity({
      apiGravity: api,
      gasGravity: gg,
      solutionGor: rs,
      oilFvf: bo,
    });
    const z = gasZFactor({
      pressure: p,
      temperature: t,
      gasGravity: gg,
      method: fluid.zFactorMethod,
    });
    const bg = gasFvf({
      pressure: p,
      temperature: t,
      z: z.value,
      standardConditions: FIELD_STANDARD_CONDITIONS,
    });
    const rhoG = gasDensity({
      pressure: p,
      temperature: t,
      z: z.value,
      gasGravity: gg,
    });
    const mug = leeGonzalezEakinViscosity({
      temperature: t,
      gasDensity: rhoG.value,
      gasGravity: gg,
      pressure: p,
    });
    collect(store, [...z.warnings, ...mug.warnings]);
    return {
      branch: saturated ? "saturated" : "undersaturated",
      bubblePoint: pb,
      solution_gor: rs,
      oil_fvf: bo,
      oil_viscosity: muo,
      oil_density: rho.value,
      z_factor: z.value,
      gas_fvf: bg.value,
      gas_viscosity: mug.value,
    };
  };

  return { fluid, bubblePoint, evaluate, warnings: () => [...store.values()] };
}

export interface GeneratedSample {
  /** Always true: these numbers are invented, not measured. */
  readonly synthetic: true;
  readonly notice: string;
  readonly fluid: SampleFluid;
  readonly noise: number;
  readonly seed: number;
  readonly unitSystem: UnitSystemId;
  readonly standardConditions: StandardConditions;
  /** Units of the axes and of every property grid (catalogue unit ids). */
  readonly units: {
    readonly pressure: UnitId<"pressure">;
    readonly temperature: UnitId<"temperature">;
  } & { readonly [K in PropertyKey]: UnitId<(typeof PROPERTY_QUANTITIES)[K]> };
  readonly pressures: number[];
  readonly temperatures: number[];
  /** Bubble-point pressure per temperature, in the output pressure unit. */
  readonly bubblePoints: number[];
  readonly grids: Readonly<Record<PropertyKey, PropertyGrid>>;
  readonly methods: Readonly<Record<PropertyKey, string>>;
  readonly warnings: readonly PropertyWarning[];
}

const OIL_KEYS: ReadonlySet<PropertyKey> = new Set([
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
  "oil_density",
]);

function requireIncreasing(name: string, values: readonly number[]): void {
  if (!Array.isArray(values) || values.length === 0) {
    throw new PropertyInputError(
      "INSUFFICIENT_DATA",
      name,
      values,
      `${name} must be a non-empty array.`,
    );
  }
  values.forEach((v, i) => {
    requireFinite(`${name}[${i}]`, v);
    const prev = values[i - 1];
    if (prev !== undefined && !(v > prev)) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        name,
        values,
        `${name} must be strictly increasing (${prev} then ${v}).`,
      );
    }
  });
}

/**
 * Generate an invented sample: property grids for oil_fvf, solution_gor, oil_viscosity, oil_density,
 * gas_fvf, gas_viscosity and z_factor on `pressures` × `temperatures`, with a bubble point per temperature.
 */
export function generateSample(
  description: SampleDescription,
): GeneratedSample {
  requireIncreasing("pressures", description.pressures);
  requireIncreasing("temperatures", description.temperatures);
  description.pressures.forEach((p, i) =>
    requirePressure(`pressures[${i}]`, p),
  );
  const noise = description.noise ?? 0;
  requireFinite("noise", noise);
  if (noise < 0 || noise > 0.1) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "noise",
      noise,
      `noise is a relative standard deviation from 0 to 0.1, got ${noise}.`,
    );
  }
  const seed = description.seed ?? 1;
  requireFinite("seed", seed);
  const systemId = description.unitSystem ?? "canonical";
  const system = UNIT_SYSTEMS[systemId];
  if (system === undefined) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "unitSystem",
      systemId,
      `Unknown unit system "${String(systemId)}".`,
    );
  }

  const model = createSampleModel({
    ...description,
    bubblePointTemperature:
      description.bubblePointTemperature ?? description.temperatures[0],
  });
  const pressures = [...description.pressures];
  const temperatures = [...description.temperatures];
  const bubblePoints = temperatures.map((t) => model.bubblePoint(t));
  const points = pressures.map((p) =>
    temperatures.map((t) => model.evaluate(p, t)),
  );

  const random = createRandom(seed);
  const draw = (): number => {
    for (;;) {
      const e = random.normal();
      if (Math.abs(e) <= 3) return e;
    }
  };

  const out = (quantityValue: number, key: PropertyKey): number =>
    convertBetweenSystems(
      quantityValue,
      PROPERTY_QUANTITIES[key],
      CANONICAL_UNIT_SYSTEM,
      system,
    );
  const outPressure = (p: number): number =>
    convertBetweenSystems(p, "pressure", CANONICAL_UNIT_SYSTEM, system);
  const outTemperature = (t: number): number =>
    convertBetweenSystems(t, "temperature", CANONICAL_UNIT_SYSTEM, system);

  const axisP = pressures.map(outPressure);
  const axisT = temperatures.map(outTemperature);
  const pbOut = bubblePoints.map(outPressure);

  const grids = {} as Record<PropertyKey, PropertyGrid>;
  for (const key of PROPERTY_KEYS) {
    const values = points.map((row) =>
      row.map((pt) => {
        const e = draw();
        const exact = key === "solution_gor" && pt.branch === "undersaturated";
        const v = exact || noise === 0 ? pt[key] : pt[key] * (1 + noise * e);
        return out(v, key);
      }),
    );
    grids[key] = {
      pressures: [...axisP],
      temperatures: [...axisT],
      values,
      ...(OIL_KEYS.has(key) ? { bubblePoints: [...pbOut] } : {}),
    };
  }

  const units = {
    pressure: system.units.pressure,
    temperature: system.units.temperature,
    oil_fvf: system.units.oil_fvf,
    solution_gor: system.units.gas_oil_ratio,
    oil_viscosity: system.units.viscosity,
    oil_density: system.units.density,
    gas_fvf: system.units.gas_fvf,
    gas_viscosity: system.units.viscosity,
    z_factor: system.units.dimensionless,
  };

  return {
    synthetic: true,
    notice:
      "Invented data: generated from published correlations" +
      (noise > 0
        ? ` with ${formatDecimals(noise * 100, 2)} % artificial noise`
        : "") +
      "; not measurements of any real fluid.",
    fluid: model.fluid,
    noise,
    seed,
    unitSystem: systemId,
    standardConditions: system.standardConditions,
    units,
    pressures: axisP,
    temperatures: axisT,
    bubblePoints: pbOut,
    grids,
    methods: SAMPLE_METHODS,
    warnings: model.warnings(),
  };
}
