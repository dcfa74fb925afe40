/**
 * Rule correlation-departure: measured values against published correlations, as a look and never a
 * rejection. Needs the stock-tank oil gravity (°API) and the gas gravity in QcMeta.
 *
 *   pb   vs Standing (1947) and Vasquez & Beggs (1980) from Rsb — departure beyond 20 % (both)
 *   Bob  vs Standing (1947) and Vasquez & Beggs (1980) from Rsb — beyond 5 % (both)
 *   μob  vs Beggs & Robinson (1975) from Rsb — beyond 30 %
 *   Z    vs Sutton (1985) pseudo-criticals with Dranchuk & Abou-Kassem (1975) — beyond 5 %
 *   μg   vs Lee, Gonzalez & Eakin (1966) with the measured (or correlated) Z — beyond 10 %
 * A departure beyond the band is an info note; beyond twice the band a warning.
 */
import { beggsRobinsonOilViscosity } from "../../properties/beggs-robinson";
import {
  gasDensity,
  leeGonzalezEakinViscosity,
} from "../../properties/gas-properties";
import { standingBubblePoint, standingOilFvf } from "../../properties/standing";
import {
  vasquezBeggsBubblePoint,
  vasquezBeggsOilFvf,
} from "../../properties/vasquez-beggs";
import { gasZFactor } from "../../properties/z-factor";
import type { PropertyKey } from "../../units";
import { HEADER_LABELS } from "../header-names";
import type { QcCell, Severity } from "../types";
import { cell, samePressure, type QcContext } from "./context";
import { formatPercent, formatSignedPercent } from "../../format";

const CORRELATION_BANDS = {
  bubblePoint: 0.2,
  oilFvf: 0.05,
  oilViscosity: 0.3,
  zFactor: 0.05,
  gasViscosity: 0.1,
} as const;

function severityFor(departure: number, band: number): Severity | null {
  const d = Math.abs(departure);
  if (d > 2 * band) return "warning";
  if (d > band) return "info";
  return null;
}

function tryValue(f: () => { value: number }): number | undefined {
  try {
    const v = f().value;
    return Number.isFinite(v) && v > 0 ? v : undefined;
  } catch {
    return undefined;
  }
}

/** The departure from the closest of several estimates (measured/estimate − 1). */
function closest(
  measured: number,
  estimates: readonly (number | undefined)[],
): { departure: number; estimate: number } | null {
  let best: { departure: number; estimate: number } | null = null;
  for (const e of estimates) {
    if (e === undefined) continue;
    const departure = measured / e - 1;
    if (!best || Math.abs(departure) < Math.abs(best.departure))
      best = { departure, estimate: e };
  }
  return best;
}

export function checkCorrelations(ctx: QcContext): void {
  const { apiGravity, gasGravity } = ctx.meta;
  if (
    apiGravity === undefined ||
    gasGravity === undefined ||
    !(apiGravity > 0) ||
    !(gasGravity > 0)
  ) {
    if (ctx.grids.size > 0) {
      ctx.add(
        "correlation-departure",
        "CHECK_SKIPPED",
        "info",
        [],
        "The comparison with published correlations (and the density mass balance) needs the sample's stock-tank oil gravity (°API) and gas gravity, so it was skipped.",
      );
    }
    return;
  }
  const fluid = { apiGravity, gasGravity };

  for (const t of ctx.temperatures) {
    const bubble = ctx.bubbleAt(t);
    if (!bubble || bubble.lowerBound) continue;
    const pb = bubble.pressure;
    const under = ctx
      .series("solution_gor", t)
      .filter((p) => p.pressure >= pb || samePressure(p.pressure, pb));
    const rsb = ctx.valueAt("solution_gor", pb, t) ?? under[0]?.value;
    if (rsb === undefined || !(rsb > 0)) continue;
    const at = { ...fluid, temperature: t, solutionGor: rsb };

    if (bubble.origin !== "inferred") {
      const c = closest(pb, [
        tryValue(() => standingBubblePoint(at)),
        tryValue(() => vasquezBeggsBubblePoint(at)),
      ]);
      report(
        ctx,
        c,
        CORRELATION_BANDS.bubblePoint,
        [cell("bubble_point", pb, t)],
        (d, e) =>
          `At ${ctx.t(t)} the bubble point ${ctx.p(pb)} departs by ${formatSignedPercent(d)} from the closest correlation estimate (${ctx.p(e)}, Standing or Vasquez–Beggs at Rsb); worth a look, not necessarily wrong.`,
      );
    }
    const bob = ctx.valueAt("oil_fvf", pb, t);
    if (bob !== undefined) {
      const c = closest(bob, [
        tryValue(() => standingOilFvf(at)),
        tryValue(() => vasquezBeggsOilFvf(at)),
      ]);
      report(
        ctx,
        c,
        CORRELATION_BANDS.oilFvf,
        [cell("oil_fvf", pb, t)],
        (d, e) =>
          `At ${ctx.t(t, "oil_fvf")} Bo at the bubble point (${ctx.v("oil_fvf", bob)}) departs by ${formatSignedPercent(d)} from the closest correlation estimate (${ctx.v("oil_fvf", e)}, Standing or Vasquez–Beggs); worth a look, not necessarily wrong.`,
      );
    }
    const mub = ctx.valueAt("oil_viscosity", pb, t);
    if (mub !== undefined) {
      const c = closest(mub, [tryValue(() => beggsRobinsonOilViscosity(at))]);
      report(
        ctx,
        c,
        CORRELATION_BANDS.oilViscosity,
        [cell("oil_viscosity", pb, t)],
        (d, e) =>
          `At ${ctx.t(t, "oil_viscosity")} the oil viscosity at the bubble point (${ctx.v("oil_viscosity", mub)}) departs by ${formatSignedPercent(d)} from the Beggs–Robinson estimate (${ctx.v("oil_viscosity", e)}); correlation errors this large are common, so this is worth a look only.`,
      );
    }
  }

  // Gas: Z and μg at every measured point, one note per property and temperature.
  for (const key of [
    "z_factor",
    "gas_viscosity",
  ] as const satisfies readonly PropertyKey[]) {
    const grid = ctx.grid(key);
    if (!grid) continue;
    const band =
      key === "z_factor"
        ? CORRELATION_BANDS.zFactor
        : CORRELATION_BANDS.gasViscosity;
    grid.temperatures.forEach((t, j) => {
      const groups = new Map<
        Severity,
        {
          cells: QcCell[];
          worst: number;
          p: number;
          measured: number;
          estimate: number;
        }
      >();
      grid.pressures.forEach((p, i) => {
        const measured = grid.values[i]?.[j];
        if (typeof measured !== "number" || !(measured > 0)) return;
        const zCorr = tryValue(() =>
          gasZFactor({ pressure: p, temperature: t, gasGravity }),
        );
        let estimate: number | undefined;
        if (key === "z_factor") estimate = zCorr;
        else {
          const z = ctx.valueAt("z_factor", p, t) ?? zCorr;
          if (z === undefined) return;
          const rho = tryValue(() =>
            gasDensity({ pressure: p, temperature: t, z, gasGravity }),
          );
          if (rho === undefined) return;
          estimate = tryValue(() =>
            leeGonzalezEakinViscosity({
              temperature: t,
              gasDensity: rho,
              gasGravity,
            }),
          );
        }
        if (estimate === undefined) return;
        const d = measured / estimate - 1;
        const severity = severityFor(d, band);
        if (!severity) return;
        const g = groups.get(severity) ?? {
          cells: [],
          worst: 0,
          p,
          measured,
          estimate,
        };
        g.cells.push(cell(key, p, t));
        if (Math.abs(d) > Math.abs(g.worst))
          Object.assign(g, { worst: d, p, measured, estimate });
        groups.set(severity, g);
      });
      for (const [severity, g] of groups) {
        const method =
          key === "z_factor"
            ? "the Dranchuk–Abou-Kassem estimate (Sutton pseudo-criticals)"
            : "the Lee–Gonzalez–Eakin estimate";
        ctx.add(
          "correlation-departure",
          "CORRELATION_DEPARTURE",
          severity,
          g.cells,
          `At ${ctx.t(t, key)} the ${HEADER_LABELS[key]} departs from ${method} by up to ${formatSignedPercent(g.worst)} (${ctx.v(key, g.measured)} against ${ctx.v(key, g.estimate)} at ${ctx.p(g.p, key)}${g.cells.length > 1 ? `; ${g.cells.length} values beyond ${formatPercent(severity === "warning" ? 2 * band : band)}` : ""}); check the gas gravity of the sample, or the values.`,
        );
      }
    });
  }
}

function report(
  ctx: QcContext,
  c: { departure: number; estimate: number } | null,
  band: number,
  cells: QcCell[],
  sentence: (departure: number, estimate: number) => string,
): void {
  if (!c) return;
  const severity = severityFor(c.departure, band);
  if (!severity) return;
  ctx.add(
    "correlation-departure",
    "CORRELATION_DEPARTURE",
    severity,
    cells,
    sentence(c.departure, c.estimate),
  );
}
