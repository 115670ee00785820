#!/usr/bin/env python3
"""Reference values for tests/mixing_refs.rs, made with the `fluids` package (Caleb Bell).

Run:  pip install fluids && python3 tests/reference/make_mixing_refs.py
Writes tests/reference/mixing_refs.json (committed, so CI needs no Python).

- fluids.mixing.Kp_helical_ribbon_Rieger(D, h, nb, pitch, width, T): the Rieger, Novak &
  Havelkova (1988) laminar Kp of a helical ribbon. The first case is example 9-6 of Paul,
  Atiemo-Obeng & Kresta (2004), Handbook of Industrial Mixing (Kp ~ 357); the others are
  invented geometries spread over the usual clearances, pitches and blade counts.
- fluids.core.Power_number(P, L, N, rho) = P / (rho N^3 L^5): invented cases from a small
  laboratory mixer to a large tank.
"""
import json
import pathlib

import fluids
from fluids.core import Power_number
from fluids.mixing import Kp_helical_ribbon_Rieger

RIBBONS = [
    # D, h, nb, pitch, width, T  (m)
    (1.9, 1.9, 2, 1.9, 0.19, 2.0),
    (0.5, 0.5, 1, 0.5, 0.05, 0.55),
    (1.0, 1.2, 2, 0.8, 0.1, 1.06),
    (2.2, 2.0, 2, 2.5, 0.25, 2.4),
    (0.3, 0.35, 1, 0.45, 0.04, 0.32),
]

POWERS = [
    # P (W), L = D (m), N (rev/s), rho (kg/m3)
    (180.0, 0.01, 2.5, 800.0),
    (1500.0, 0.8, 1.4, 1550.0),
    (850.0, 1.7, 0.5, 1120.0),
    (12.0, 0.1, 5.0, 1000.0),
    (3.2e4, 1.2, 2.0, 1300.0),
]


def main():
    out = {
        "generator": "tests/reference/make_mixing_refs.py",
        "fluids_version": fluids.__version__,
        "kp_helical_ribbon_rieger": [
            {"D": d, "h": h, "nb": nb, "pitch": p, "width": w, "T": t,
             "Kp": Kp_helical_ribbon_Rieger(D=d, h=h, nb=nb, pitch=p, width=w, T=t)}
            for (d, h, nb, p, w, t) in RIBBONS
        ],
        "power_number": [
            {"P": p, "L": l, "N": n, "rho": rho, "Po": Power_number(P=p, L=l, N=n, rho=rho)}
            for (p, l, n, rho) in POWERS
        ],
    }
    path = pathlib.Path(__file__).with_name("mixing_refs.json")
    path.write_text(json.dumps(out, indent=2) + "\n")
    print(f"wrote {path}")


if __name__ == "__main__":
    main()
