#!/usr/bin/env python3
"""Fit DIPPR 105 saturated-liquid density coefficients to CoolProp's reference equations of state.

Used only for catalog fluids for which no published DIPPR 105 or Rackett coefficient set was at
hand. The fitted form is the one the catalog's ``dippr105`` tables use,

    rho [kmol/m3] = A / B**(1 + (1 - T/C)**D)

fitted to CoolProp's saturated-liquid molar density ``PropsSI('Dmolar', 'T', T, 'Q', 0, fluid)``
from the triple point of the equation of state to ``TOP`` * Tc. All four coefficients are fitted;
C is kept between Tc and 1.05 Tc, so that C >= t_max as the catalog schema requires and the
equation stays defined up to the critical point (with C below Tc it would be undefined between C
and Tc, which a caller may reach by extrapolating); for the refrigerants fitted so far the optimum
lies on the bound, C = Tc, as in the published DIPPR 105 sets. The fit minimises the relative
density error, first in least squares and then towards minimax by a few Lawson reweighting passes;
the reported worst relative deviation is evaluated on a grid ten times finer than the fitting grid.

Usage (CoolProp is a test dependency of the project):

    python -m tools.fit_density R134a R22 R1234yf R125
"""

from __future__ import annotations

import sys

import numpy as np
from CoolProp.CoolProp import PropsSI
from scipy.optimize import least_squares

TOP = 0.98
"""Upper end of the fitted range, as a fraction of the critical temperature."""


def dippr105(temperature: np.ndarray, a: float, b: float, c: float, d: float) -> np.ndarray:
    """The DIPPR 105 equation [kmol/m3 when ``a`` is in kmol/m3]."""
    return a / b ** (1.0 + (1.0 - temperature / c) ** d)


def saturated_liquid(fluid: str, n: int) -> tuple[np.ndarray, np.ndarray]:
    """Temperatures [K] from the triple point to TOP*Tc and CoolProp's saturated-liquid density [kmol/m3]."""
    t_triple = PropsSI("Ttriple", fluid)
    t_top = TOP * PropsSI("Tcrit", fluid)
    temperature = np.linspace(t_triple, t_top, n)
    density = np.array([PropsSI("Dmolar", "T", t, "Q", 0, fluid) for t in temperature]) / 1e3
    return temperature, density


def fit(fluid: str, n: int = 300, lawson_iterations: int = 20) -> dict[str, float | str]:
    """DIPPR 105 coefficients, fitted range and worst relative deviation for one CoolProp fluid."""
    t_crit = PropsSI("Tcrit", fluid)
    rho_crit = PropsSI("rhomolar_critical", fluid) / 1e3
    temperature, density = saturated_liquid(fluid, n)
    t_top = float(temperature[-1])

    # Start from the Rackett-like values: B ~ 0.27, C = Tc, D = 2/7, A so that A/B is the critical density.
    start = np.array([rho_crit * 0.27, 0.27, t_crit, 2.0 / 7.0])
    bounds = ([1e-6, 1e-3, t_crit, 0.05], [np.inf, 1.0, 1.05 * t_crit, 1.0])
    weight = np.ones_like(temperature)
    coefficients = start
    for _ in range(lawson_iterations):
        sw = np.sqrt(weight)

        def residual(p: np.ndarray, sw: np.ndarray = sw) -> np.ndarray:
            return sw * (dippr105(temperature, *p) / density - 1.0)

        coefficients = least_squares(residual, coefficients, bounds=bounds, x_scale="jac", xtol=1e-14).x
        err = np.abs(dippr105(temperature, *coefficients) / density - 1.0)
        weight = weight * (err + 1e-12)
        weight /= weight.sum()

    fine_t, fine_rho = saturated_liquid(fluid, 10 * n)
    deviation = dippr105(fine_t, *coefficients) / fine_rho - 1.0
    worst = int(np.argmax(np.abs(deviation)))
    a, b, c, d = (float(v) for v in coefficients)
    return {
        "fluid": fluid,
        "Tc": t_crit,
        "t_min": float(temperature[0]),
        "t_max": t_top,
        "A": a,
        "B": b,
        "C": c,
        "D": d,
        "worst_percent": 100 * float(deviation[worst]),
        "at_temperature": float(fine_t[worst]),
        "rms_percent": 100 * float(np.sqrt(np.mean(deviation**2))),
    }


def main(argv: list[str]) -> int:
    if not argv:
        print(__doc__)
        return 2
    for fluid in argv:
        r = fit(fluid)
        print(
            f"# {fluid}: Tc={r['Tc']} K, range {r['t_min']:.3f}-{r['t_max']:.3f} K, worst deviation "
            f"{r['worst_percent']:+.3f} % at {r['at_temperature']:.2f} K, rms {r['rms_percent']:.3f} %"
        )
        print(f"A = {r['A']:.6g}  # kmol/m3\nB = {r['B']:.6g}\nC = {r['C']:.7g}  # K\nD = {r['D']:.6g}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
