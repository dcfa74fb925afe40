/**
 * The QC rules, each with the severities it can raise and the source or practice behind it.
 * README.md lists the same table for the upload page.
 */
import type { Severity } from "../types";

export interface RuleInfo {
  readonly title: string;
  /** The severities the rule can raise. */
  readonly severities: readonly Severity[];
  readonly source: string;
}

export const RULES = {
  "grid-shape": {
    title:
      "Grids are well formed: increasing pressures and temperatures, one finite value per cell",
    severities: ["error"],
    source:
      "Common practice (data integrity); black-oil simulators need strictly increasing pressure columns.",
  },
  "plausible-range": {
    title:
      "Values, pressures, temperatures and bubble points lie in plausible ranges",
    severities: ["error", "warning"],
    source:
      "Common practice bands for black oils and their gases (typical / warn / reject), e.g. Z 0.3–2.0, Bo 1.0–2.5 rb/STB, μg 0.008–0.06 cP; Rsb above 1750 scf/STB suggests a volatile oil and above 3300 a gas condensate (McCain's fluid-type rules, JPT 1994).",
  },
  "bubble-point": {
    title:
      "A bubble point is known at every temperature, and file and sample record agree",
    severities: ["warning", "info"],
    source:
      "Common practice: the bubble point splits every oil property into a saturated and an undersaturated branch, so it must be known per temperature.",
  },
  "rs-saturated-rising": {
    title: "Rs rises with pressure below the bubble point",
    severities: ["error"],
    source:
      "Black-oil behaviour (McCain, The Properties of Petroleum Fluids, 2nd ed., 1990); black-oil simulators need Rs strictly increasing on the saturated branch.",
  },
  "rs-undersaturated-flat": {
    title: "Rs is flat (= Rsb) above the bubble point",
    severities: ["warning"],
    source:
      "Definition: above pb there is no free gas, so Rs = Rsb (McCain 1990).",
  },
  "bo-saturated-rising": {
    title: "Bo rises with pressure below the bubble point",
    severities: ["error"],
    source:
      "Black-oil behaviour: the oil swells as gas dissolves (McCain 1990); simulators need Bo increasing with Rs.",
  },
  "bo-undersaturated-falling": {
    title: "Bo falls with pressure above the bubble point",
    severities: ["error"],
    source:
      "Liquid compression, Bo = Bob·exp[−co(p − pb)] (McCain 1990); simulators reject Bo rising with pressure above pb.",
  },
  "bg-falling": {
    title: "Bg falls with pressure",
    severities: ["error"],
    source:
      "Real-gas law Bg = (psc/Tsc)·zT/p, roughly ∝ 1/p; simulators need Bg strictly decreasing.",
  },
  "oil-viscosity-saturated-falling": {
    title: "Oil viscosity falls with pressure below the bubble point",
    severities: ["warning"],
    source:
      "Black-oil behaviour: dissolved gas thins the oil, so μo falls as pressure rises to pb (Beggs & Robinson, JPT 1975; McCain 1990).",
  },
  "oil-viscosity-undersaturated-rising": {
    title: "Oil viscosity rises with pressure above the bubble point",
    severities: ["warning"],
    source:
      "Above pb μo rises with pressure, typically +5 to +35 % per 1000 psi (Bergman & Sutton, SPE 103144, 2006).",
  },
  "oil-viscosity-temperature": {
    title: "Oil viscosity falls with temperature at a fixed pressure",
    severities: ["warning"],
    source:
      "Oil viscosity falls strongly with temperature (Beggs & Robinson, JPT 1975).",
  },
  "oil-density-undersaturated-rising": {
    title: "Oil density rises with pressure above the bubble point",
    severities: ["warning"],
    source:
      "Above pb the oil mass is fixed and its volume shrinks, so ρo ∝ 1/Bo rises with pressure (McCain 1990).",
  },
  "gas-viscosity-rising": {
    title: "Gas viscosity rises with pressure",
    severities: ["warning"],
    source:
      "Gas viscosity rises with gas density, hence with pressure at fixed temperature (Lee, Gonzalez & Eakin, JPT 1966).",
  },
  "bubble-point-temperature": {
    title: "The bubble point rises with temperature",
    severities: ["warning"],
    source:
      "For black oils pb rises with temperature (Standing 1947: pb ∝ 10^(0.00091·T)).",
  },
  "saturated-consistency": {
    title:
      "Consistency test dBo/dp < Bg·dRs/dp on every saturated interval (Bg in rb/scf, Rs in scf/STB)",
    severities: ["error"],
    source:
      "Positive total compressibility below pb: co = −(1/Bo)·dBo/dp + (Bg/Bo)·dRs/dp > 0 (McCain 1990), the inequality test of PVT-report QC.",
  },
  "undersaturated-compressibility": {
    title:
      "Oil compressibility above the bubble point, from Bo, lies in 2–60 × 10⁻⁶ 1/psi",
    severities: ["warning"],
    source:
      "Undersaturated oil compressibility is often about 10 × 10⁻⁶ 1/psi (Standard Handbook of Petroleum & Natural Gas Engineering, Vol. 2); typical 5–25, warning outside 2–60 × 10⁻⁶ 1/psi is common practice.",
  },
  "bg-z-consistency": {
    title: "Bg agrees with Z through Bg = (psc/Tsc)·zT/p within 1 %",
    severities: ["warning"],
    source:
      "Real-gas law Bg = (psc/Tsc)·zT/p; the 1 % tolerance covers standard-pressure bases from 14.65 to 14.73 psia (common practice).",
  },
  "bg-implied-z": {
    title: "Bg implies a plausible Z (when no Z is given)",
    severities: ["warning"],
    source:
      "Real-gas law Bg = (psc/Tsc)·zT/p with Z bounds 0.3–2.0 (common practice); catches Bg written in ft³/scf but labelled rb/scf.",
  },
  "density-mass-balance": {
    title:
      "Oil density agrees with the mass balance (γo, γg, Rs, Bo) within 5 %",
    severities: ["warning"],
    source:
      "Mass balance ρo = (ρw·γo + 0.013594·γg·Rs)/Bo in lb/ft³ (McCain 1990); 5 % is the usual PVT-report criterion.",
  },
  "smooth-fit-outlier": {
    title:
      "No value stands off a smooth local fit of its neighbours on its branch",
    severities: ["warning"],
    source:
      "Common practice: a smoothness check against a local quadratic through up to two neighbours on each side, on the same branch, in 1/Bg, ln μ or the value itself.",
  },
  "correlation-departure": {
    title:
      "Measured pb, Bob, μob, Z and μg are compared with published correlations",
    severities: ["warning", "info"],
    source:
      "Standing (1947), Vasquez & Beggs (1980), Beggs & Robinson (1975), Sutton (1985) with Dranchuk & Abou-Kassem (1975), Lee, Gonzalez & Eakin (1966); errors of 10–30 % are normal for correlations, so a departure is a look, never a rejection (common practice).",
  },
} as const satisfies Record<string, RuleInfo>;

export type RuleId = keyof typeof RULES;
