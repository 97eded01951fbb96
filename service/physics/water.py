"""Saturation of ordinary water, from the triple point to the critical point.

Source: IAPWS, *Revised Supplementary Release on Saturation Properties of Ordinary Water
Substance*, St. Petersburg, 1992, eqs. (1) and (2); W. Wagner and A. Pruss, J. Phys. Chem.
Ref. Data 22, 783 (1993). The inverse starts from the backward equation of IAPWS-IF97 region 4
(IAPWS, *Revised Release on the IAPWS Industrial Formulation 1997*, 2007, eq. (31)), which
agrees with eq. (1) to about 0.01 K, and polishes it with the safeguarded Newton iteration
of :mod:`service.physics.vapor_pressure`; requests are answered from an
:class:`~service.physics.inverse_table.InverseTable` of those exact inverses.

SI throughout: temperature [K], pressure [Pa].

>>> round(float(saturation_pressure(373.1243)))  # normal boiling point on ITS-90
101325
>>> round(float(saturation_temperature(101_325.0)) - 273.15, 3)  # 99.974 degC on ITS-90
99.974
"""

from __future__ import annotations

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics.inverse_table import inverse_table
from service.physics.vapor_pressure import Wagner

CRITICAL_TEMPERATURE = 647.096
"""Tc [K], IAPWS 1992."""
CRITICAL_PRESSURE = 22.064e6
"""pc [Pa], IAPWS 1992."""
TRIPLE_TEMPERATURE = 273.16
"""Triple-point temperature [K], ITS-90 defining point."""
CRITICAL_DENSITY = 322.0
"""rho_c [kg/m3], IAPWS 1992."""
_LIQUID_B = (1.99274064, 1.09965342, -0.510839303, -1.75493479, -45.5170352, -6.74694450e5)
_LIQUID_EXPONENTS = (1 / 3, 2 / 3, 5 / 3, 16 / 3, 43 / 3, 110 / 3)

_IF97_N = (
    0.11670521452767e4,
    -0.72421316703206e6,
    -0.17073846940092e2,
    0.12020824702470e5,
    -0.32325550322333e7,
    0.14915108613530e2,
    -0.48232657361591e4,
    0.40511340542057e6,
    -0.23855557567849,
    0.65017534844798e3,
)


class _WaterSaturation(Wagner):
    """Eq. (1) of the 1992 release, started from the IF97 backward equation."""

    def initial_temperature(self, ln_p: NDArray, low: float, high: float) -> NDArray:
        """IAPWS-IF97 eq. (31): T_sat(p) [K], p in MPa raised to 1/4."""
        n1, n2, n3, n4, n5, n6, n7, n8, n9, n10 = _IF97_N
        beta = np.exp(0.25 * (ln_p - np.log(1e6)))
        beta2 = beta * beta
        e = beta2 + n3 * beta + n6
        f = n1 * beta2 + n4 * beta + n7
        g = n2 * beta2 + n5 * beta + n8
        d = 2 * g / (-f - np.sqrt(np.maximum(f * f - 4 * e * g, 0.0)))
        return 0.5 * (n10 + d - np.sqrt(np.maximum(np.square(n10 + d) - 4 * (n9 + n10 * d), 0.0)))


SATURATION = _WaterSaturation(
    critical_temperature=CRITICAL_TEMPERATURE,
    critical_pressure=CRITICAL_PRESSURE,
    coefficients=(-7.85951783, 1.84408259, -11.7866497, 22.6807411, -15.9618719, 1.80122502),
    exponents=(1.0, 1.5, 3.0, 3.5, 4.0, 7.5),
)
"""The 1992 saturation-pressure equation as a :class:`Wagner` equation."""

TRIPLE_PRESSURE = float(SATURATION.pressure(TRIPLE_TEMPERATURE))
"""Saturation pressure at the triple point from eq. (1) [Pa]; the release gives 611.657 Pa."""


def saturation_pressure(temperature: ArrayLike) -> NDArray[np.float64]:
    """Vapor pressure p_sat [Pa] of water at ``temperature`` [K], 273.16 K to 647.096 K.

    >>> round(float(saturation_pressure(300.0)), 1)  # IF97 Table 35: 3536.59 Pa (IF97 is 0.004 % low)
    3536.7
    """
    return SATURATION.pressure(temperature)


def saturation_pressure_slope(temperature: ArrayLike) -> NDArray[np.float64]:
    """dp_sat/dT [Pa/K] of water at ``temperature`` [K].

    >>> round(float(saturation_pressure_slope(373.124)))  # about 3616 Pa/K at 1 atm
    3616
    """
    return SATURATION.slope(temperature)


def saturation_temperature(pressure: ArrayLike) -> NDArray[np.float64]:
    """Boiling point T_sat [K] of water at absolute ``pressure`` [Pa], 611.657 Pa to 22.064 MPa.

    >>> round(float(saturation_temperature(1e6)), 3)  # IF97 Table 36: 453.035632 K (IF97 is 0.008 K high)
    453.028
    """
    return inverse_table(SATURATION, TRIPLE_TEMPERATURE, CRITICAL_TEMPERATURE)(pressure)


def saturation_temperature_slope(pressure: ArrayLike) -> NDArray[np.float64]:
    """dT_sat/dp [K/Pa] of water at absolute ``pressure`` [Pa].

    >>> round(float(saturation_temperature_slope(101_325.0)) * 1e3, 4)  # K/kPa
    0.2765
    """
    return 1.0 / saturation_pressure_slope(saturation_temperature(pressure))


def saturated_liquid_density(temperature: ArrayLike) -> NDArray[np.float64]:
    """Density of saturated liquid water rho' [kg/m3] at ``temperature`` [K], eq. (2) of the release.

    rho'/rho_c = 1 + sum(b_i tau**e_i), tau = 1 - T/Tc, exponents 1/3, 2/3, 5/3, 16/3, 43/3, 110/3.

    >>> round(float(saturated_liquid_density(373.1243)), 2)  # the release's check value: 958.365 kg/m3
    958.37
    """
    tau = 1.0 - np.asarray(temperature, dtype=float) / CRITICAL_TEMPERATURE
    total = np.ones_like(tau)
    for b, e in zip(_LIQUID_B, _LIQUID_EXPONENTS, strict=True):
        total += b * np.power(tau, e)
    return CRITICAL_DENSITY * total
