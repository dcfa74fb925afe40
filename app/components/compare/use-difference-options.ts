import { useState } from "react";

const DEFAULT_THRESHOLD_PERCENT = 5;

/**
 * How the values table shows differences: the threshold typed (%; `thresholdPercent` is null while it is not
 * a number of 0 or more), the reference sample chosen (null: the first), and whether to extrapolate. Kept by
 * the page, so a choice survives the table's leaving and coming back as samples are chosen.
 */
export function useDifferenceOptions() {
  const [threshold, setThreshold] = useState(String(DEFAULT_THRESHOLD_PERCENT));
  const [referenceId, setReferenceId] = useState<number | null>(null);
  const [extrapolate, setExtrapolate] = useState(false);
  const value = Number(threshold);
  const thresholdPercent =
    threshold.trim() !== "" && Number.isFinite(value) && value >= 0
      ? value
      : null;
  return {
    threshold,
    setThreshold,
    thresholdPercent,
    referenceId,
    setReferenceId,
    extrapolate,
    setExtrapolate,
  };
}

export type DifferenceOptionsState = ReturnType<typeof useDifferenceOptions>;
