/**
 * Beggs & Robinson (1975), "Estimating the Viscosity of Crude Oil Systems", JPT 27(9) (SPE-5434-PA):
 * dead-oil and saturated (live) oil viscosity. Above the bubble point use
 * vasquezBeggsUndersaturatedViscosity.
 *
 * Units: temperature °F, Rs scf/STB, viscosity cP.
 *
 *   μod = 10^x − 1,   x = y · T^−1.163,   y = 10^z,   z = 3.0324 − 0.02023 API
 *   μo  = A μod^B,    A = 10.715 (Rs + 100)^−0.515,   B = 5.44 (Rs + 150)^−0.338
 *
 * Data: 600 oil systems, 460 dead-oil and 2073 live-oil observations. Ranges (recalled, to verify):
 * T 70–295 °F, API 16–58, Rs 20–2070 scf/STB. Dead-oil correlations of this kind can be off by several
 * hundred per cent on some crudes: label the result as an estimate.
 */
import { PropertyInputError } from "./errors";
import {
  mergeWarnings,
  rangeWarnings,
  requireApi,
  requireNonNegative,
  requirePositive,
  requireTemperature,
  type Estimate,
  type ValidityRanges,
} from "./estimate";

const SOURCE =
  "Beggs & Robinson (1975) data range, recalled (domain brief §3.3, from memory)";

export const BEGGS_ROBINSON_RANGES: ValidityRanges = {
  temperature: {
    input: "temperature",
    unit: "°F",
    min: 70,
    max: 295,
    source: SOURCE,
  },
  apiGravity: {
    input: "API gravity",
    unit: "°API",
    min: 16,
    max: 58,
    source: SOURCE,
  },
  solutionGor: {
    input: "solution GOR",
    unit: "scf/STB",
    min: 20,
    max: 2070,
    source: SOURCE,
  },
};

/** Dead (gas-free) oil viscosity, cP, at `temperature` °F (must be > 0 °F: T enters as a power). */
export function beggsRobinsonDeadOilViscosity(input: {
  readonly apiGravity: number;
  readonly temperature: number;
}): Estimate {
  requireApi("apiGravity", input.apiGravity);
  requireTemperature("temperature", input.temperature);
  if (input.temperature <= 0) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "temperature",
      input.temperature,
      `Beggs–Robinson raises T in °F to a power and is undefined at ${input.temperature} °F (needs T > 0 °F).`,
    );
  }
  const z = 3.0324 - 0.02023 * input.apiGravity;
  const y = 10 ** z;
  const x = y * input.temperature ** -1.163;
  const mu = 10 ** x - 1;
  const warnings = rangeWarnings(
    "beggs-robinson-1975-dead-oil-viscosity",
    BEGGS_ROBINSON_RANGES,
    {
      temperature: input.temperature,
      apiGravity: input.apiGravity,
    },
  );
  return { value: mu, warnings };
}

export interface LiveOilViscosityEstimate extends Estimate {
  readonly a: number;
  readonly b: number;
}

/** Saturated (live) oil viscosity, cP, from the dead-oil viscosity and the solution GOR. */
export function beggsRobinsonLiveOilViscosity(input: {
  readonly deadOilViscosity: number;
  readonly solutionGor: number;
}): LiveOilViscosityEstimate {
  requirePositive("deadOilViscosity", input.deadOilViscosity);
  requireNonNegative("solutionGor", input.solutionGor);
  const a = 10.715 * (input.solutionGor + 100) ** -0.515;
  const b = 5.44 * (input.solutionGor + 150) ** -0.338;
  const mu = a * input.deadOilViscosity ** b;
  const warnings = rangeWarnings(
    "beggs-robinson-1975-live-oil-viscosity",
    BEGGS_ROBINSON_RANGES,
    {
      solutionGor: input.solutionGor,
    },
  );
  return { value: mu, warnings, a, b };
}

/** Saturated oil viscosity (cP) from API gravity, temperature (°F) and solution GOR (scf/STB). */
export function beggsRobinsonOilViscosity(input: {
  readonly apiGravity: number;
  readonly temperature: number;
  readonly solutionGor: number;
}): LiveOilViscosityEstimate & { readonly deadOilViscosity: number } {
  const dead = beggsRobinsonDeadOilViscosity(input);
  const live = beggsRobinsonLiveOilViscosity({
    deadOilViscosity: dead.value,
    solutionGor: input.solutionGor,
  });
  return {
    ...live,
    warnings: mergeWarnings(dead.warnings, live.warnings),
    deadOilViscosity: dead.value,
  };
}
