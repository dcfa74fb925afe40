#!/usr/bin/env python3
"""Writes the reference fixtures for app/core/interpolation (linear.json, newton.json, pchip.json).

Every expected value comes from SciPy, a general-purpose library independent of our code:
  linear  scipy.interpolate.RegularGridInterpolator(method="linear")
  newton  scipy.interpolate.BarycentricInterpolator, on the zone picked by the zone rule of issue 3,
          first along pressure for every temperature column of the zone, then along temperature
  pchip   scipy.interpolate.PchipInterpolator, along pressure over the whole pressure axis for every
          temperature column, then along temperature over the whole temperature axis
The zone rule itself is re-implemented here in a few lines, independently of the TypeScript.

The grids are invented (synthetic smooth functions, rounded like laboratory values); they are not
measurements of any fluid.

Run from the repository root:  python3 reference-data/interpolation/make-fixtures.py
"""

import json
import math
import platform
from pathlib import Path

import numpy as np
import scipy
from scipy.interpolate import BarycentricInterpolator, PchipInterpolator, RegularGridInterpolator

OUT = Path(__file__).resolve().parent
RNG = np.random.default_rng(20250601)

SYNTHETIC = (
    "The grids below are invented: smooth synthetic functions of pressure and temperature, rounded to "
    "six decimals like laboratory values. They are not measurements of any fluid."
)


# ---------------------------------------------------------------- invented grids


def make_grid(pressures, temperatures, f):
    values = [[round(f(p, t), 6) for t in temperatures] for p in pressures]
    return {"pressures": list(map(float, pressures)), "temperatures": list(map(float, temperatures)), "values": values}


def smooth(p, t):
    # a formation-volume-factor-like surface: rising, curving, gently temperature dependent
    return 1.02 + 0.31 * (1 - math.exp(-p / 2300)) * (1 + 0.0021 * (t - 150)) + 0.012 * math.sin(t / 37 + p / 1900)


def wavy(p, t):
    # local maxima and minima in both directions, to exercise the pchip slope limiter
    return 2.0 + math.sin(p / 600) * math.cos(t / 45) + 0.3 * math.cos(p / 350 + t / 70)


GRIDS = {
    "nonuniform": make_grid(
        [500, 800, 1200, 1500, 2000, 2600, 3000, 3800, 5000], [150, 165, 180, 200, 230, 260], smooth
    ),
    "uniform": make_grid(list(range(1000, 4001, 500)), [100, 125, 150, 175, 200], smooth),
    "one-column": make_grid([400, 900, 1500, 2200, 3000, 3900, 4800], [212], smooth),
    "small": make_grid([1000, 1800, 3000], [120, 160, 220], smooth),
    "wavy": make_grid([300, 700, 900, 1400, 2000, 2300, 3100, 3600, 4500], [80, 110, 125, 160, 200, 240], wavy),
}


def arrays(name):
    g = GRIDS[name]
    return np.array(g["pressures"]), np.array(g["temperatures"]), np.array(g["values"], dtype=float)


# ---------------------------------------------------------------- points


def points_for(name):
    """(label, pressure, temperature, extrapolate) for one grid."""
    P, T, _ = arrays(name)
    pts = []
    for _ in range(8):
        pts.append(("interior", float(RNG.uniform(P[0], P[-1])), float(RNG.uniform(T[0], T[-1])), False))
    tiny_p = 1e-3 * (P[1] - P[0])
    tiny_p_hi = 1e-3 * (P[-1] - P[-2])
    t_mid = float(T[len(T) // 2]) if len(T) == 1 else float((T[0] + T[1]) / 2 + 3.3)
    p_mid = float((P[len(P) // 2] + P[len(P) // 2 - 1]) / 2 + 17)
    # near every edge, just inside
    pts.append(("near low-pressure edge", float(P[0] + tiny_p), t_mid, False))
    pts.append(("near high-pressure edge", float(P[-1] - tiny_p_hi), t_mid, False))
    if len(T) > 1:
        pts.append(("near low-temperature edge", p_mid, float(T[0] + 1e-3 * (T[1] - T[0])), False))
        pts.append(("near high-temperature edge", p_mid, float(T[-1] - 1e-3 * (T[-1] - T[-2])), False))
        pts.append(("second cell from the high-temperature edge", p_mid, float((T[-2] + T[-3]) / 2 + 1) if len(T) > 2 else float(T[-1] - 1), False))
    # corners and nodes
    for i, j in [(0, 0), (len(P) - 1, len(T) - 1), (0, len(T) - 1), (len(P) - 1, 0), (len(P) // 2, len(T) // 2)]:
        pts.append((f"on node [{i}][{j}]", float(P[i]), float(T[j]), False))
    # on grid lines
    pts.append(("on a pressure row, between temperatures", float(P[len(P) // 2]), t_mid, False))
    if len(T) > 1:
        pts.append(("on a temperature column, between pressures", p_mid, float(T[len(T) // 2]), False))
    # exact midpoints (even-degree tie-break)
    pm = float((P[2] + P[3]) / 2) if len(P) > 3 else float((P[0] + P[1]) / 2)
    tm = float((T[1] + T[2]) / 2) if len(T) > 2 else float(T[0]) if len(T) == 1 else float((T[0] + T[1]) / 2)
    pts.append(("midway in pressure and temperature", pm, tm, False))
    pts.append(("midway in pressure, on a temperature node", pm, float(T[0]), False))
    # outside (extrapolation allowed)
    pts.append(("below the pressure range (extrapolated)", float(P[0] - 0.2 * (P[1] - P[0])), t_mid, True))
    if len(T) > 1:
        pts.append(("above the temperature range (extrapolated)", p_mid, float(T[-1] + 0.3 * (T[-1] - T[-2])), True))
    return pts


# ---------------------------------------------------------------- zone rule (issue 3), re-implemented


def cell(a, t):
    n = len(a)
    if n < 2:
        return 0
    k = int(np.searchsorted(a, t, side="right")) - 1
    return min(max(k, 0), n - 2)


def zone_start(a, t, m):
    n = len(a)
    k = cell(a, t)
    if m % 2 == 1:
        s = k - (m - 1) // 2
    elif n < 2 or (t - a[k]) <= (a[k + 1] - t):
        s = k - m // 2
    else:
        s = k - m // 2 + 1
    return min(max(s, 0), n - 1 - m)


def zone(a, t, m):
    s = zone_start(a, t, m)
    return list(range(s, s + m + 1))


def bary(x, y, t):
    """BarycentricInterpolator through (x, y), evaluated at t (a single node is a constant)."""
    if len(x) == 1:
        return float(y[0])
    return float(BarycentricInterpolator(x, y)(t))


def newton_two_step(P, T, V, p, t, m, n):
    zp = zone(P, p, m)
    zt = zone(T, t, n)
    row = [bary(P[zp], V[zp, j], p) for j in zt]
    return bary(T[zt], np.array(row), t), zp, zt


def check_degree(m, count):
    """Degree the error estimate compares with: one higher when the axis allows, else one lower."""
    if count == 1:
        return None
    return m + 1 if m + 1 <= count - 1 else m - 1


# ---------------------------------------------------------------- fixtures


def header(function, extra):
    return {
        "about": "Reference values for the interpolation engine (app/core/interpolation). " + SYNTHETIC,
        "generator": "reference-data/interpolation/make-fixtures.py",
        "library": "SciPy",
        "version": scipy.__version__,
        "numpyVersion": np.__version__,
        "pythonVersion": platform.python_version(),
        "function": function,
        **extra,
        "grids": GRIDS,
        "cases": [],
    }


def linear_fixture():
    fx = header(
        "scipy.interpolate.RegularGridInterpolator(method='linear', bounds_error=False, fill_value=None)",
        {"note": "A one-column grid is interpolated as a 1-D RegularGridInterpolator over pressure."},
    )
    for name in GRIDS:
        P, T, V = arrays(name)
        f = (
            RegularGridInterpolator((P,), V[:, 0], method="linear", bounds_error=False, fill_value=None)
            if len(T) == 1
            else RegularGridInterpolator((P, T), V, method="linear", bounds_error=False, fill_value=None)
        )
        for label, p, t, ext in points_for(name):
            if len(T) == 1 and t != T[0] and not ext:
                continue
            value = float(f([[p]] if len(T) == 1 else [[p, t]])[0])
            fx["cases"].append(
                {
                    "grid": name,
                    "label": label,
                    "point": {"pressure": p, "temperature": t},
                    "options": {"method": "linear", "extrapolate": ext},
                    "value": value,
                    "stencil": {"pressure": zone(P, p, min(1, len(P) - 1)), "temperature": zone(T, t, min(1, len(T) - 1))},
                }
            )
    return fx


DEGREES = [1, 2, 3, 4, [3, 2], [2, 3]]


def newton_fixture():
    fx = header(
        "scipy.interpolate.BarycentricInterpolator",
        {
            "note": (
                "Two steps on the zone of the zone rule: BarycentricInterpolator along pressure for every "
                "temperature column of the zone, then along temperature on that row. checkPressure and "
                "checkTemperature repeat the computation with the degree on one axis raised by one (or, "
                "when the zone is already the whole axis, lowered by one): the engine's error estimate is "
                "built from these two differences."
            )
        },
    )
    for name in GRIDS:
        P, T, V = arrays(name)
        for deg in DEGREES:
            mq, nq = (deg, deg) if isinstance(deg, int) else deg
            m, n = min(mq, len(P) - 1), min(nq, len(T) - 1)
            for label, p, t, ext in points_for(name):
                if len(T) == 1 and t != T[0] and not ext:
                    continue
                value, zp, zt = newton_two_step(P, T, V, p, t, m, n)
                case = {
                    "grid": name,
                    "label": label,
                    "point": {"pressure": p, "temperature": t},
                    "options": {"method": "newton", "degree": deg, "extrapolate": ext},
                    "value": value,
                    "stencil": {"pressure": zp, "temperature": zt},
                    "degreeReduced": (m < mq and len(P) > 1) or (n < nq and len(T) > 1),
                }
                cp = check_degree(m, len(P))
                if cp is not None:
                    v, zpc, _ = newton_two_step(P, T, V, p, t, cp, n)
                    case["checkPressure"] = {"degree": cp, "zone": zpc, "value": v}
                ct = check_degree(n, len(T))
                if ct is not None:
                    v, _, ztc = newton_two_step(P, T, V, p, t, m, ct)
                    case["checkTemperature"] = {"degree": ct, "zone": ztc, "value": v}
                fx["cases"].append(case)
    return fx


def pchip_two_step(P, T, V, p, t):
    row = np.array([float(PchipInterpolator(P, V[:, j])(p)) for j in range(len(T))])
    if len(T) == 1:
        return float(row[0])
    return float(PchipInterpolator(T, row)(t))


def pchip_fixture():
    fx = header(
        "scipy.interpolate.PchipInterpolator",
        {
            "note": (
                "Two steps, as the engine does them: PchipInterpolator along pressure over the whole "
                "pressure axis for every temperature column, then along temperature over the whole "
                "temperature axis (extrapolation continues the end cubic, SciPy's default). The script also "
                "checks that RegularGridInterpolator(method='pchip') on the transposed grid (it works from "
                "its last axis first) gives the same numbers."
            )
        },
    )
    for name in GRIDS:
        P, T, V = arrays(name)
        rgi = None
        if len(P) > 3 and len(T) > 3:
            rgi = RegularGridInterpolator((T, P), V.T, method="pchip", bounds_error=False, fill_value=None)
        for label, p, t, ext in points_for(name):
            if len(T) == 1 and t != T[0] and not ext:
                continue
            value = pchip_two_step(P, T, V, p, t)
            if rgi is not None and not ext:
                other = float(rgi([[t, p]])[0])
                assert abs(other - value) <= 1e-12 * max(1.0, abs(value)), (name, label, value, other)
            fx["cases"].append(
                {
                    "grid": name,
                    "label": label,
                    "point": {"pressure": p, "temperature": t},
                    "options": {"method": "pchip", "extrapolate": ext},
                    "value": value,
                }
            )
    return fx


def dump(data):
    """Readable and diff-friendly: the header and grids indented, one case per line."""
    head_data = {k: v for k, v in data.items() if k != "cases"}
    cases = data["cases"]
    head = json.dumps(head_data, indent=1)[:-2]
    lines = ",\n".join("  " + json.dumps(c) for c in cases)
    return head + ',\n "cases": [\n' + lines + "\n ]\n}\n"


def main():
    for filename, build in [("linear.json", linear_fixture), ("newton.json", newton_fixture), ("pchip.json", pchip_fixture)]:
        data = build()
        (OUT / filename).write_text(dump(data))
        print(f"wrote {filename}: {len(data['cases'])} cases")


if __name__ == "__main__":
    main()
