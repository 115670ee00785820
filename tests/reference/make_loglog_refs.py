#!/usr/bin/env python3
"""Reference log-log power-law fits for `rheoside fit --weight log`, made with numpy.polyfit.

Run:  pip install numpy scipy && python3 tests/reference/make_loglog_refs.py
Writes tests/reference/loglog_refs.json (committed, so CI needs no Python).

The data sets are INVENTED (shaped like a sauce and a thin slurry read on a rotational
viscometer; not measurements of anything). Each is fitted as ln(tau) = ln(K) + n ln(rate) by
numpy.polyfit(ln rate, ln tau, 1), the straight-line regression published power-law constants
are usually taken from. The 95 % interval of n is n +/- t(0.975, m - 2) SE(n) with SE(n) from
polyfit's covariance (cov='unscaled' times s^2 = SSR/(m - 2)), t from scipy.stats.t.ppf.
R^2 is on the raw stresses: 1 - sum((tau - K rate^n)^2) / sum((tau - mean tau)^2).
"""
import json
import pathlib

import numpy as np
from scipy import stats

SETS = {
    # Invented sauce: shear rates (1/s) and stresses (Pa), decades apart.
    "sauce": (
        [0.5, 1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0],
        [9.8, 12.1, 15.3, 19.9, 25.2, 31.0, 41.8, 52.3],
    ),
    # Invented thin slurry, some scatter.
    "slurry": (
        [5.1, 10.2, 51.0, 102.0, 170.0, 340.0, 511.0, 1021.0],
        [0.62, 0.95, 2.41, 3.55, 4.90, 7.10, 9.40, 14.2],
    ),
}


def fit(rate, tau):
    x, y = np.log(rate), np.log(tau)
    (n, ln_k), cov = np.polyfit(x, y, 1, cov="unscaled")
    resid = y - (ln_k + n * x)
    m = len(x)
    s2 = float(resid @ resid) / (m - 2)
    se_n = float(np.sqrt(s2 * cov[0, 0]))
    t = float(stats.t.ppf(0.975, m - 2))
    k = float(np.exp(ln_k))
    tau = np.asarray(tau)
    pred = k * np.asarray(rate) ** n
    r2 = 1.0 - float(((tau - pred) ** 2).sum()) / float(((tau - tau.mean()) ** 2).sum())
    return {
        "shear_rate": rate,
        "shear_stress": tau.tolist(),
        "k_pa_sn": k,
        "n": float(n),
        "n_ci95": [float(n) - t * se_n, float(n) + t * se_n],
        "r_squared": r2,
    }


def main():
    out = {"numpy": np.__version__, "sets": {k: fit(*v) for k, v in SETS.items()}}
    path = pathlib.Path(__file__).with_name("loglog_refs.json")
    path.write_text(json.dumps(out, indent=2) + "\n")


if __name__ == "__main__":
    main()
