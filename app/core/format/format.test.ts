import { expect, test } from "vitest";
import * as format from "./index";
import {
  formatChange,
  formatCompared,
  formatDateTime,
  formatDecimals,
  formatDetail,
  formatDifference,
  formatErrorEstimate,
  formatFileSize,
  formatInMessage,
  formatListed,
  formatMeasured,
  formatMilliseconds,
  formatPercent,
  formatPlain,
  formatPlotValue,
  formatPrecision,
  formatPressure,
  formatReading,
  formatReadingPair,
  formatSignedPercent,
  formatSignificant,
  formatTemperature,
  roundSignificant,
} from "./index";
import source from "./index.ts?raw";

test("the module imports nothing, so every part of app/core may use it", () => {
  expect(source).not.toMatch(/^\s*import\b/m);
  expect(source).not.toMatch(/process\.env|require\(|import\(/);
  expect(Object.keys(format).length).toBeGreaterThan(15);
});

test("significant-digit rules", () => {
  expect(roundSignificant(1.23456789, 6)).toBe(1.23457);
  expect(roundSignificant(0.1 + 0.2, 10)).toBe(0.3);
  expect(roundSignificant(0, 5)).toBe(0);
  expect(formatSignificant(2500, 6)).toBe("2500");
  expect(formatSignificant(123456, 4)).toBe("123500");
  expect(formatPrecision(2500, 6)).toBe("2500.00");
  expect(formatDecimals(12.345, 1)).toBe("12.3");
});

test("measured value: 6 significant digits, exponent outside 1e-4 to 1e9, blank when missing", () => {
  expect(formatMeasured(1.234567)).toBe("1.23457");
  expect(formatMeasured(0.1 + 0.2)).toBe("0.3");
  expect(formatMeasured(123456789)).toBe("123457000");
  expect(formatMeasured(0)).toBe("0");
  expect(formatMeasured(0.00001234)).toBe("1.234e-5");
  expect(formatMeasured(2e9)).toBe("2e+9");
  expect(formatMeasured(null)).toBe("");
  expect(formatMeasured(undefined)).toBe("");
  expect(formatMeasured(Number.NaN)).toBe("");
});

test("listed condition: 5 significant digits, a dash when missing", () => {
  expect(formatListed(320.6062141)).toBe("320.61");
  expect(formatListed(95.55555556)).toBe("95.556");
  expect(formatListed(4650)).toBe("4650");
  expect(formatListed(123456)).toBe("123460");
  expect(formatListed(0.000012345678)).toBe("1.2346e-5");
  expect(formatListed(null)).toBe("—");
  expect(formatListed(undefined)).toBe("—");
});

test("plain number and detail", () => {
  expect(formatPlain(1.23456789)).toBe("1.23457");
  expect(formatPlain(75)).toBe("75");
  expect(formatPlain(Number.NaN)).toBe("NaN");
  expect(formatPlain(Number.POSITIVE_INFINITY)).toBe("Infinity");
  expect(formatDetail(1.23456789)).toBe("1.234568");
  expect(formatDetail(Number.NaN)).toBe("—");
});

test("compared and plotted values group thousands", () => {
  expect(formatCompared(12345.678)).toBe("12,346");
  expect(formatCompared(0.0012345)).toBe("0.0012345");
  expect(formatCompared(0.00001234)).toBe("1.234e-5");
  expect(formatCompared(Number.NaN)).toBe("—");
  expect(formatCompared(0)).toBe("0");
  expect(formatPlotValue(12345.678)).toBe("12,346");
  expect(formatPlotValue(0.0012345)).toBe("0.001235");
});

test("error estimate: two significant digits", () => {
  expect(formatErrorEstimate(0.0012345)).toBe("0.0012");
  expect(formatErrorEstimate(123)).toBe("120");
  expect(formatErrorEstimate(0.00001234)).toBe("1.2e-5");
  expect(formatErrorEstimate(0)).toBe("0");
  expect(formatErrorEstimate(Number.POSITIVE_INFINITY)).toBe("—");
});

test("pressure and temperature for a conditions box", () => {
  expect(formatPressure(172.36893)).toBe("172.37");
  expect(formatPressure(2500.004)).toBe("2500");
  expect(formatTemperature(93.333333)).toBe("93.33");
  expect(formatTemperature(200)).toBe("200");
});

test("numbers in messages: integers exact, others 10 significant digits", () => {
  expect(formatInMessage(75)).toBe("75");
  expect(formatInMessage(123456789012)).toBe("123456789012");
  expect(formatInMessage(1 / 3)).toBe("0.3333333333");
  expect(formatInMessage(1 / 3, 5)).toBe("0.33333");
  expect(formatInMessage(Number.NaN)).toBe("NaN");
  expect(formatInMessage(Number.NEGATIVE_INFINITY)).toBe("-Infinity");
});

test("QC readings keep their integer digits", () => {
  expect(formatReading(12345.6)).toBe("12346");
  expect(formatReading(1.23456)).toBe("1.235");
  expect(formatReading(1.2)).toBe("1.2");
  expect(formatReading(0.000012346)).toBe("1.235e-5");
  expect(formatReading(0)).toBe("0");
  expect(formatReadingPair(1.44161, 1.44159)).toEqual(["1.44161", "1.44159"]);
  expect(formatReadingPair(2, 2)).toEqual(["2", "2"]);
});

test("percentages", () => {
  expect(formatPercent(0.123)).toBe("12 %");
  expect(formatPercent(0.0456)).toBe("4.6 %");
  expect(formatSignedPercent(-0.075)).toBe("−7.5 %");
  expect(formatSignedPercent(0.12)).toBe("+12 %");
  expect(formatDifference(12.345)).toBe("+12.3 %");
  expect(formatDifference(-0.4211)).toBe("−0.42 %");
  expect(formatDifference(150.4)).toBe("+150 %");
  expect(formatDifference(0)).toBe("0.00 %");
  expect(formatChange(100, 101.2)).toBe("+1.2 %");
  expect(formatChange(100, 99.966)).toBe("-0.034 %");
  expect(formatChange(100, 150)).toBe("+50 %");
  expect(formatChange(0, 1)).toBe("");
  expect(formatChange(null, 1)).toBe("");
});

test("date-time, file size and duration", () => {
  expect(formatDateTime(new Date("2026-03-14T09:26:53.120Z"))).toBe(
    "2026-03-14 09:26 UTC",
  );
  expect(formatDateTime("2026-03-14T09:26:00Z")).toBe("2026-03-14 09:26 UTC");
  expect(formatDateTime(null)).toBe("—");
  expect(formatFileSize(5 * 1024 * 1024)).toBe("5.0 MB");
  expect(formatMilliseconds(12.345)).toBe("12.3");
});
