#!/usr/bin/env python3
"""Time the whole `rheoside fit` process against a scipy process fitting the same CSV.

Both sides are timed as whole processes (start-up included), because that is what a script
calling either one pays. Prints the medians, the ratio, and whether the Herschel–Bulkley
parameters agree to 1e-6 relative.

    python3 benches/fit_vs_scipy.py [CSV] [--runs 15]

Needs numpy and scipy (pip install numpy scipy) and a release build (cargo build --release).
The default CSV is an invented 12-point sauce-like data set written to a temp file.
"""
import json
import os
import statistics
import subprocess
import sys
import tempfile
import time

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
BINARY = os.path.join(ROOT, "target", "release", "rheoside")

# The scipy side: a fresh interpreter that reads the CSV and fits τ = τ0 + K·γ̇ⁿ.
SCIPY_FIT = r"""
import csv, json, sys
import numpy as np
from scipy.optimize import curve_fit
rows = list(csv.DictReader(open(sys.argv[1])))
x = np.array([float(r["shear_rate"]) for r in rows])
y = np.array([float(r["shear_stress"]) for r in rows])
hb = lambda g, t0, k, n: t0 + k * g**n
slope, icpt = np.polyfit(np.log(x), np.log(y), 1)
p, cov = curve_fit(hb, x, y, p0=[0.5 * y.min(), np.exp(icpt), slope],
                   ftol=1e-15, xtol=1e-15, gtol=1e-15, maxfev=100000)
print(json.dumps({"tau0_pa": p[0], "k_pa_sn": p[1], "n": p[2]}))
"""

# Invented: a sauce-like Herschel–Bulkley product (τ0 6 Pa, K 3.2 Pa·sⁿ, n 0.42) with
# a fixed small scatter so the fit is not exact.
DEMO_RATES = [2, 5, 10, 20, 40, 60, 100, 150, 250, 400, 600, 1000]
DEMO_SCATTER = [0.02, -0.015, 0.01, -0.02, 0.012, -0.008, 0.015, -0.01, 0.006, -0.012, 0.009, -0.004]


def demo_csv():
    fd, path = tempfile.mkstemp(suffix=".csv")
    with os.fdopen(fd, "w") as f:
        f.write("shear_rate,shear_stress\n")
        for g, e in zip(DEMO_RATES, DEMO_SCATTER):
            f.write(f"{g},{(6.0 + 3.2 * g**0.42) * (1 + e):.6f}\n")
    return path


def timed(cmd):
    start = time.perf_counter()
    out = subprocess.run(cmd, check=True, capture_output=True, text=True).stdout
    return time.perf_counter() - start, out


def main():
    args = sys.argv[1:]
    runs = 15
    if "--runs" in args:
        i = args.index("--runs")
        runs = int(args[i + 1])
        del args[i : i + 2]
    csv_path = args[0] if args else demo_csv()
    if not os.path.exists(BINARY):
        sys.exit("build first: cargo build --release")
    ours_cmd = [BINARY, "fit", csv_path, "--model", "herschel-bulkley", "--json"]
    scipy_cmd = [sys.executable, "-c", SCIPY_FIT, csv_path]
    ours, theirs = [], []
    for _ in range(runs):
        t, ours_out = timed(ours_cmd)
        ours.append(t)
        t, scipy_out = timed(scipy_cmd)
        theirs.append(t)
    mine = json.loads(ours_out)["params"]
    ref = json.loads(scipy_out)
    worst = max(abs(mine[k] - ref[k]) / abs(ref[k]) for k in ref)
    m_ours, m_theirs = statistics.median(ours), statistics.median(theirs)
    print(f"rheoside fit: median {m_ours * 1e3:.2f} ms over {runs} runs")
    print(f"scipy fit:    median {m_theirs * 1e3:.2f} ms over {runs} runs")
    print(f"ratio (scipy / rheoside): {m_theirs / m_ours:.1f}x  (target >= 50x)")
    print(f"largest relative parameter difference: {worst:.2e}  (target <= 1e-6)")


if __name__ == "__main__":
    main()
