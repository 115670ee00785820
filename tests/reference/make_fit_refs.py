#!/usr/bin/env python3
"""Reference least-squares fits for tests/rheology.rs, made with scipy.optimize.curve_fit.

Run:  pip install scipy numpy && python3 tests/reference/make_fit_refs.py
Writes tests/reference/fit_refs.json (committed, so CI needs no Python).

Every data set is INVENTED (an invented works, "Hollin Vale", and invented products); they are
shaped like the products named but are not measurements of anything.

For each data set, each model (newtonian, power-law, bingham, herschel-bulkley, casson) is
fitted by least squares on shear stress, unweighted (sigma=None) and relative (sigma=tau),
with absolute_sigma=False, so pcov = s^2 (J^T J)^-1, s^2 = SSR/(m - p). The 95 % CI is
popt +/- t.ppf(0.975, m - p) * sqrt(diag(pcov)).

Constraint tau0 >= 0: if the free optimum has tau0 < 0 the model is refitted with tau0 = 0
held (Bingham and Casson -> tau = mu*rate, Herschel-Bulkley -> tau = K*rate^n) and tau0 is
reported at the bound with no CI; dof then counts only the free parameters.

To make sure each result is the true optimum: analytic Jacobians, ftol = xtol = gtol = 1e-15,
several starts, a cross-check with scipy.optimize.least_squares (trf) from a perturbed start,
and Gauss-Newton steps in extended precision from the result.

Also: the Arrhenius activation energy of an invented product read at four temperatures, by
scipy.stats.linregress of ln K on 1/T - 1/T_ref ("arrhenius" in the JSON).
"""
import json
import pathlib

import numpy as np
import scipy
from scipy import stats
from scipy.optimize import curve_fit, least_squares

TOL = dict(ftol=1e-15, xtol=1e-15, gtol=1e-15, maxfev=200000)

# Six-speed oilfield-type viscometer: Newtonian bob rate 1.7023 1/s per rpm and 0.511 Pa per
# dial degree (API RP 13B-1 geometry; API RP 13D glossary).
RPM = [600, 300, 200, 100, 6, 3]
TS4_DIAL = [208.5, 173.5, 155.5, 130.0, 73.0, 64.5]

DATASETS = {
    # Invented tomato-type sauce "TS-4", six-speed viscometer readings converted to rate/stress.
    "ts4-sauce": ([1.7023 * r for r in RPM], [0.511 * d for d in TS4_DIAL]),
    # Invented yield-stress paste "PX-2".
    "px2-paste": (
        [5.0, 9.0, 16.2, 29.2, 52.7, 94.9, 171.0, 308.1, 555.0, 1000.0],
        [136.74, 152.54, 164.46, 184.2, 212.87, 244.25, 283.01, 327.46, 393.85, 476.43],
    ),
    # Invented mineral slurry from tailings line "T3" (Bingham-like).
    "t3-slurry": (
        [10.0, 20.0, 50.0, 100.0, 200.0, 400.0, 700.0, 1000.0],
        [13.64, 14.63, 15.11, 17.73, 21.89, 31.86, 44.74, 59.16],
    ),
    # A second invented sample from line "T3": Herschel-Bulkley fits it with an n whose 95 % CI
    # includes 1 (used by the model-choice test).
    "t3b-slurry": (
        [10.0, 20.0, 50.0, 100.0, 200.0, 400.0, 700.0, 1000.0],
        [15.2, 15.6, 16.48, 18.7, 23.41, 31.87, 45.9, 59.43],
    ),
    # Invented shear-thinning coating "C7" with no yield stress (power-law-like).
    "c7-coating": (
        [5.0, 9.7, 18.8, 36.5, 70.7, 137.1, 265.9, 515.7, 1000.0],
        [7.78, 11.12, 15.26, 22.89, 33.26, 48.03, 66.87, 98.36, 140.14],
    ),
    # Invented pigment dispersion "P9": power-law-like; Herschel-Bulkley fits it with a small
    # tau0 whose 95 % CI includes zero (used by the model-choice test).
    "p9-dispersion": (
        [5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0],
        [5.31, 7.88, 11.95, 20.7, 30.75, 47.08, 81.59, 126.19],
    ),
    # Invented Newtonian syrup "S1".
    "s1-syrup": (
        [5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0],
        [4.216, 8.59, 16.863, 42.486, 85.752, 169.008, 424.525],
    ),
}


def newtonian(x, mu):
    return mu * x


def newtonian_jac(x, mu):
    return np.column_stack([x])


def power(x, k, n):
    return k * x**n


def power_jac(x, k, n):
    xn = x**n
    return np.column_stack([xn, k * xn * np.log(x)])


def bingham(x, t0, mp):
    return t0 + mp * x


def bingham_jac(x, t0, mp):
    return np.column_stack([np.ones_like(x), x])


def hb(x, t0, k, n):
    return t0 + k * x**n


def hb_jac(x, t0, k, n):
    xn = x**n
    return np.column_stack([np.ones_like(x), xn, k * xn * np.log(x)])


def casson(x, t0, mc):
    return (np.sqrt(t0) + np.sqrt(mc * x)) ** 2


def casson_jac(x, t0, mc):
    r = np.sqrt(t0) + np.sqrt(mc * x)
    return np.column_stack([r / np.sqrt(t0), r * np.sqrt(x) / np.sqrt(mc)])


def casson_signed(x, a, b):
    """(a + b sqrt(x))^2: Casson with a = sqrt(tau0), b = sqrt(mu_c), defined for a < 0 too."""
    return (a + b * np.sqrt(x)) ** 2


def casson_signed_jac(x, a, b):
    r = a + b * np.sqrt(x)
    return np.column_stack([2 * r, 2 * r * np.sqrt(x)])


def ssr(f, x, y, sigma, p):
    w = np.ones_like(y) if sigma is None else 1.0 / sigma
    return float(np.sum((w * (y - f(x, *p))) ** 2))


def cf(f, jac, x, y, sigma, p0):
    """curve_fit with tight tolerances, checked against least_squares from a perturbed start."""
    popt, pcov = curve_fit(
        f, x, y, p0=p0, sigma=sigma, absolute_sigma=False, jac=jac, method="lm", **TOL
    )
    w = np.ones_like(y) if sigma is None else 1.0 / sigma
    check = least_squares(
        lambda p: w * (f(x, *p) - y),
        np.asarray(popt) * 1.01,
        jac=lambda p: w[:, None] * jac(x, *p),
        method="trf",
        x_scale="jac",
        ftol=1e-15,
        xtol=1e-15,
        gtol=1e-15,
        max_nfev=100000,
    )
    s_cf, s_ls = ssr(f, x, y, sigma, popt), ssr(f, x, y, sigma, check.x)
    assert s_cf <= s_ls * (1 + 1e-12), (f.__name__, s_cf, s_ls)
    # Parameters agree to 1e-7 relative, or (for a tau0 near zero) to 1e-10 of the stress scale.
    atol = 1e-10 * np.max(np.abs(y)) / np.max(np.abs(jac(x, *popt)), axis=0)
    assert np.allclose(popt, check.x, rtol=1e-7, atol=atol), (f.__name__, popt, check.x)
    polished = polish(f, jac, x, y, w, popt)
    assert np.allclose(popt, polished, rtol=1e-7, atol=atol), (f.__name__, popt, polished)
    return popt, pcov


def polish(f, jac, x, y, w, p):
    """Gauss-Newton steps in extended precision (np.longdouble) from p: where the optimum is."""
    X, Y, W = (np.asarray(v, dtype=np.longdouble) for v in (x, y, w))
    P = np.asarray(p, dtype=np.longdouble)
    for _ in range(8):
        r = W * (Y - f(X, *P))
        J = W[:, None] * jac(X, *P)
        step = np.linalg.solve((J.T @ J).astype(float), (J.T @ r).astype(float))
        P = P + step.astype(np.longdouble)
    return P.astype(float)


def log_line(x, y):
    n, lnk = np.polyfit(np.log(x), np.log(y), 1)
    return np.exp(lnk), max(n, 0.05)


def fit_newtonian(x, y, sigma):
    w2 = np.ones_like(y) if sigma is None else 1.0 / sigma**2
    return cf(newtonian, newtonian_jac, x, y, sigma, [np.sum(w2 * x * y) / np.sum(w2 * x * x)])


def fit_power(x, y, sigma):
    return cf(power, power_jac, x, y, sigma, list(log_line(x, y)))


def fit_bingham(x, y, sigma):
    w = None if sigma is None else 1.0 / sigma
    mp, t0 = np.polyfit(x, y, 1, w=w)
    popt, pcov = cf(bingham, bingham_jac, x, y, sigma, [t0, mp])
    if popt[0] >= 0:
        return popt, pcov, False
    popt, pcov = fit_newtonian(x, y, sigma)
    return np.array([0.0, popt[0]]), pcov, True


def fit_hb(x, y, sigma):
    best = None
    for frac in (0.0, 0.5, 0.75, 0.9):
        t0 = frac * y.min()
        k, n = log_line(x, y - t0)
        popt, pcov = cf(hb, hb_jac, x, y, sigma, [t0, k, n])
        s = ssr(hb, x, y, sigma, popt)
        if best is None or s < best[2]:
            best = (popt, pcov, s)
    popt, pcov, _ = best
    if popt[0] >= 0:
        return popt, pcov, False
    popt, pcov = fit_power(x, y, sigma)
    return np.array([0.0, popt[0], popt[1]]), pcov, True


def fit_casson(x, y, sigma):
    b, a = np.polyfit(np.sqrt(x), np.sqrt(y), 1)
    (a, b), _ = cf(casson_signed, casson_signed_jac, x, y, sigma, [a, b])
    if b < 0:
        a, b = -a, -b
    if a >= 0:
        popt, pcov = cf(casson, casson_jac, x, y, sigma, [a * a, b * b])
        return popt, pcov, False
    popt, pcov = fit_newtonian(x, y, sigma)
    return np.array([0.0, popt[0]]), pcov, True


MODELS = {
    "newtonian": (["mu"], newtonian, lambda x, y, s: (*fit_newtonian(x, y, s), False)),
    "power-law": (["k", "n"], power, lambda x, y, s: (*fit_power(x, y, s), False)),
    "bingham": (["tau0", "mu_p"], bingham, fit_bingham),
    "herschel-bulkley": (["tau0", "k", "n"], hb, fit_hb),
    "casson": (["tau0", "mu_c"], casson, fit_casson),
}


def one_case(name, xs, ys, model, weighting):
    x, y = np.asarray(xs, float), np.asarray(ys, float)
    sigma = None if weighting == "unweighted" else y.copy()
    names, f, fitter = MODELS[model]
    popt, pcov, at_bound = fitter(x, y, sigma)
    free = len(names) - int(at_bound)
    dof = len(x) - free
    t = float(stats.t.ppf(0.975, dof))
    se = np.sqrt(np.diag(pcov))
    params, errors, cis = {}, {}, {}
    j = 0
    for i, p in enumerate(names):
        params[p] = float(popt[i])
        if at_bound and p == "tau0":
            continue
        errors[p] = float(se[j])
        cis[p] = [float(popt[i] - t * se[j]), float(popt[i] + t * se[j])]
        j += 1
    return {
        "dataset": name,
        "model": model,
        "weighting": weighting,
        "params": params,
        "at_bound": ["tau0"] if at_bound else [],
        "std_errors": errors,
        "ci95": cis,
        "ssr": ssr(f, x, y, sigma, popt),
        "dof": dof,
        "t975": t,
    }


# Invented K of the TS-4 sauce read at four temperatures (K in Pa*s^n, T in kelvin).
ARRHENIUS_SAMPLES = [(278.15, 14.9), (293.15, 9.6), (313.15, 5.3), (333.15, 3.4)]
ARRHENIUS_T_REF = 293.15
GAS_CONSTANT = 8.314462618  # J/(mol K), CODATA 2018


def arrhenius_case():
    """ln K = ln K_ref + (Ea/R)(1/T - 1/T_ref) by scipy.stats.linregress."""
    t = np.array([s[0] for s in ARRHENIUS_SAMPLES])
    k = np.array([s[1] for s in ARRHENIUS_SAMPLES])
    fit = stats.linregress(1.0 / t - 1.0 / ARRHENIUS_T_REF, np.log(k))
    tq = float(stats.t.ppf(0.975, len(t) - 2))
    ea = fit.slope * GAS_CONSTANT
    half = tq * fit.stderr * GAS_CONSTANT
    return {
        "samples": ARRHENIUS_SAMPLES,
        "t_ref_k": ARRHENIUS_T_REF,
        "ea_j_per_mol": float(ea),
        "ci95": [float(ea - half), float(ea + half)],
        "value_at_ref": float(np.exp(fit.intercept)),
    }


def main():
    cases = []
    for name, (xs, ys) in DATASETS.items():
        for model in MODELS:
            for weighting in ("unweighted", "relative"):
                cases.append(one_case(name, xs, ys, model, weighting))
    out = {
        "made_by": "tests/reference/make_fit_refs.py",
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "note": "all data sets are invented",
        "datasets": {k: {"shear_rate": v[0], "shear_stress": v[1]} for k, v in DATASETS.items()},
        "cases": cases,
        "arrhenius": arrhenius_case(),
    }
    path = pathlib.Path(__file__).with_name("fit_refs.json")
    path.write_text(json.dumps(out, indent=1) + "\n")
    for c in cases:
        bound = " (tau0 at bound)" if c["at_bound"] else ""
        print(f"{c['dataset']:11} {c['model']:16} {c['weighting']:10} {c['params']}{bound}")
    print("arrhenius", out["arrhenius"])


if __name__ == "__main__":
    main()
