/**
 * Cross-property rules: saturated-consistency (dBo/dp < Bg·dRs/dp), bg-z-consistency, bg-implied-z and
 * density-mass-balance.
 */
import {
  CUBIC_FOOT_PER_BARREL,
  FIELD_STANDARD_CONDITIONS,
  type StandardConditions,
} from "../../units";
import { gasFvf } from "../../properties/gas-properties";
import { massBalanceOilDensity } from "../../properties/oil-density";
import { saturatedConsistencyTest } from "../../properties/saturated-branch";
import type { QcCell } from "../types";
import { cell, samePressure, type QcContext } from "./context";
import {
  formatPercent,
  formatReading,
  formatSignedPercent,
} from "../../format";
import { branchOf } from "./trends";

function standardConditions(ctx: QcContext): StandardConditions {
  const sc = ctx.meta.standardConditions;
  if (sc && sc.pressurePsia > 0 && Number.isFinite(sc.temperatureF)) {
    return {
      id: "report",
      label: "report",
      pressurePsia: sc.pressurePsia,
      temperatureF: sc.temperatureF,
    };
  }
  return FIELD_STANDARD_CONDITIONS;
}

/** Bg (rb/scf) for Z = 1 at (p, T): multiply by Z to get Bg. */
function idealBg(
  ctx: QcContext,
  pressure: number,
  temperature: number,
): number | undefined {
  try {
    return gasFvf({
      pressure,
      temperature,
      z: 1,
      standardConditions: standardConditions(ctx),
    }).value;
  } catch {
    return undefined;
  }
}

/** Bg at (p, T): measured, or from the measured Z. */
function bgAt(
  ctx: QcContext,
  pressure: number,
  temperature: number,
): number | null {
  const bg = ctx.valueAt("gas_fvf", pressure, temperature);
  if (bg !== undefined) return bg;
  const z = ctx.valueAt("z_factor", pressure, temperature);
  const ideal = idealBg(ctx, pressure, temperature);
  return z !== undefined && ideal !== undefined ? z * ideal : null;
}

export function checkSaturatedConsistency(ctx: QcContext): void {
  if (!ctx.grid("oil_fvf") || !ctx.grid("solution_gor")) return;
  let skipped = false;
  for (const t of ctx.temperatures) {
    const bubble = ctx.bubbleAt(t);
    if (!bubble) continue;
    const bo = branchOf(ctx.series("oil_fvf", t), bubble, "saturated");
    const rs = ctx.series("solution_gor", t);
    const points = bo
      .map((b) => ({
        pressure: b.pressure,
        oilFvf: b.value,
        solutionGor: rs.find((r) => samePressure(r.pressure, b.pressure))
          ?.value,
      }))
      .filter(
        (p): p is { pressure: number; oilFvf: number; solutionGor: number } =>
          p.solutionGor !== undefined,
      )
      .map((p) => ({ ...p, gasFvf: bgAt(ctx, p.pressure, t) }));
    for (let i = 1; i < points.length; i++) {
      const lo = points[i - 1];
      const hi = points[i];
      if (!lo || !hi) continue;
      if (lo.gasFvf === null && hi.gasFvf === null) {
        skipped = true;
        continue;
      }
      if (!(
        lo.oilFvf > 0 &&
        hi.oilFvf > 0 &&
        lo.solutionGor >= 0 &&
        hi.solutionGor >= 0
      ))
        continue; // plausible-range reports these
      let interval;
      try {
        interval = saturatedConsistencyTest([lo, hi]).intervals[0];
      } catch {
        continue;
      }
      if (!interval || interval.passes) continue;
      const dp = hi.pressure - lo.pressure;
      const dBo = interval.oilFvfSlope * dp;
      const gasTerm = interval.gasTermSlope * dp;
      const cells: QcCell[] = [
        cell("oil_fvf", lo.pressure, t),
        cell("oil_fvf", hi.pressure, t),
        cell("solution_gor", lo.pressure, t),
        cell("solution_gor", hi.pressure, t),
      ];
      ctx.add(
        "saturated-consistency",
        "NEGATIVE_TOTAL_COMPRESSIBILITY",
        "error",
        cells,
        `Between ${ctx.p(lo.pressure, "oil_fvf")} and ${ctx.p(hi.pressure, "oil_fvf")} at ${ctx.t(t, "oil_fvf")}, Bo changes by ${formatReading(dBo, 3)} rb/STB while Bg·ΔRs is only ${formatReading(gasTerm, 3)} rb/STB, so the total compressibility would be negative; below the bubble point dBo/dp must be less than Bg·dRs/dp.`,
      );
    }
  }
  if (skipped) {
    ctx.add(
      "saturated-consistency",
      "CHECK_SKIPPED",
      "info",
      [],
      "The consistency test dBo/dp < Bg·dRs/dp was skipped on saturated intervals without Bg or Z at either end; add the gas formation volume factor or Z to run it.",
    );
  }
}

const UNIT_SLIPS: readonly { readonly ratio: number; readonly hint: string }[] =
  [
    {
      ratio: CUBIC_FOOT_PER_BARREL,
      hint: "the values look like ft³/scf (or rm³/sm³) labelled as rb/scf",
    },
    {
      ratio: 1 / CUBIC_FOOT_PER_BARREL,
      hint: "the values look like rb/scf labelled as ft³/scf",
    },
    { ratio: 1000, hint: "the values look like rb/Mscf labelled as rb/scf" },
    {
      ratio: 1 / 1000,
      hint: "the values look like rb/scf labelled as rb/Mscf",
    },
  ];

/** For a Bg that implies an impossible Z: the unit slip that would make Z plausible. */
function impliedSlipHint(z: number): string {
  const slip = UNIT_SLIPS.find((s) => z / s.ratio >= 0.3 && z / s.ratio <= 2.0);
  return slip
    ? `${slip.hint}; check the unit in the header`
    : "check the unit in the header and the standard conditions";
}

function slipHint(ratio: number): string {
  const slip = UNIT_SLIPS.find((s) => Math.abs(ratio / s.ratio - 1) < 0.05);
  return slip
    ? `${slip.hint}; check the unit in the header`
    : "check the unit, the standard conditions and the Z values";
}

/** bg-z-consistency (Bg and Z both given) and bg-implied-z (Bg alone). */
export function checkGasConsistency(ctx: QcContext): void {
  const grid = ctx.grid("gas_fvf");
  if (!grid) return;
  grid.temperatures.forEach((t, j) => {
    const mismatch: {
      cells: QcCell[];
      worst: number;
      ratio: number;
      p: number;
    } = { cells: [], worst: 0, ratio: 1, p: 0 };
    const implied: { cells: QcCell[]; z: number; p: number; extreme: number } =
      { cells: [], z: 1, p: 0, extreme: 0 };
    grid.pressures.forEach((p, i) => {
      const bg = grid.values[i]?.[j];
      if (typeof bg !== "number" || !(bg > 0)) return;
      const ideal = idealBg(ctx, p, t);
      if (ideal === undefined) return;
      const z = ctx.valueAt("z_factor", p, t);
      if (z !== undefined && z > 0) {
        const ratio = bg / (z * ideal);
        const dev = Math.abs(ratio - 1);
        if (dev > 0.01) {
          mismatch.cells.push(cell("gas_fvf", p, t), cell("z_factor", p, t));
          if (dev > mismatch.worst)
            Object.assign(mismatch, { worst: dev, ratio, p });
        }
      } else {
        const zi = bg / ideal;
        if (zi < 0.3 || zi > 2.0) {
          implied.cells.push(cell("gas_fvf", p, t));
          const extreme = Math.abs(Math.log(zi));
          if (extreme > implied.extreme)
            Object.assign(implied, { z: zi, p, extreme });
        }
      }
    });
    if (mismatch.cells.length > 0) {
      ctx.add(
        "bg-z-consistency",
        "BG_Z_MISMATCH",
        "warning",
        mismatch.cells,
        `At ${ctx.t(t, "gas_fvf")}, Bg differs from (psc/Tsc)·zT/p with the given Z by up to ${formatSignedPercent(mismatch.ratio - 1)} (at ${ctx.p(mismatch.p, "gas_fvf")}${mismatch.cells.length > 2 ? `, ${mismatch.cells.length / 2} pressures in all` : ""}); ${slipHint(mismatch.ratio)}.`,
      );
    }
    if (implied.cells.length > 0) {
      ctx.add(
        "bg-implied-z",
        "BG_IMPLIED_Z",
        "warning",
        implied.cells,
        `At ${ctx.t(t, "gas_fvf")}, Bg implies Z = ${formatReading(implied.z, 3)} at ${ctx.p(implied.p, "gas_fvf")}${implied.cells.length > 1 ? ` (${implied.cells.length} values outside 0.3 to 2)` : ""}, outside the plausible 0.3 to 2; ${impliedSlipHint(implied.z)}.`,
      );
    }
  });
}

/** density-mass-balance: ρo against (ρw·γo + 0.013594·γg·Rs)/Bo, 5 %. */
export function checkDensityMassBalance(ctx: QcContext): void {
  const grid = ctx.grid("oil_density");
  const { apiGravity, gasGravity } = ctx.meta;
  if (!grid || apiGravity === undefined || gasGravity === undefined) return;
  grid.temperatures.forEach((t, j) => {
    const cells: QcCell[] = [];
    let worst = { dev: 0, p: 0, measured: 0, computed: 0 };
    grid.pressures.forEach((p, i) => {
      const rho = grid.values[i]?.[j];
      const rs = ctx.valueAt("solution_gor", p, t);
      const bo = ctx.valueAt("oil_fvf", p, t);
      if (typeof rho !== "number" || rs === undefined || bo === undefined)
        return;
      let computed: number;
      try {
        computed = massBalanceOilDensity({
          apiGravity,
          gasGravity,
          solutionGor: rs,
          oilFvf: bo,
          standardConditions: standardConditions(ctx),
        }).value;
      } catch {
        return;
      }
      const dev = rho / computed - 1;
      if (Math.abs(dev) <= 0.05) return;
      cells.push(cell("oil_density", p, t));
      if (Math.abs(dev) > Math.abs(worst.dev))
        worst = { dev, p, measured: rho, computed };
    });
    if (cells.length === 0) return;
    ctx.add(
      "density-mass-balance",
      "DENSITY_MASS_BALANCE",
      "warning",
      cells,
      `At ${ctx.t(t, "oil_density")} and ${ctx.p(worst.p, "oil_density")}, the oil density ${ctx.v("oil_density", worst.measured)} is ${formatPercent(Math.abs(worst.dev))} ${worst.dev > 0 ? "above" : "below"} the mass balance of the stock-tank oil and its dissolved gas (${ctx.v("oil_density", worst.computed)})${cells.length > 1 ? `, and ${cells.length - 1} other value${cells.length > 2 ? "s" : ""} by more than 5 %` : ""}; check the density, Rs, Bo and the sample's API and gas gravities.`,
    );
  });
}
