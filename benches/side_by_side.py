#!/usr/bin/env python3
"""rheoside beside what an engineer would script instead, in one run, on the same inputs.

    python3 benches/side_by_side.py [--runs 15]

Prints, each with its median and the ratio:
  1. the Herschel–Bulkley fit on 12 points in process: rheoside's divan median
     (`cargo bench --bench fit`) against scipy.optimize.curve_fit timed in this interpreter,
     with the largest relative parameter difference (same data as benches/fit.rs);
  2. the 200-point Herschel–Bulkley pressure-drop curve in process: rheoside's divan median
     (`cargo bench --bench line`) against the same curve written with scipy.optimize.brentq
     on the closed-form laminar flow (same line and product as benches/line.rs), with the
     largest relative difference in pressure drop over a few flows checked by `rheoside line`;
  3. `rheoside fit` as a whole process against a Python + scipy process (benches/fit_vs_scipy.py).

Needs numpy and scipy (pip install numpy scipy). Builds the release benches and binary through
cargo. Targets (issue on evidence): in-process fit >= 20x, pressure-drop curve >= 50x.
Our side does more work than the scripts (intervals, AICc, regimes, friction), so the ratios
are conservative.
"""
import json
import math
import os
import re
import statistics
import subprocess
import sys
import tempfile
import timeit

import numpy as np
from scipy.optimize import brentq, curve_fit

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
BINARY = os.path.join(ROOT, "target", "release", "rheoside")

# benches/fit.rs readings(): 12 rates over 5–1000 1/s, τ = 20 + 8·γ̇^0.4 with a fixed ±1 % pattern.
SCATTER = [0.6, -0.9, 0.3, 1.0, -0.4, -0.8, 0.7, 0.1, -0.6, 0.9, -0.2, -0.5]
RATES = np.array([5.0 * 200.0 ** (i / 11.0) for i in range(12)])
STRESSES = np.array([(20.0 + 8.0 * g**0.4) * (1.0 + 0.01 * e) for g, e in zip(RATES, SCATTER)])

# benches/line.rs: the demo paste line (invented): 62.7 mm, 32 m + 6 m fittings, 2 m rise;
# τ0 160 Pa, K 45 Pa·sⁿ, n 0.33, 1480 kg/m³; 200 flows from 1e-4 to 0.02 m³/s.
D, L, RISE, RHO = 0.0627, 38.0, 2.0, 1480.0
TAU0, K, N = 160.0, 45.0, 0.33
FLOWS = np.linspace(1e-4, 0.02, 200)


def divan_median_us(bench, name):
    """Run one divan bench and read its median (µs) from the table."""
    out = subprocess.run(
        ["cargo", "bench", "--bench", bench, "--", name],
        cwd=ROOT, check=True, capture_output=True, text=True,
    ).stdout
    for line in out.splitlines():
        if name in line:
            cells = [c.strip() for c in line.split("│")]
            return to_us(cells[2])
    sys.exit(f"no '{name}' row in the {bench} bench output:\n{out}")


def to_us(cell):
    value, unit = re.match(r"([\d.]+)\s*(\S+)", cell).groups()
    return float(value) * {"ns": 1e-3, "µs": 1.0, "us": 1.0, "ms": 1e3, "s": 1e6}[unit]


def median_us(fn, runs):
    number = 20
    times = timeit.repeat(fn, number=number, repeat=runs)
    return statistics.median(times) / number * 1e6


def hb(g, t0, k, n):
    return t0 + k * g**n


def scipy_fit():
    slope, icpt = np.polyfit(np.log(RATES), np.log(STRESSES), 1)
    p, _cov = curve_fit(hb, RATES, STRESSES, p0=[0.5 * STRESSES.min(), math.exp(icpt), slope])
    return p


def hb_flow(tau_w):
    """Laminar Herschel–Bulkley pipe flow at wall stress τw (Skelland's closed form)."""
    if tau_w <= TAU0:
        return 0.0
    r3 = (D / 2) ** 3
    phi = TAU0 / tau_w
    a, m = 1.0 - phi, 1.0 / N
    bracket = a * a / (3 + m) + 2 * phi * a / (2 + m) + phi * phi / (1 + m)
    return math.pi * r3 * (tau_w / K) ** m * a ** (1 + m) * bracket


def scipy_curve():
    out = []
    for q in FLOWS:
        hi = 2 * TAU0
        while hb_flow(hi) < q:
            hi *= 2
        tau_w = brentq(lambda t: hb_flow(t) - q, TAU0, hi, xtol=1e-12, rtol=1e-12)
        out.append(4 * tau_w * L / D + RHO * 9.80665 * RISE)
    return out


def ours_line(q):
    cmd = [BINARY, "line", "--flow", str(q), "--diameter", str(D), "--length", "32",
           "--fittings-length", "6", "--elevation", str(RISE), "--density", str(RHO),
           "--tau0", str(TAU0), "--k", str(K), "--n", str(N), "--json"]
    return json.loads(subprocess.run(cmd, check=True, capture_output=True, text=True).stdout)


def main():
    runs = 15
    if "--runs" in sys.argv:
        runs = int(sys.argv[sys.argv.index("--runs") + 1])
    subprocess.run(["cargo", "build", "--release", "--quiet"], cwd=ROOT, check=True)

    print("1. Herschel–Bulkley fit, 12 points, in process")
    ours = divan_median_us("fit", "herschel_bulkley_fit_12")
    theirs = median_us(scipy_fit, runs)
    with tempfile.NamedTemporaryFile("w", suffix=".csv", delete=False) as f:
        f.write("shear_rate,shear_stress\n")
        f.writelines(f"{float(g)!r},{float(t)!r}\n" for g, t in zip(RATES, STRESSES))
    fit = subprocess.run(
        [BINARY, "fit", f.name, "--model", "herschel-bulkley", "--json"],
        check=True, capture_output=True, text=True,
    )
    os.unlink(f.name)
    mine = json.loads(fit.stdout)["params"]
    ref = dict(zip(["tau0_pa", "k_pa_sn", "n"], scipy_fit()))
    worst = max(abs(mine[k] - ref[k]) / abs(ref[k]) for k in ref)
    print(f"   rheoside {ours:9.2f} µs   scipy curve_fit {theirs:9.2f} µs   "
          f"ratio {theirs / ours:6.1f}x (target >= 20x)   largest parameter difference {worst:.1e}")

    print("2. Herschel–Bulkley pressure-drop curve, 200 flows, in process")
    ours = divan_median_us("line", "herschel_bulkley_curve_200_points")
    theirs = median_us(scipy_curve, runs)
    ref = scipy_curve()
    diffs = []
    for i in (0, 50, 100):
        answer = ours_line(FLOWS[i])
        if answer["regime"] == "laminar":
            diffs.append(abs(answer["pressure_drop_pa"] - ref[i]) / ref[i])
    print(f"   rheoside {ours:9.2f} µs   scipy brentq {theirs:9.2f} µs   "
          f"ratio {theirs / ours:6.1f}x (target >= 50x)   "
          f"largest pressure-drop difference {max(diffs):.1e} over {len(diffs)} laminar flows")

    print("3. the whole `rheoside fit` process against a Python + scipy process")
    sys.argv = [sys.argv[0], "--runs", str(runs)]
    sys.path.insert(0, HERE)
    import fit_vs_scipy  # noqa: E402

    fit_vs_scipy.main()


if __name__ == "__main__":
    main()
