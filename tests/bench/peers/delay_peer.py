"""Peer for `sekundo delay --input`: the script a practitioner would write with numpy and scipy.

Reads a CSV of delays (header row, column delay_s), turns each into the second-sound speed
u = d / t, finds every temperature with u2(T) = u on the Donnelly & Barenghi (1998) u2 B-spline
(tests/reference/he4-svp.json, the same published curve Sekundo's kernel uses), with its sd from
the timing sd through the slope, and writes one CSV row per delay. Vectorised: per monotonic
branch of u2 a tabulated inverse (np.interp) as first guess, then Newton steps on the spline.

Usage: python3 delay_peer.py REFERENCE_JSON DELAYS_CSV DISTANCE_M DELAY_SD_S > out.csv
Only for benchmarks (tests/bench/peers/run-peers.mjs); not part of Sekundo.
"""
import json
import sys

import numpy as np
from scipy.interpolate import BSpline
from scipy.optimize import brentq


def main(reference_path, delays_path, distance_m, delay_sd_s):
    with open(reference_path, encoding="utf-8") as f:
        ref = json.load(f)["second_sound_speed"]
    u2 = BSpline(np.array(ref["knots"]), np.array(ref["coefficients"]), 3, extrapolate=False)

    def du2(x):
        return u2(x, nu=1)

    lo, hi = ref["valid_range"]

    # Monotonic branches between the extrema of u2 (the roots of du2/dT).
    grid = np.linspace(lo, hi, 20001)
    d = du2(grid)
    rising = d > 0
    turns = np.nonzero(rising[:-1] != rising[1:])[0]
    edges = [lo] + [brentq(du2, grid[i], grid[i + 1]) for i in turns] + [hi]

    delay_s = np.loadtxt(delays_path, delimiter=",", skiprows=1, usecols=0, ndmin=1)
    speed = distance_m / delay_s
    rel_sd = delay_sd_s / delay_s
    columns = [delay_s, speed, speed * rel_sd]
    names = ["delay_s", "speed_m_s", "speedSd_m_s"]
    for k, (a, b) in enumerate(zip(edges[:-1], edges[1:]), start=1):
        nodes = np.linspace(a, b, 4097)
        values = u2(nodes)
        order = np.argsort(values)
        table_u, table_t = values[order], nodes[order]
        inside = (speed >= table_u[0]) & (speed <= table_u[-1])
        root = np.interp(speed, table_u, table_t)
        with np.errstate(divide="ignore", invalid="ignore"):
            for _ in range(3):
                root = np.clip(root - (u2(root) - speed) / du2(root), a, b)
            slope = du2(root)
            sd = np.abs(speed * rel_sd / slope)
        root[~inside] = np.nan
        sd[~inside] = np.nan
        slope[~inside] = np.nan
        columns += [root, sd, slope]
        names += [f"T{k}_K", f"T{k}_sd_K", f"T{k}_slope_m_s_K"]
    out = np.column_stack(columns)
    np.savetxt(sys.stdout, out, delimiter=",", fmt="%.17g", header=",".join(names), comments="")


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2], float(sys.argv[3]), float(sys.argv[4]))
