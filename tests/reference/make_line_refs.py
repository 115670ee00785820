#!/usr/bin/env python3
"""Reference values for tests/line.rs, made with the `fluids` package and scipy.

Run:  pip install fluids scipy numpy && python3 tests/reference/make_line_refs.py
Writes tests/reference/line_refs.json (committed, so CI needs no Python).

- fluids.friction.Prandtl_von_Karman_Nikuradse(Re): smooth-pipe turbulent Darcy friction
  factor (the n = 1 limit of Dodge-Metzner). Fanning = Darcy / 4.
- fluids.friction.Colebrook(Re, eD): Colebrook (1939) Darcy friction factor, solved exactly
  (Lambert W) by fluids. Fanning = Darcy / 4.
- scipy.optimize.curve_fit on the invented paste "PX-2" (the same data as fit_refs.json),
  Herschel-Bulkley, unweighted, absolute_sigma=False: the full covariance pcov = s^2 (J^T J)^-1
  in the order tau0, K, n.
"""
import json
import pathlib

import fluids
import numpy as np
import scipy
from fluids.friction import Colebrook, Prandtl_von_Karman_Nikuradse
from scipy.optimize import curve_fit

SMOOTH_RE = [4.0e3, 1.0e4, 3.0e4, 1.0e5, 1.0e6]
COLEBROOK = [(4.0e3, 0.0), (1.0e4, 1e-4), (5.0e4, 1e-3), (2.0e5, 2e-5), (1.0e6, 0.01)]

PX2_RATE = [5.0, 9.0, 16.2, 29.2, 52.7, 94.9, 171.0, 308.1, 555.0, 1000.0]
PX2_STRESS = [136.74, 152.54, 164.46, 184.2, 212.87, 244.25, 283.01, 327.46, 393.85, 476.43]


def hb(x, tau0, k, n):
    return tau0 + k * np.power(x, n)


def hb_jac(x, tau0, k, n):
    xn = np.power(x, n)
    return np.stack([np.ones_like(x), xn, k * xn * np.log(x)], axis=1)


def px2_covariance():
    x = np.array(PX2_RATE)
    y = np.array(PX2_STRESS)
    p0 = [100.0, 5.0, 0.5]
    popt, pcov = curve_fit(hb, x, y, p0=p0, jac=hb_jac, ftol=1e-15, xtol=1e-15,
                           gtol=1e-15, maxfev=200000, absolute_sigma=False)
    return {"params": list(popt), "covariance": pcov.tolist()}


def main():
    out = {
        "made_by": "tests/reference/make_line_refs.py",
        "fluids": fluids.__version__,
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "smooth_darcy": [{"re": re, "darcy": Prandtl_von_Karman_Nikuradse(re)}
                         for re in SMOOTH_RE],
        "colebrook_darcy": [{"re": re, "ed": ed, "darcy": Colebrook(re, ed)}
                            for re, ed in COLEBROOK],
        "px2_hb": px2_covariance(),
    }
    path = pathlib.Path(__file__).with_name("line_refs.json")
    path.write_text(json.dumps(out, indent=1) + "\n")


if __name__ == "__main__":
    main()
