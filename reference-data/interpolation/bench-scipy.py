#!/usr/bin/env python3
"""SciPy half of `npm run bench:engine` (scripts/bench-engine.ts writes the inputs and reads our stdout).

Usage: bench-scipy.py DIR   where DIR holds, as little-endian float64:
  pressures.bin (N), temperatures.bin (M), values.bin (N*M, row i = pressure i),
  points-p.bin and points-t.bin (the points), ours-linear.bin and ours-pchip.bin (our values, for a
  same-numbers check on the first points).
Prints one JSON object: SciPy version; for RegularGridInterpolator linear, cubic and pchip the best
points per second over several runs, by wall clock and by CPU time of this process; and the largest
difference between SciPy's and our linear and pchip values.
"""

import json
import sys
import time
from pathlib import Path

import numpy as np
import scipy
from scipy.interpolate import RegularGridInterpolator


def load(d, name):
    return np.fromfile(d / name, dtype="<f8")


def best_rate(fn, count, repeats):
    """Best points per second over `repeats` runs: (by wall clock, by CPU time)."""
    wall = cpu = float("inf")
    for _ in range(repeats):
        w0, c0 = time.perf_counter(), time.process_time()
        fn()
        wall = min(wall, time.perf_counter() - w0)
        cpu = min(cpu, time.process_time() - c0)
    return {"wall": count / wall, "cpu": count / max(cpu, 1e-9)}


def main():
    d = Path(sys.argv[1])
    P = load(d, "pressures.bin")
    T = load(d, "temperatures.bin")
    V = load(d, "values.bin").reshape(len(P), len(T))
    pts = np.column_stack([load(d, "points-p.bin"), load(d, "points-t.bin")])
    n_pchip = int(sys.argv[2]) if len(sys.argv) > 2 else 10_000

    linear = RegularGridInterpolator((P, T), V, method="linear")
    cubic = RegularGridInterpolator((P, T), V, method="cubic")
    # pchip works from the last axis first, so give it (temperature, pressure) to get pressure first,
    # then temperature: the order of our engine, which makes the numbers comparable
    pchip = RegularGridInterpolator((T, P), V.T, method="pchip")

    linear(pts[:1000])
    cubic(pts[:1000])
    out = {
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "points": len(pts),
        "linear": best_rate(lambda: linear(pts), len(pts), 4),
        "cubic": best_rate(lambda: cubic(pts), len(pts), 4),
        "pchipPoints": n_pchip,
    }
    sub = np.ascontiguousarray(pts[:n_pchip][:, ::-1])
    pchip_values = pchip(sub)
    out["pchip"] = best_rate(lambda: pchip(sub), n_pchip, 2)

    ours_linear = load(d, "ours-linear.bin")
    ours_pchip = load(d, "ours-pchip.bin")
    k = min(len(ours_linear), len(pts))
    out["maxDiffLinear"] = float(np.max(np.abs(linear(pts[:k]) - ours_linear[:k])))
    k = min(len(ours_pchip), n_pchip)
    out["maxDiffPchip"] = float(np.max(np.abs(pchip_values[:k] - ours_pchip[:k])))
    print(json.dumps(out))


if __name__ == "__main__":
    main()
