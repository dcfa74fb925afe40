/**
 * What every QC rule needs: the valid grids, the temperatures, the bubble point per temperature (stated,
 * from the sample record, or inferred), series of one property at one temperature, and message helpers.
 */
import { PROPERTY_KEYS, type PropertyKey } from "../../units";
import type {
  Finding,
  ParsedDataset,
  PropertyGrid,
  QcCell,
  QcFindingCode,
  Severity,
} from "../types";
import { CANONICAL_REFS, withUnit } from "./format";
import { RULES, type RuleId } from "./rules";

/** Temperatures closer than this (°F) are the same temperature. */
export const TEMPERATURE_TOLERANCE = 0.01;
/** Findings listed per rule; the rest are counted in one closing note. */
const MAX_FINDINGS_PER_RULE = 50;
/** Pressures closer than this fraction are the same pressure. */
const PRESSURE_TOLERANCE = 1e-6;

export interface QcMeta {
  /** Stock-tank oil gravity, °API: enables the correlation and density checks. */
  readonly apiGravity?: number;
  /** Gas specific gravity (air = 1): enables the correlation and density checks. */
  readonly gasGravity?: number;
  /** Standard conditions of the report (default 60 °F, 14.696 psia), for the Bg–Z check. */
  readonly standardConditions?: {
    readonly pressurePsia: number;
    readonly temperatureF: number;
  };
  /**
   * Bubble points from the sample record (psia at °F): used at temperatures where the file states none,
   * and compared with the file where both do.
   */
  readonly bubblePoints?: readonly {
    readonly temperature: number;
    readonly pressure: number;
  }[];
  /** Barometric pressure (psia) for showing gauge pressures in messages. */
  readonly barometricPsia?: number;
}

export interface Point {
  readonly pressure: number;
  readonly value: number;
}

type BubbleOrigin = "file" | "sample" | "inferred";

export interface BubbleAt {
  readonly temperature: number;
  readonly pressure: number;
  readonly origin: BubbleOrigin;
  /** For an inferred bubble point: true when it is only a lower bound (every point looked saturated). */
  readonly lowerBound?: boolean;
}

export class QcContext {
  readonly findings: Finding[] = [];
  readonly grids = new Map<PropertyKey, PropertyGrid>();
  temperatures: number[] = [];
  readonly bubble = new Map<number, BubbleAt>();

  constructor(
    readonly dataset: ParsedDataset,
    readonly meta: QcMeta,
  ) {}

  grid(property: PropertyKey): PropertyGrid | undefined {
    return this.grids.get(property);
  }

  /** Non-null values of a property at a temperature, by increasing pressure. */
  series(property: PropertyKey, temperature: number): Point[] {
    const grid = this.grids.get(property);
    if (!grid) return [];
    const j = grid.temperatures.findIndex(
      (t) => Math.abs(t - temperature) <= TEMPERATURE_TOLERANCE,
    );
    if (j < 0) return [];
    const out: Point[] = [];
    grid.pressures.forEach((p, i) => {
      const v = grid.values[i]?.[j];
      if (typeof v === "number") out.push({ pressure: p, value: v });
    });
    return out;
  }

  /** The value of a property at (p, T), or undefined. */
  valueAt(
    property: PropertyKey,
    pressure: number,
    temperature: number,
  ): number | undefined {
    return this.series(property, temperature).find((pt) =>
      samePressure(pt.pressure, pressure),
    )?.value;
  }

  bubbleAt(temperature: number): BubbleAt | undefined {
    for (const [t, b] of this.bubble)
      if (Math.abs(t - temperature) <= TEMPERATURE_TOLERANCE) return b;
    return undefined;
  }

  /** "at 220 °F" in the file's temperature unit. */
  t(temperature: number, property?: PropertyKey): string {
    const ref =
      (property && this.grids.get(property)?.temperatureUnit) ??
      this.firstGrid()?.temperatureUnit ??
      CANONICAL_REFS.temperature;
    return withUnit(temperature, ref);
  }

  /** A pressure in the file's pressure unit. */
  p(pressure: number, property?: PropertyKey): string {
    const ref =
      (property && this.grids.get(property)?.pressureUnit) ??
      this.firstGrid()?.pressureUnit ??
      CANONICAL_REFS.pressure;
    return withUnit(pressure, ref, this.meta.barometricPsia, 5);
  }

  /** A property value in the file's unit for it. */
  v(property: PropertyKey, value: number): string {
    return withUnit(
      value,
      this.grids.get(property)?.unit,
      this.meta.barometricPsia,
    );
  }

  firstGrid(): PropertyGrid | undefined {
    for (const key of PROPERTY_KEYS) {
      const grid = this.grids.get(key);
      if (grid) return grid;
    }
    return undefined;
  }

  private readonly perRule = new Map<
    RuleId,
    { count: number; dropped: number; cells: number }
  >();

  add(
    rule: RuleId,
    code: QcFindingCode,
    severity: Severity,
    cells: readonly QcCell[],
    message: string,
  ): void {
    const tally = this.perRule.get(rule) ?? { count: 0, dropped: 0, cells: 0 };
    this.perRule.set(rule, tally);
    if (tally.count >= MAX_FINDINGS_PER_RULE) {
      tally.dropped++;
      tally.cells += cells.length;
      return;
    }
    tally.count++;
    this.findings.push({
      code,
      severity,
      message,
      cells,
      rule,
      source: RULES[rule].source,
    });
  }

  /** One closing note per rule whose findings were cut short. */
  summarizeDropped(): void {
    for (const [rule, tally] of this.perRule) {
      if (tally.dropped === 0) continue;
      this.findings.push({
        code: "CHECK_SKIPPED",
        severity: "info",
        message: `The rule "${RULES[rule].title}" found ${tally.dropped} more problems than the ${MAX_FINDINGS_PER_RULE} listed; fix those first and check again.`,
        cells: [],
        rule,
        source: RULES[rule].source,
      });
    }
  }
}

export function samePressure(a: number, b: number): boolean {
  return (
    Math.abs(a - b) <=
    PRESSURE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b), 1)
  );
}

export function cell(
  property: PropertyKey | "bubble_point",
  pressure: number,
  temperature: number,
): QcCell {
  return { property, pressure, temperature };
}
