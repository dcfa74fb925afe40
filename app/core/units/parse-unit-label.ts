/**
 * Parse unit labels as they appear in laboratory spreadsheets ("psia", "psi(a)", "bar a", "degF", "°F",
 * "deg C", "cp", "mPa.s", "scf/stb", "Sm3/Sm3", "rb/stb", "ft3/scf", "lb/ft3", "g/cc", "1/psi", "10^-6/psi" …)
 * into the catalogue.
 *
 * Rules:
 *  - Matching ignores case, spaces, "deg"/"degrees"/"°", dots and middle dots, "^", and brackets around a
 *    suffix ("psi(a)" = "psia"). Superscripts are folded ("m³" = "m3", "psi⁻¹" = "psi-1").
 *  - "psi" or "bar" alone (also "lb/in2") does not say absolute or gauge. By default this throws
 *    UnitError AMBIGUOUS_UNIT asking for "psia"/"psig" (or "bara"/"barg"): a psig-vs-psia slip is a 9 % error
 *    at 159 psig, too large to guess. A caller that knows its source may pass { barePressure: "absolute" };
 *    then the label is read as absolute and a warning is returned with the result.
 *  - "kPa" and "MPa" without a suffix are absolute (SI practice: a gauge value must be marked, "kPag").
 *  - Labels shared by several quantities ("m3/m3", "rm3/sm3", "v/v") need { quantity } to resolve;
 *    without it they throw AMBIGUOUS_UNIT listing the candidates.
 *  - "mPa" alone (millipascal) is rejected: write "MPa" for megapascal or "mPa.s" for viscosity.
 *  - Anything else unknown throws UNKNOWN_UNIT; a unit of another quantity than the one asked for throws
 *    WRONG_QUANTITY.
 */
import {
  getUnit,
  QUANTITY_LABELS,
  type Quantity,
  type UnitId,
} from "./catalogue";
import { UnitError } from "./errors";

type Candidate = {
  [Q in Quantity]: { quantity: Q; unit: UnitId<Q> };
}[Quantity];

export type ParsedUnitLabel<Q extends Quantity = Quantity> = {
  [K in Q]: {
    readonly quantity: K;
    readonly unit: UnitId<K>;
    /** Display symbol from the catalogue. */
    readonly symbol: string;
    /** The label as given. */
    readonly label: string;
    readonly warnings: readonly string[];
  };
}[Q];

export interface ParseUnitOptions {
  /** The quantity the column is known to hold; resolves shared labels and rejects units of other quantities. */
  readonly quantity?: Quantity;
  /** What a bare "psi"/"bar" means: "reject" (default) or "absolute" (accepted with a warning). */
  readonly barePressure?: "reject" | "absolute";
}

const ALIASES: ReadonlyArray<readonly [Candidate, readonly string[]]> = [
  [
    { quantity: "pressure", unit: "psia" },
    ["psia", "psi(a)", "psi a", "psi abs", "psi absolute", "lb/in2 abs"],
  ],
  [
    { quantity: "pressure", unit: "psig" },
    ["psig", "psi(g)", "psi g", "psi gauge", "psi gage", "lb/in2 gauge"],
  ],
  [
    { quantity: "pressure", unit: "bara" },
    ["bara", "bar(a)", "bar a", "bar abs", "bar absolute"],
  ],
  [
    { quantity: "pressure", unit: "barg" },
    ["barg", "bar(g)", "bar g", "bar gauge", "bar gage"],
  ],
  [
    { quantity: "pressure", unit: "kPa" },
    ["kPa", "kPaa", "kPa(a)", "kPa abs", "kPa absolute"],
  ],
  [
    { quantity: "pressure", unit: "kPag" },
    ["kPag", "kPa(g)", "kPa gauge", "kPa gage"],
  ],
  [
    { quantity: "pressure", unit: "MPa" },
    ["MPa", "MPaa", "MPa(a)", "MPa abs", "MPa absolute"],
  ],
  [
    { quantity: "pressure", unit: "MPag" },
    ["MPag", "MPa(g)", "MPa gauge", "MPa gage"],
  ],
  [{ quantity: "pressure", unit: "atm" }, ["atm", "atma"]],
  [
    { quantity: "temperature", unit: "degF" },
    ["°F", "degF", "deg F", "F", "fahrenheit", "degrees F"],
  ],
  [
    { quantity: "temperature", unit: "degC" },
    ["°C", "degC", "deg C", "C", "celsius", "degrees C"],
  ],
  [{ quantity: "temperature", unit: "K" }, ["K", "kelvin", "°K"]],
  [
    { quantity: "temperature", unit: "degR" },
    ["°R", "degR", "deg R", "R", "rankine"],
  ],
  [
    { quantity: "oil_fvf", unit: "rb/STB" },
    [
      "rb/stb",
      "bbl/stb",
      "rbbl/stb",
      "res bbl/stb",
      "rb/bbl",
      "bbl/bbl",
      "rbbl/stbbl",
    ],
  ],
  [
    { quantity: "oil_fvf", unit: "rm3/sm3" },
    ["rm3/sm3", "m3/sm3", "rm3/stm3", "m3/m3", "v/v", "vol/vol"],
  ],
  [
    { quantity: "gas_fvf", unit: "rb/scf" },
    ["rb/scf", "bbl/scf", "rbbl/scf", "res bbl/scf"],
  ],
  [
    { quantity: "gas_fvf", unit: "rb/Mscf" },
    ["rb/Mscf", "bbl/Mscf", "rb/Mcf", "bbl/Mcf", "rbbl/Mscf"],
  ],
  [
    { quantity: "gas_fvf", unit: "ft3/scf" },
    ["ft3/scf", "cf/scf", "rcf/scf", "rft3/scf", "cu ft/scf", "res ft3/scf"],
  ],
  [
    { quantity: "gas_fvf", unit: "rm3/sm3" },
    ["rm3/sm3", "m3/sm3", "m3/m3", "v/v", "vol/vol"],
  ],
  [
    { quantity: "gas_oil_ratio", unit: "scf/STB" },
    ["scf/stb", "scf/bbl", "scf/stbbl", "scf/stbo"],
  ],
  [
    { quantity: "gas_oil_ratio", unit: "Mscf/STB" },
    ["Mscf/stb", "Mcf/stb", "Mscf/bbl", "Mcf/bbl"],
  ],
  [
    { quantity: "gas_oil_ratio", unit: "sm3/sm3" },
    ["sm3/sm3", "sm3/stm3", "m3/m3", "v/v", "vol/vol"],
  ],
  [{ quantity: "viscosity", unit: "cP" }, ["cP", "cps", "centipoise"]],
  [
    { quantity: "viscosity", unit: "mPa.s" },
    ["mPa.s", "mPa·s", "mPa s", "mPas", "mPa*s"],
  ],
  [{ quantity: "viscosity", unit: "Pa.s" }, ["Pa.s", "Pa·s", "Pa s", "Pa*s"]],
  [
    { quantity: "density", unit: "lb/ft3" },
    ["lb/ft3", "lbm/ft3", "lb/cu ft", "lb/cuft", "pcf"],
  ],
  [
    { quantity: "density", unit: "g/cm3" },
    ["g/cc", "g/cm3", "gm/cc", "gm/cm3", "g/ml", "g/mL"],
  ],
  [{ quantity: "density", unit: "kg/m3" }, ["kg/m3", "kg/sm3"]],
  [
    { quantity: "compressibility", unit: "1/psi" },
    ["1/psi", "psi-1", "/psi", "1/psia", "psia-1"],
  ],
  [
    { quantity: "compressibility", unit: "1e-6/psi" },
    ["1e-6/psi", "microsip", "microsips"],
  ],
  [{ quantity: "compressibility", unit: "1/bar" }, ["1/bar", "bar-1", "/bar"]],
  [{ quantity: "compressibility", unit: "1/kPa" }, ["1/kPa", "kPa-1", "/kPa"]],
  [{ quantity: "compressibility", unit: "1/MPa" }, ["1/MPa", "MPa-1", "/MPa"]],
  [
    { quantity: "dimensionless", unit: "-" },
    ["-", "–", "dimensionless", "fraction", "frac", "ratio", "1"],
  ],
];

/** Labels that name a pressure unit but not whether it is absolute or gauge. */
const BARE_PRESSURE: ReadonlyMap<
  string,
  { absolute: UnitId<"pressure">; gauge: UnitId<"pressure"> }
> = new Map([
  [normalizeUnitLabel("psi"), { absolute: "psia", gauge: "psig" }],
  [normalizeUnitLabel("lb/in2"), { absolute: "psia", gauge: "psig" }],
  [normalizeUnitLabel("lbf/in2"), { absolute: "psia", gauge: "psig" }],
  [normalizeUnitLabel("bar"), { absolute: "bara", gauge: "barg" }],
]);

const MULTIPLIER = String.raw`(?:10\s*\^?\s*\(?\s*-\s*6\s*\)?|1e-6)`;
const LEADING_MULTIPLIER = new RegExp(
  String.raw`^(?:[x×*]\s*)?${MULTIPLIER}\s*(?:[x×*]\s*)?(.*)$`,
  "i",
);
const TRAILING_MULTIPLIER = new RegExp(
  String.raw`^(.*?)\s*[x×*]\s*${MULTIPLIER}$`,
  "i",
);

/**
 * The matching key of a label: NFKC-folded, lower case, without spaces, brackets, "^", dots or middle
 * dots; "deg"/"degrees"/"º"/"˚" become "°"; every dash and minus sign becomes "-".
 */
export function normalizeUnitLabel(label: string): string {
  return label
    .replace(/[º˚]/g, "°") // before NFKC, which would fold "º" (ordinal indicator) into "o"
    .normalize("NFKC")
    .toLowerCase()
    .replace(/[\u2212\u2012\u2013\u2014\u207b\u208b]/g, "-")
    .replace(/\s+/g, "")
    .replace(/degrees|degree|deg/g, "°")
    .replace(/[()[\]{}^]/g, "")
    .replace(/[.·⋅*]/g, "");
}

const LOOKUP: ReadonlyMap<string, readonly Candidate[]> = (() => {
  const map = new Map<string, Candidate[]>();
  for (const [candidate, aliases] of ALIASES) {
    for (const alias of aliases) {
      const key = alias === "–" ? "-" : normalizeUnitLabel(alias);
      const list = map.get(key) ?? [];
      if (
        !list.some(
          (c) => c.quantity === candidate.quantity && c.unit === candidate.unit,
        )
      )
        list.push(candidate);
      map.set(key, list);
    }
  }
  return map;
})();

function result(
  candidate: Candidate,
  label: string,
  warnings: string[],
): ParsedUnitLabel {
  const def = getUnit(candidate.quantity, candidate.unit);
  return {
    ...candidate,
    symbol: def.symbol,
    label,
    warnings,
  } as ParsedUnitLabel;
}

function stripOuterBrackets(text: string): string {
  let t = text.trim();
  while (/^[([{].*[)\]}]$/.test(t)) t = t.slice(1, -1).trim();
  return t;
}

/**
 * Parse one unit label. Throws UnitError (UNKNOWN_UNIT, AMBIGUOUS_UNIT, WRONG_QUANTITY, MISSING_UNIT).
 */
export function parseUnitLabel<Q extends Quantity>(
  label: string,
  options: ParseUnitOptions & { readonly quantity: Q },
): ParsedUnitLabel<Q>;
export function parseUnitLabel(
  label: string,
  options?: ParseUnitOptions,
): ParsedUnitLabel;
export function parseUnitLabel(
  label: string,
  options: ParseUnitOptions = {},
): ParsedUnitLabel {
  if (typeof label !== "string" || label.trim() === "") {
    throw new UnitError(
      "MISSING_UNIT",
      'No unit given: write the unit, e.g. "psia", "°F", "rb/STB".',
      {
        label,
      },
    );
  }
  const wanted = options.quantity;
  const text = stripOuterBrackets(label);

  if (/^mPa$/.test(text)) {
    throw new UnitError(
      "AMBIGUOUS_UNIT",
      `"${label}" reads as millipascal, which Isopleth does not use: write "MPa" for megapascal or "mPa.s" for viscosity.`,
      { label },
    );
  }

  // "10^-6/psi", "1/psi x 10^-6", "x10-6 psi-1": compressibility printed with a 10⁻⁶ multiplier.
  const folded = text
    .normalize("NFKC")
    .replace(/[\u2212\u2012\u2013\u2014\u207b\u208b]/g, "-");
  const multiplied =
    LEADING_MULTIPLIER.exec(folded)?.[1] ??
    TRAILING_MULTIPLIER.exec(folded)?.[1];
  if (multiplied !== undefined && multiplied.trim() !== "") {
    const key = normalizeUnitLabel(multiplied);
    const base = LOOKUP.get(key)?.find((c) => c.quantity === "compressibility");
    if (base?.unit === "1/psi") {
      return checkQuantity(
        result({ quantity: "compressibility", unit: "1e-6/psi" }, label, []),
        wanted,
        label,
      );
    }
    throw new UnitError(
      "UNKNOWN_UNIT",
      `"${label}": a 10⁻⁶ multiplier is understood only with 1/psi ("10^-6/psi"). Convert the column to a plain unit.`,
      { label },
    );
  }

  const key = normalizeUnitLabel(text);

  const bare = BARE_PRESSURE.get(key);
  if (bare) {
    if (wanted !== undefined && wanted !== "pressure") {
      throw wrongQuantity(label, ["pressure"], wanted);
    }
    if (options.barePressure === "absolute") {
      return result({ quantity: "pressure", unit: bare.absolute }, label, [
        `"${label}" does not say absolute or gauge; read as ${bare.absolute} (absolute) as requested.`,
      ]);
    }
    throw new UnitError(
      "AMBIGUOUS_UNIT",
      `"${label}" does not say whether the pressure is absolute or gauge: write "${bare.absolute}" or "${bare.gauge}".`,
      { label, candidates: [bare.absolute, bare.gauge] },
    );
  }

  const candidates = LOOKUP.get(key);
  if (!candidates || candidates.length === 0) {
    throw new UnitError(
      "UNKNOWN_UNIT",
      wanted
        ? `Unknown ${QUANTITY_LABELS[wanted]} unit "${label}".`
        : `Unknown unit "${label}".`,
      { label, quantity: wanted },
    );
  }
  if (wanted !== undefined) {
    const match = candidates.find((c) => c.quantity === wanted);
    if (!match)
      throw wrongQuantity(
        label,
        candidates.map((c) => c.quantity),
        wanted,
      );
    return result(match, label, []);
  }
  const [first, ...rest] = candidates;
  if (first && rest.length === 0) return result(first, label, []);
  throw new UnitError(
    "AMBIGUOUS_UNIT",
    `"${label}" is a unit of several quantities (${candidates.map((c) => QUANTITY_LABELS[c.quantity]).join(", ")}): ` +
      "say which quantity the column holds.",
    { label, candidates: candidates.map((c) => c.quantity) },
  );
}

function wrongQuantity(
  label: string,
  found: readonly Quantity[],
  wanted: Quantity,
): UnitError {
  return new UnitError(
    "WRONG_QUANTITY",
    `"${label}" is a unit of ${[...new Set(found)].map((q) => QUANTITY_LABELS[q]).join(" or ")}, not of ${QUANTITY_LABELS[wanted]}.`,
    { label, found, wanted },
  );
}

function checkQuantity(
  parsed: ParsedUnitLabel,
  wanted: Quantity | undefined,
  label: string,
): ParsedUnitLabel {
  if (wanted !== undefined && parsed.quantity !== wanted)
    throw wrongQuantity(label, [parsed.quantity], wanted);
  return parsed;
}

/**
 * Split a spreadsheet column header into its name and unit and parse the unit:
 * "Pressure (psia)", "Bo [rb/stb]", "Viscosity, cp", "Pressure (psi(a))".
 * Throws UnitError MISSING_UNIT when the header carries no unit.
 */
export function parseHeaderUnit<Q extends Quantity>(
  header: string,
  options: ParseUnitOptions & { readonly quantity: Q },
): ParsedUnitLabel<Q> & { readonly name: string };
export function parseHeaderUnit(
  header: string,
  options?: ParseUnitOptions,
): ParsedUnitLabel & { readonly name: string };
export function parseHeaderUnit(
  header: string,
  options: ParseUnitOptions = {},
): ParsedUnitLabel & { name: string } {
  const text = typeof header === "string" ? header.trim() : "";
  const split = splitHeader(text);
  if (!split) {
    throw new UnitError(
      "MISSING_UNIT",
      `Column header "${header}" has no unit: write it as "Name (unit)", e.g. "Pressure (psia)".`,
      { header },
    );
  }
  return { ...parseUnitLabel(split.unit, options), name: split.name };
}

function splitHeader(text: string): { name: string; unit: string } | null {
  const last = text.at(-1);
  if (last === ")" || last === "]") {
    const open = last === ")" ? "(" : "[";
    let depth = 0;
    for (let i = text.length - 1; i >= 0; i--) {
      const ch = text[i];
      if (ch === last) depth++;
      else if (ch === open) {
        depth--;
        if (depth === 0) {
          const name = text.slice(0, i).trim();
          const unit = text.slice(i + 1, -1).trim();
          return name && unit ? { name, unit } : null;
        }
      }
    }
    return null;
  }
  const comma = text.lastIndexOf(",");
  if (comma > 0) {
    const name = text.slice(0, comma).trim();
    const unit = text.slice(comma + 1).trim();
    return name && unit ? { name, unit } : null;
  }
  return null;
}
