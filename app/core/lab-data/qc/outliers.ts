/**
 * Rule smooth-fit-outlier, per property, temperature and branch (see local-fit.ts for the method).
 */
import { PROPERTY_KEYS, type PropertyKey } from "../../units";
import { HEADER_LABELS } from "../header-names";
import type { QcContext, Point } from "./context";
import { cell } from "./context";
import {
  findOutliers,
  IDENTITY,
  LOG,
  RECIPROCAL,
  type Transform,
} from "./local-fit";
import { formatPercent } from "../../format";
import { branchOf } from "./trends";

interface OutlierSpec {
  /** Transform on each branch; null = do not check that branch. */
  readonly saturated: Transform | null;
  readonly undersaturated: Transform | null;
  /** Oil properties are split at pb; gas properties are not. */
  readonly split: boolean;
  /** Relative tolerance, and an absolute floor in canonical units. */
  readonly relative: number;
  readonly absolute: number;
}

/** Tolerances sit above usual laboratory repeatability for each property (common practice). */
const OUTLIER_SPECS: Readonly<Record<PropertyKey, OutlierSpec>> = {
  oil_fvf: {
    saturated: IDENTITY,
    undersaturated: LOG,
    split: true,
    relative: 0.01,
    absolute: 0,
  },
  solution_gor: {
    saturated: IDENTITY,
    undersaturated: null,
    split: true,
    relative: 0.03,
    absolute: 5,
  },
  oil_viscosity: {
    saturated: LOG,
    undersaturated: LOG,
    split: true,
    relative: 0.05,
    absolute: 0,
  },
  oil_density: {
    saturated: IDENTITY,
    undersaturated: IDENTITY,
    split: true,
    relative: 0.01,
    absolute: 0,
  },
  gas_fvf: {
    saturated: RECIPROCAL,
    undersaturated: null,
    split: false,
    relative: 0.03,
    absolute: 0,
  },
  gas_viscosity: {
    saturated: LOG,
    undersaturated: null,
    split: false,
    relative: 0.05,
    absolute: 0,
  },
  z_factor: {
    saturated: IDENTITY,
    undersaturated: null,
    split: false,
    relative: 0.02,
    absolute: 0,
  },
};

export function checkOutliers(ctx: QcContext): void {
  for (const key of PROPERTY_KEYS) {
    const spec = OUTLIER_SPECS[key];
    if (!ctx.grid(key)) continue;
    for (const t of ctx.temperatures) {
      const all = ctx.series(key, t);
      if (all.length < 4) continue;
      const bubble = ctx.bubbleAt(t);
      const branches: [Point[], Transform | null][] = [];
      if (!spec.split) branches.push([all, spec.saturated]);
      else if (bubble) {
        branches.push([branchOf(all, bubble, "saturated"), spec.saturated]);
        branches.push([
          branchOf(all, bubble, "undersaturated"),
          spec.undersaturated,
        ]);
      } else continue; // Without a bubble point a kink could look like an outlier.
      for (const [points, transform] of branches) {
        if (!transform || points.length < 4) continue;
        if (transform !== IDENTITY && !points.every((p) => p.value > 0))
          continue;
        const found = findOutliers(
          points.map((p) => p.pressure),
          points.map((p) => p.value),
          transform,
          (expected) =>
            Math.max(spec.relative * Math.abs(expected), spec.absolute),
        );
        for (const o of found) {
          const pt = points[o.index];
          if (!pt) continue;
          ctx.add(
            "smooth-fit-outlier",
            "OUTLIER",
            "warning",
            [cell(key, pt.pressure, t)],
            `At ${ctx.p(pt.pressure, key)} and ${ctx.t(t, key)}, the ${HEADER_LABELS[key]} ${ctx.v(key, pt.value)} stands ${formatPercent(Math.abs(o.deviation))} ${o.deviation > 0 ? "above" : "below"} a smooth curve through its neighbours (about ${ctx.v(key, o.expected)}); check the reading or its transcription.`,
          );
        }
      }
    }
  }
}
