/**
 * Checks the order simulators need on a built table (canonical) or its JSON form (output units; the unit
 * conversions of these columns are all increasing, so the order carries over). Used by the tests and
 * available to callers that want to assert it before serving a table.
 */
import type { Branch } from "../interpolation";
import type { BlackOilTable } from "./build-table";
import { COLUMN_INFO, TABLE_COLUMNS, type TableColumnKey } from "./columns";
import type { BlackOilTableJson } from "./format";

export type OrderViolation = {
  row: number;
  column: "pressure" | "branch" | TableColumnKey;
  message: string;
};

type Plain = {
  pressure: number;
  branch: Branch | null;
  bubblePoint: boolean;
  values: Partial<Record<TableColumnKey, number>>;
};

function plainRows(table: BlackOilTable | BlackOilTableJson): Plain[] {
  if ("kind" in table) {
    return table.rows.map((r) => {
      const values: Partial<Record<TableColumnKey, number>> = {};
      for (const key of TABLE_COLUMNS)
        if (typeof r[key] === "number") values[key] = r[key];
      return {
        pressure: r.pressure,
        branch: r.branch,
        bubblePoint: r.bubblePoint,
        values,
      };
    });
  }
  return table.rows.map((r) => {
    const values: Partial<Record<TableColumnKey, number>> = {};
    for (const key of TABLE_COLUMNS) {
      const cell = r.cells[key];
      if (cell) values[key] = cell.value;
    }
    return {
      pressure: r.pressure,
      branch: r.branch,
      bubblePoint: r.bubblePoint,
      values,
    };
  });
}

/** Every place where the table breaks the order rules (empty when it keeps them all). */
export function findOrderViolations(
  table: BlackOilTable | BlackOilTableJson,
): OrderViolation[] {
  const rows = plainRows(table);
  const out: OrderViolation[] = [];
  const n = rows.length;
  for (let i = 1; i < n; i++) {
    if (!(rows[i]!.pressure > rows[i - 1]!.pressure))
      out.push({
        row: i,
        column: "pressure",
        message: "pressure does not increase",
      });
    if (
      rows[i - 1]!.branch === "undersaturated" &&
      rows[i]!.branch === "saturated"
    ) {
      out.push({
        row: i,
        column: "branch",
        message: "a saturated row follows an undersaturated one",
      });
    }
  }
  const col = (key: TableColumnKey): number[] | null =>
    rows.every((r) => r.values[key] !== undefined) && n > 0
      ? rows.map((r) => r.values[key]!)
      : null;
  let k = -1;
  for (let i = 0; i < n; i++) if (rows[i]!.branch === "saturated") k = i;
  const pbRow = rows.findIndex((r) => r.bubblePoint);
  const strict = (
    key: TableColumnKey,
    y: number[],
    from: number,
    to: number,
    up: boolean,
    what: string,
  ): void => {
    for (let i = from + 1; i <= to; i++) {
      // Rs = 0 (no gas dissolved) may repeat at the lowest pressures
      if (key === "solution_gor" && y[i] === 0 && y[i - 1] === 0) continue;
      if (up ? !(y[i]! > y[i - 1]!) : !(y[i]! < y[i - 1]!))
        out.push({
          row: i,
          column: key,
          message: `${COLUMN_INFO[key].name} ${what}`,
        });
    }
  };
  for (const key of TABLE_COLUMNS) {
    const y = col(key);
    if (!y) continue;
    for (let i = 0; i < n; i++) {
      const bad = key === "solution_gor" ? !(y[i]! >= 0) : !(y[i]! > 0);
      if (bad)
        out.push({
          row: i,
          column: key,
          message: `${COLUMN_INFO[key].name} is ${key === "solution_gor" ? "negative" : "not positive"}`,
        });
    }
    if (key === "solution_gor") {
      strict(
        key,
        y,
        0,
        k,
        true,
        "does not rise with pressure below the bubble point",
      );
      const from = pbRow >= 0 ? pbRow : k + 1;
      for (let i = from + 1; i < n; i++) {
        if (y[i] !== y[from])
          out.push({
            row: i,
            column: key,
            message: "Rs differs from Rsb at or above the bubble point",
          });
      }
    } else if (key === "oil_fvf") {
      strict(
        key,
        y,
        0,
        k,
        true,
        "does not rise with pressure below the bubble point",
      );
      strict(
        key,
        y,
        pbRow >= 0 ? pbRow : k + 1,
        n - 1,
        false,
        "does not fall with pressure above the bubble point",
      );
    } else if (key === "gas_fvf") {
      strict(key, y, 0, n - 1, false, "does not fall with pressure");
    }
  }
  return out;
}
