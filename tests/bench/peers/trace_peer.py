"""Peer for `sekundo trace FILE --heater-column heater --picker fraction`: the script a
practitioner would write with pandas and numpy.

Reads the digitiser CSV with pandas.read_csv (C engine; "#" lines are comments), puts time zero
at the heater onset (50 % of the drive's first rise above its first 8 samples, linearly
interpolated), takes the sensor's baseline and noise from the samples before time zero, and
picks the arrival where the sensor's leading edge crosses half of its peak (linear
interpolation). Prints the delay in seconds.

Usage: python3 trace_peer.py TRACE_CSV
Only for benchmarks (tests/bench/peers/run-peers.mjs); not part of Sekundo.
"""
import sys

import numpy as np
import pandas as pd


def crossing(t, y, i, level):
    """Time where y crosses level between samples i - 1 and i."""
    return t[i - 1] + (level - y[i - 1]) / (y[i] - y[i - 1]) * (t[i] - t[i - 1])


def main(path):
    frame = pd.read_csv(path, comment="#", engine="c")
    t = frame.iloc[:, 0].to_numpy(dtype=np.float64)
    heater = frame["heater"].to_numpy(dtype=np.float64)
    sensor = frame["sensor"].to_numpy(dtype=np.float64)

    drive = heater - heater[:8].mean()
    half_drive = 0.5 * drive.max()
    i_on = int(np.argmax(drive >= half_drive))
    onset_s = crossing(t, drive, i_on, half_drive)

    before = t < onset_s
    base = sensor[before].mean()
    noise = sensor[before].std(ddof=1)
    y = sensor - base
    after = np.nonzero(~before)[0]
    window = y[after[0]:]
    i_peak = after[0] + int(np.argmax(window))
    half = 0.5 * y[i_peak]
    below = np.nonzero(y[after[0]:i_peak] < half)[0]
    i_edge = after[0] + int(below[-1]) + 1
    arrival_s = crossing(t, y, i_edge, half)
    print(f"delay_s={arrival_s - onset_s!r} onset_s={onset_s!r} snr={y[i_peak] / noise:.3g}")


if __name__ == "__main__":
    main(sys.argv[1])
