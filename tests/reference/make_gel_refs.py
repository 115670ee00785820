#!/usr/bin/env python3
"""Reference gel build-up fits for tests/restart.rs, made with scipy.optimize.curve_fit.

Run:  pip install scipy numpy && python3 tests/reference/make_gel_refs.py
Writes tests/reference/gel_refs.json (committed, so CI needs no Python).

Model: tau(t) = tau_inf - (tau_inf - tau_i) * exp(-t / t_r), fitted unweighted by least
squares on the stress, absolute_sigma=False, so pcov = s^2 (J^T J)^-1 with s^2 = SSR/(m - 3);
the 95 % CI is popt +/- t.ppf(0.975, m - 3) * sqrt(diag(pcov)).

The readings are INVENTED (rest time s, gel stress Pa), shaped like a paste that gels at rest
on the invented demo site; they are not measurements of anything.
"""
import json
import pathlib

import numpy as np
from scipy import optimize, stats

SETS = {
    "paste-six": {
        "t": [10.0, 600.0, 1800.0, 3600.0, 7200.0, 14400.0],
        "tau": [124.0, 161.0, 243.0, 305.0, 395.0, 487.0],
    },
    "sauce-five": {
        "t": [10.0, 300.0, 600.0, 1800.0, 3600.0],
        "tau": [4.1, 7.9, 10.2, 14.8, 16.1],
    },
}


def model(t, ti, tinf, tr):
    return tinf - (tinf - ti) * np.exp(-t / tr)


def jac(t, ti, tinf, tr):
    e = np.exp(-t / tr)
    return np.column_stack([e, 1.0 - e, -(tinf - ti) * e * t / tr**2])


def fit(t, tau):
    t, tau = np.asarray(t), np.asarray(tau)
    best = None
    for tr0 in np.geomspace(t[t > 0].min() / 10, 100 * t.max(), 40):
        p0 = [tau.min(), tau.max(), tr0]
        try:
            popt, pcov = optimize.curve_fit(
                model, t, tau, p0=p0, jac=jac, ftol=1e-15, xtol=1e-15, gtol=1e-15, maxfev=20000
            )
        except RuntimeError:
            continue
        ssr = float(np.sum((tau - model(t, *popt)) ** 2))
        if best is None or ssr < best[2]:
            best = (popt, pcov, ssr)
    popt, pcov, ssr = best
    dof = len(t) - 3
    q = stats.t.ppf(0.975, dof)
    se = np.sqrt(np.diag(pcov))
    return {
        "params": popt.tolist(),
        "ci95": [[float(p - q * s), float(p + q * s)] for p, s in zip(popt, se)],
        "ssr": ssr,
        "dof": dof,
    }


def main():
    out = {}
    for name, d in SETS.items():
        out[name] = {"t": d["t"], "tau": d["tau"], **fit(d["t"], d["tau"])}
    path = pathlib.Path(__file__).with_name("gel_refs.json")
    path.write_text(json.dumps(out, indent=2) + "\n")


if __name__ == "__main__":
    main()
