#!/usr/bin/env python3
"""Fit Wagner (1, 1.5, 2.5, 5) vapor-pressure coefficients to CoolProp saturation data.

Used only for catalog fluids for which no adequate published wide-range correlation was at hand.
The fitted form is

    ln(p/pc) = (Tc/T) * (a1*tau + a2*tau**1.5 + a3*tau**2.5 + a4*tau**5),  tau = 1 - T/Tc

with Tc and pc taken from the CoolProp reference equation of state (these are the catalog's
critical constants, so no separate reducing values are needed).

The fit is linear in the coefficients. Residuals are weighted so that they approximate errors in
boiling temperature, and a few Lawson reweighting passes push the solution towards minimax error
in temperature.

Usage (CoolProp is a test dependency of the project):

    python -m tools.fit_wagner R134a R1234yf Tetrahydrofuran
"""

from __future__ import annotations

import sys

import numpy as np
from CoolProp.CoolProp import PropsSI

EXPONENTS = (1.0, 1.5, 2.5, 5.0)


def saturation_grid(fluid: str, n: int = 600) -> tuple[np.ndarray, np.ndarray]:
    """Temperatures [K] from the triple point to just below Tc and CoolProp's saturation pressures [Pa]."""
    t_triple = PropsSI("Ttriple", fluid)
    t_crit = PropsSI("Tcrit", fluid)
    # cosine spacing: denser near the triple point and near the critical point
    x = 0.5 * (1 - np.cos(np.linspace(0.0, np.pi, n)))
    temperature = t_triple + (t_crit - t_triple) * x
    temperature[-1] = t_crit - 1e-3 * (t_crit - t_triple) / 100.0  # stay just below Tc
    pressure = np.array([PropsSI("P", "T", t, "Q", 0, fluid) for t in temperature])
    return temperature, pressure


def fit(fluid: str, n: int = 600, lawson_iterations: int = 30) -> dict[str, object]:
    """Coefficients, range and the linearised worst |dT| estimate for one CoolProp fluid."""
    t_crit = PropsSI("Tcrit", fluid)
    p_crit = PropsSI("pcrit", fluid)
    temperature, pressure = saturation_grid(fluid, n)
    tau = 1.0 - temperature / t_crit
    design = np.column_stack([tau**e for e in EXPONENTS])
    y = np.log(pressure / p_crit) * temperature / t_crit
    # dT ~ d(ln p) / (d ln p / dT);   d(ln p) = dy * Tc / T
    dlnp_dt = np.gradient(np.log(pressure), temperature)
    weight = (t_crit / temperature) / dlnp_dt
    lawson = np.ones_like(temperature)
    coefficients = np.zeros(len(EXPONENTS))
    for _ in range(lawson_iterations):
        sw = weight * np.sqrt(lawson)
        coefficients, *_ = np.linalg.lstsq(design * sw[:, None], y * sw, rcond=None)
        err = np.abs((design @ coefficients - y) * weight)
        lawson = lawson * (err + 1e-12)
        lawson /= lawson.sum()
    dt = (design @ coefficients - y) * weight
    return {
        "fluid": fluid,
        "Tc": t_crit,
        "pc": p_crit,
        "t_min": float(temperature[0]),
        "t_max": t_crit,
        "coefficients": [float(v) for v in coefficients],
        "exponents": list(EXPONENTS),
        "max_abs_dT_estimate": float(np.max(np.abs(dt))),
    }


def main(argv: list[str]) -> int:
    if not argv:
        print(__doc__)
        return 2
    for fluid in argv:
        r = fit(fluid)
        print(
            f"# {fluid}: Tc={r['Tc']} K pc={r['pc']} Pa, range {r['t_min']:.3f}-{r['t_max']:.3f} K, "
            f"max |dT| (linearised) = {r['max_abs_dT_estimate']:.4f} K"
        )
        print("coefficients = [" + ", ".join(f"{c:.8g}" for c in r["coefficients"]) + "]")
        print("exponents = [" + ", ".join(f"{e:g}" for e in r["exponents"]) + "]")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
