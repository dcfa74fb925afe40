/**
 * Exact definitions every conversion factor in the catalogue is derived from.
 *
 * Sources: NIST SP 811 (2008), appendix B, and the international yard and pound agreement (1959):
 * 1 in = 0.0254 m, 1 lb = 0.45359237 kg, standard acceleration of gravity 9.80665 m/s²,
 * 1 US gallon = 231 in³, 1 oil barrel = 42 US gallons, 1 standard atmosphere = 101 325 Pa,
 * 1 bar = 100 000 Pa. Temperature offsets: K = °C + 273.15, °R = °F + 459.67 (both exact).
 * The molar gas constant is exact in SI since 2019: R = 8.314462618 J/(mol·K).
 *
 * Nothing here is rounded: derived values (psi in Pa, barrel in ft³) are computed from the definitions,
 * so they carry only floating-point round-off.
 */

export const METRE_PER_INCH = 0.0254;
export const METRE_PER_FOOT = 12 * METRE_PER_INCH; // 0.3048
export const KILOGRAM_PER_POUND = 0.45359237;
export const STANDARD_GRAVITY = 9.80665; // m/s²
export const PASCAL_PER_ATMOSPHERE = 101_325;
export const PASCAL_PER_BAR = 100_000;

/** 1 ft³ in m³ = 0.3048³ = 0.028316846592 (exact). */
export const CUBIC_METRE_PER_CUBIC_FOOT = METRE_PER_FOOT ** 3;
/** 1 US gallon = 231 in³ = 0.003785411784 m³ (exact). */
export const CUBIC_METRE_PER_US_GALLON = 231 * METRE_PER_INCH ** 3;
/** 1 oil barrel = 42 US gallons = 0.158987294928 m³ (exact). */
export const CUBIC_METRE_PER_BARREL = 42 * CUBIC_METRE_PER_US_GALLON;
/** 1 bbl = 9702 in³ / 1728 in³/ft³ = 5.614583333… ft³ (exact). */
export const CUBIC_FOOT_PER_BARREL =
  CUBIC_METRE_PER_BARREL / CUBIC_METRE_PER_CUBIC_FOOT;

/** 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N (exact). */
export const NEWTON_PER_POUND_FORCE = KILOGRAM_PER_POUND * STANDARD_GRAVITY;
/** 1 psi = 1 lbf/in² = 6894.757293168… Pa (exact by definition, non-terminating). */
export const PASCAL_PER_PSI = NEWTON_PER_POUND_FORCE / METRE_PER_INCH ** 2;
/** 1 atm in psi = 14.69594877… (the oilfield's "14.696 psia"). */
export const PSI_PER_ATMOSPHERE = PASCAL_PER_ATMOSPHERE / PASCAL_PER_PSI;

/** 1 lb/ft³ = 16.01846337… kg/m³ (exact). */
export const KG_PER_M3_PER_LB_PER_FT3 =
  KILOGRAM_PER_POUND / CUBIC_METRE_PER_CUBIC_FOOT;

export const KELVIN_OFFSET = 273.15; // K = °C + 273.15
export const RANKINE_OFFSET = 459.67; // °R = °F + 459.67
export const RANKINE_PER_KELVIN = 1.8;

/** Molar gas constant, exact since the 2019 SI redefinition, J/(mol·K). */
export const GAS_CONSTANT_SI = 8.314462618;
/**
 * The same constant in oilfield units, psia·ft³/(lbmol·°R) ≈ 10.7316:
 * J/(mol·K) × (mol per lbmol) / (Pa per psi × m³ per ft³ × °R per K).
 */
export const GAS_CONSTANT_FIELD =
  (GAS_CONSTANT_SI * (KILOGRAM_PER_POUND * 1000)) /
  (PASCAL_PER_PSI * CUBIC_METRE_PER_CUBIC_FOOT * RANKINE_PER_KELVIN);

/**
 * Apparent molar mass of dry air used to turn gas specific gravity into molar mass, g/mol (= lb/lbmol).
 * A convention, not a definition: texts also use 28.96 or 28.97.
 */
export const MOLAR_MASS_AIR = 28.9647;

/** 1 g/cm³ in lb/ft³ = 62.42796… (exact, derived). */
export const LB_PER_FT3_PER_G_PER_CM3 = 1000 / KG_PER_M3_PER_LB_PER_FT3;
