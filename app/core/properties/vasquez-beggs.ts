/**
 * Vasquez & Beggs (1980), "Correlations for Fluid Physical Property Prediction", JPT 32, 968–970
 * (SPE-6719-PA): solution GOR, bubble point, saturated Bo, undersaturated compressibility, undersaturated Bo
 * and undersaturated viscosity, with gas gravity referred to a 100 psig separator.
 *
 * Units: pressure psia, temperature °F, Rs scf/STB, Bo rb/STB, co 1/psi, μ cP.
 *
 *   γgs = γg [ 1 + 5.912×10⁻⁵ · API · Tsep · log10(psep/114.7) ]            (Tsep °F, psep psia)
 *   Rs  = C1 γgs p^C2 exp[ C3 API / (T + 460) ]
 *   Bo  = 1 + C1 Rs + C2 (T − 60)(API/γgs) + C3 Rs (T − 60)(API/γgs)          (p ≤ pb)
 *   co  = (−1433 + 5 Rsb + 17.2 T − 1180 γgs + 12.61 API) / (10⁵ p)            (p > pb)
 *   Bo  = Bob (pb/p)^A,  A = 10⁻⁵ (−1433 + 5 Rsb + 17.2 T − 1180 γgs + 12.61 API)   (co integrated from pb)
 *   μo  = μob (p/pb)^m,  m = 2.6 p^1.187 exp(−11.513 − 8.98×10⁻⁵ p)          (p > pb)
 *
 * Coefficients per API class (≤ 30, > 30) as tabulated in Beggs, Petroleum Engineering Handbook (SPE 1987)
 * ch. 22, Table 22.6; the Bo C3 for API > 30 is 1.337×10⁻⁹.
 *
 * γg input: pass the gas gravity together with the separator it was measured at ({ separator }) and the
 * correction to 100 psig is applied; without `separator` the gravity is taken as already referred to a
 * 100 psig separator.
 *
 * Data range (recalled from the paper, to verify): ~600 PVT analyses; pb 50–5250 psia, T 70–295 °F,
 * API 16–58, γg 0.56–1.18, Rs 20–2070 scf/STB. Viscosity: p 141–9515 psia, μo 0.117–148 cP,
 * Rs 9.3–2199 scf/STB, API 15.3–59.5, γg 0.511–1.351.
 */
import { PropertyInputError } from "./errors";
import {
  mergeWarnings,
  rangeWarnings,
  requireApi,
  requirePositive,
  requirePressure,
  requireTemperature,
  type Estimate,
  type PropertyWarning,
  type ValidityRanges,
} from "./estimate";

const SOURCE =
  "Vasquez & Beggs (1980) data range, recalled (domain brief §3.2, from memory)";
const SOURCE_MU =
  "Vasquez & Beggs (1980) viscosity data range, recalled (domain brief §3.2, from memory)";

export const VASQUEZ_BEGGS_RANGES: ValidityRanges = {
  pressure: {
    input: "pressure",
    unit: "psia",
    min: 50,
    max: 5250,
    source: SOURCE,
  },
  bubblePoint: {
    input: "bubble point",
    unit: "psia",
    min: 50,
    max: 5250,
    source: SOURCE,
  },
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
  gasGravity: {
    input: "gas gravity (100 psig separator)",
    unit: "air = 1",
    min: 0.56,
    max: 1.18,
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

export const VASQUEZ_BEGGS_VISCOSITY_RANGES: ValidityRanges = {
  pressure: {
    input: "pressure",
    unit: "psia",
    min: 141,
    max: 9515,
    source: SOURCE_MU,
  },
  viscosityAtBubblePoint: {
    input: "viscosity",
    unit: "cP",
    min: 0.117,
    max: 148,
    source: SOURCE_MU,
  },
};

export interface SeparatorConditions {
  /** Separator pressure, psia. */
  readonly pressure: number;
  /** Separator temperature, °F. */
  readonly temperature: number;
}

export interface VasquezBeggsFluid {
  /** Gas gravity (air = 1): at `separator` if given, otherwise already referred to a 100 psig separator. */
  readonly gasGravity: number;
  readonly apiGravity: number;
  /** Reservoir temperature, °F. */
  readonly temperature: number;
  readonly separator?: SeparatorConditions;
}

/** Gas gravity referred to a 100 psig (114.7 psia) separator. */
export function vasquezBeggsGasGravity(input: {
  readonly gasGravity: number;
  readonly apiGravity: number;
  readonly separator: SeparatorConditions;
}): Estimate {
  requirePositive("gasGravity", input.gasGravity);
  requireApi("apiGravity", input.apiGravity);
  requirePressure("separator.pressure", input.separator.pressure);
  requireTemperature("separator.temperature", input.separator.temperature);
  const { gasGravity: gg, apiGravity: api, separator } = input;
  const ggs =
    gg *
    (1 +
      5.912e-5 *
        api *
        separator.temperature *
        Math.log10(separator.pressure / 114.7));
  const warnings: PropertyWarning[] = [];
  if (!(ggs > 0)) {
    warnings.push({
      code: "NONPHYSICAL_RESULT",
      method: "vasquez-beggs-1980-gas-gravity",
      input: "result",
      value: ggs,
      message: "Separator gas-gravity correction gives a non-positive gravity.",
    });
  }
  return { value: ggs, warnings };
}

interface Resolved {
  readonly ggs: number;
  readonly warnings: PropertyWarning[];
}

function resolve(input: VasquezBeggsFluid): Resolved {
  requirePositive("gasGravity", input.gasGravity);
  requireApi("apiGravity", input.apiGravity);
  requireTemperature("temperature", input.temperature);
  if (input.separator === undefined)
    return { ggs: input.gasGravity, warnings: [] };
  const corrected = vasquezBeggsGasGravity({
    gasGravity: input.gasGravity,
    apiGravity: input.apiGravity,
    separator: input.separator,
  });
  requirePositive("gasGravity (corrected to 100 psig)", corrected.value);
  return { ggs: corrected.value, warnings: [...corrected.warnings] };
}

function rsCoefficients(api: number): readonly [number, number, number] {
  return api <= 30 ? [0.0362, 1.0937, 25.724] : [0.0178, 1.187, 23.931];
}

/** Solution GOR (scf/STB) at pressure ≤ pb. */
export function vasquezBeggsSolutionGor(
  input: VasquezBeggsFluid & { readonly pressure: number },
): Estimate {
  const { ggs, warnings } = resolve(input);
  requirePressure("pressure", input.pressure);
  const [c1, c2, c3] = rsCoefficients(input.apiGravity);
  const rs =
    c1 *
    ggs *
    input.pressure ** c2 *
    Math.exp((c3 * input.apiGravity) / (input.temperature + 460));
  const method = "vasquez-beggs-1980-solution-gor";
  return {
    value: rs,
    warnings: mergeWarnings(
      warnings,
      rangeWarnings(method, VASQUEZ_BEGGS_RANGES, {
        pressure: input.pressure,
        temperature: input.temperature,
        apiGravity: input.apiGravity,
        gasGravity: ggs,
        solutionGor: rs,
      }),
    ),
  };
}

/** Bubble-point pressure (psia) for solution GOR `solutionGor` (scf/STB): exact inverse of the Rs form. */
export function vasquezBeggsBubblePoint(
  input: VasquezBeggsFluid & { readonly solutionGor: number },
): Estimate {
  const { ggs, warnings } = resolve(input);
  requirePositive("solutionGor", input.solutionGor);
  const [c1, c2, c3] = rsCoefficients(input.apiGravity);
  const pb =
    (input.solutionGor /
      (c1 *
        ggs *
        Math.exp((c3 * input.apiGravity) / (input.temperature + 460)))) **
    (1 / c2);
  const method = "vasquez-beggs-1980-bubble-point";
  return {
    value: pb,
    warnings: mergeWarnings(
      warnings,
      rangeWarnings(method, VASQUEZ_BEGGS_RANGES, {
        bubblePoint: pb,
        temperature: input.temperature,
        apiGravity: input.apiGravity,
        gasGravity: ggs,
        solutionGor: input.solutionGor,
      }),
    ),
  };
}

/** Saturated oil FVF (rb/STB) at solution GOR `solutionGor` (p ≤ pb). */
export function vasquezBeggsOilFvf(
  input: VasquezBeggsFluid & { readonly solutionGor: number },
): Estimate {
  const { ggs, warnings } = resolve(input);
  requirePositive("solutionGor", input.solutionGor);
  const [c1, c2, c3] =
    input.apiGravity <= 30
      ? [4.677e-4, 1.751e-5, -1.811e-8]
      : [4.67e-4, 1.1e-5, 1.337e-9];
  const rs = input.solutionGor;
  const g = ((input.temperature - 60) * input.apiGravity) / ggs;
  const bo = 1 + c1 * rs + c2 * g + c3 * rs * g;
  const method = "vasquez-beggs-1980-oil-fvf";
  return {
    value: bo,
    warnings: mergeWarnings(
      warnings,
      rangeWarnings(method, VASQUEZ_BEGGS_RANGES, {
        temperature: input.temperature,
        apiGravity: input.apiGravity,
        gasGravity: ggs,
        solutionGor: rs,
      }),
    ),
  };
}

/** 10⁻⁵ (−1433 + 5 Rsb + 17.2 T − 1180 γgs + 12.61 API): co·p, and the exponent of the undersaturated Bo. */
function compressibilityNumerator(
  rsb: number,
  t: number,
  ggs: number,
  api: number,
): number {
  return 1e-5 * (-1433 + 5 * rsb + 17.2 * t - 1180 * ggs + 12.61 * api);
}

function negativeCo(method: string, value: number): PropertyWarning {
  return {
    code: "NONPHYSICAL_RESULT",
    method,
    input: "result",
    value,
    message:
      "Undersaturated compressibility is not positive for this fluid: outside the correlation's domain.",
  };
}

/** Undersaturated oil isothermal compressibility (1/psi) at `pressure` (psia, above pb). */
export function vasquezBeggsUndersaturatedCompressibility(
  input: VasquezBeggsFluid & {
    readonly pressure: number;
    readonly solutionGorAtBubblePoint: number;
  },
): Estimate {
  const { ggs, warnings } = resolve(input);
  requirePressure("pressure", input.pressure);
  requirePositive("solutionGorAtBubblePoint", input.solutionGorAtBubblePoint);
  const a = compressibilityNumerator(
    input.solutionGorAtBubblePoint,
    input.temperature,
    ggs,
    input.apiGravity,
  );
  const co = a / input.pressure;
  const method = "vasquez-beggs-1980-undersaturated-compressibility";
  const all = mergeWarnings(
    warnings,
    rangeWarnings(method, VASQUEZ_BEGGS_RANGES, {
      pressure: input.pressure,
      temperature: input.temperature,
      apiGravity: input.apiGravity,
      gasGravity: ggs,
      solutionGor: input.solutionGorAtBubblePoint,
    }),
  );
  if (co <= 0) all.push(negativeCo(method, co));
  return { value: co, warnings: all };
}

function requireAboveBubblePoint(pressure: number, bubblePoint: number): void {
  if (pressure < bubblePoint) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "pressure",
      pressure,
      `pressure ${pressure} psia is below the bubble point ${bubblePoint} psia: this is an undersaturated-branch method.`,
    );
  }
}

/** Undersaturated oil FVF (rb/STB): Bob (pb/p)^A, the V–B compressibility integrated from pb to p. */
export function vasquezBeggsUndersaturatedOilFvf(
  input: VasquezBeggsFluid & {
    readonly pressure: number;
    readonly bubblePoint: number;
    readonly oilFvfAtBubblePoint: number;
    readonly solutionGorAtBubblePoint: number;
  },
): Estimate {
  const { ggs, warnings } = resolve(input);
  requirePressure("pressure", input.pressure);
  requirePressure("bubblePoint", input.bubblePoint);
  requirePositive("oilFvfAtBubblePoint", input.oilFvfAtBubblePoint);
  requirePositive("solutionGorAtBubblePoint", input.solutionGorAtBubblePoint);
  requireAboveBubblePoint(input.pressure, input.bubblePoint);
  const a = compressibilityNumerator(
    input.solutionGorAtBubblePoint,
    input.temperature,
    ggs,
    input.apiGravity,
  );
  const bo =
    input.oilFvfAtBubblePoint * (input.bubblePoint / input.pressure) ** a;
  const method = "vasquez-beggs-1980-undersaturated-oil-fvf";
  const all = mergeWarnings(
    warnings,
    rangeWarnings(method, VASQUEZ_BEGGS_RANGES, {
      bubblePoint: input.bubblePoint,
      temperature: input.temperature,
      apiGravity: input.apiGravity,
      gasGravity: ggs,
      solutionGor: input.solutionGorAtBubblePoint,
    }),
  );
  if (a <= 0) all.push(negativeCo(method, a));
  return { value: bo, warnings: all };
}

export interface UndersaturatedViscosityEstimate extends Estimate {
  /** The exponent m of (p/pb)^m. */
  readonly exponent: number;
}

/** Undersaturated oil viscosity (cP) at `pressure` ≥ pb from the viscosity at the bubble point. */
export function vasquezBeggsUndersaturatedViscosity(input: {
  readonly pressure: number;
  readonly bubblePoint: number;
  readonly viscosityAtBubblePoint: number;
}): UndersaturatedViscosityEstimate {
  requirePressure("pressure", input.pressure);
  requirePressure("bubblePoint", input.bubblePoint);
  requirePositive("viscosityAtBubblePoint", input.viscosityAtBubblePoint);
  requireAboveBubblePoint(input.pressure, input.bubblePoint);
  const p = input.pressure;
  const m = 2.6 * p ** 1.187 * Math.exp(-11.513 - 8.98e-5 * p);
  const mu = input.viscosityAtBubblePoint * (p / input.bubblePoint) ** m;
  const warnings = rangeWarnings(
    "vasquez-beggs-1980-undersaturated-viscosity",
    VASQUEZ_BEGGS_VISCOSITY_RANGES,
    {
      pressure: p,
      viscosityAtBubblePoint: input.viscosityAtBubblePoint,
    },
  );
  return { value: mu, warnings, exponent: m };
}
