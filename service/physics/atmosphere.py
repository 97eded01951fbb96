"""U.S. Standard Atmosphere, 1976: elevation <-> pressure, temperature, density.

Source: NOAA, NASA and USAF, *U.S. Standard Atmosphere, 1976*, NOAA-S/T 76-1562,
U.S. Government Printing Office, Washington D.C., 1976: equations (18) (geopotential
height), (23) (molecular-scale temperature), (33a) and (33b) (pressure), (42)
(density), and Table 8 (molecular-weight ratio between 80 and 86 km). Below 32 km the
model is identical to ISO 2533:1975 and the ICAO standard atmosphere.

All inputs and outputs are SI: geometric elevation [m], geopotential height [m'],
pressure [Pa], temperature [K], density [kg/m3]. Functions take and return numpy arrays, or numpy
scalars for single values.

>>> float(pressure_at_elevation(0.0))
101325.0
>>> round(float(pressure_at_elevation(11_000.0)))  # 1976 tables: 2.2700E+4 Pa
22700
"""

from __future__ import annotations

import bisect
from collections.abc import Callable

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics.array_blocks import blockwise
from service.physics.units import STANDARD_GRAVITY  # g0 [m/s2] of the 1976 standard, as the CGPM's

GAS_CONSTANT = 8.31432
"""R* [J/(mol K)], the value the 1976 standard adopts."""
MOLAR_MASS_AIR = 0.0289644
"""M0, sea-level mean molar mass of air [kg/mol]."""
EARTH_RADIUS = 6_356_766.0
"""r0, the effective Earth radius of the geopotential conversion [m]."""
SEA_LEVEL_PRESSURE = 101_325.0
"""P0 [Pa]."""
MIN_ELEVATION = -5_000.0
"""Lowest geometric elevation the tables cover [m]."""
MAX_ELEVATION = 86_000.0
"""Highest geometric elevation of the seven-layer model [m]."""

_K = STANDARD_GRAVITY * MOLAR_MASS_AIR / GAS_CONSTANT  # [K/m'], the hydrostatic constant
_BASE_HEIGHT = np.array([0.0, 11e3, 20e3, 32e3, 47e3, 51e3, 71e3])  # [m'] geopotential
_LAPSE = np.array([-6.5e-3, 0.0, 1.0e-3, 2.8e-3, 0.0, -2.8e-3, -2.0e-3])  # [K/m']


def _layer_ln_pressure_drop(lapse: NDArray, base_t: NDArray, dh: NDArray) -> NDArray:
    """ln(P/Pb) across ``dh`` [m'] of a layer, eq. (33a) for lapse != 0, (33b) for 0."""
    linear = lapse != 0.0
    safe_lapse = np.where(linear, lapse, 1.0)
    return -_K * np.where(linear, np.log1p(safe_lapse * dh / base_t) / safe_lapse, dh / base_t)


def _layer_bases() -> tuple[NDArray, NDArray]:
    """Base temperatures [K] and base pressures [Pa] of the seven layers, from P0 and T0."""
    thickness = np.diff(_BASE_HEIGHT)
    base_t = 288.15 + np.concatenate(([0.0], np.cumsum(_LAPSE[:-1] * thickness)))
    drops = _layer_ln_pressure_drop(_LAPSE[:-1], base_t[:-1], thickness)
    base_p = SEA_LEVEL_PRESSURE * np.exp(np.concatenate(([0.0], np.cumsum(drops))))
    return base_t, base_p


_BASE_T, _BASE_P = _layer_bases()
_UPPER_PRESSURES = _BASE_P[:0:-1].tolist()  # [Pa], ascending
_UPPER_HEIGHTS = _BASE_HEIGHT[1:].tolist()  # [m'], ascending
# Table 8: M/M0 against geometric elevation, 80 to 86 km; 1 below 80 km.
_RATIO_Z = np.arange(80_000.0, 86_001.0, 500.0)
_RATIO_M = np.array(
    [
        1.000000,
        0.999996,
        0.999989,
        0.999971,
        0.999941,
        0.999909,
        0.999870,
        0.999829,
        0.999786,
        0.999741,
        0.999694,
        0.999641,
        0.999579,
    ]
)


def geopotential_height(elevation: ArrayLike) -> NDArray[np.float64]:
    """Geopotential height H [m'] of a geometric elevation z [m], eq. (18).

    H = r0 z / (r0 + z).

    >>> round(float(geopotential_height(86_000.0)), 1)  # 1976 standard: 84 852 m'
    84852.0
    """
    z = np.asarray(elevation, dtype=float)
    return EARTH_RADIUS * z / (EARTH_RADIUS + z)


def geometric_elevation(height: ArrayLike) -> NDArray[np.float64]:
    """Geometric elevation z [m] of a geopotential height H [m'], the inverse of eq. (18)."""
    h = np.asarray(height, dtype=float)
    return EARTH_RADIUS * h / (EARTH_RADIUS - h)


def _layer_of_height(h: NDArray | float) -> NDArray[np.intp] | int:
    """Index of the layer holding each geopotential height [m']: how many upper bases lie at or below it.

    A single value is placed with ``bisect`` on a list, which costs a tenth of ``np.searchsorted`` on a scalar.
    """
    if isinstance(h, float):
        return bisect.bisect_right(_UPPER_HEIGHTS, h)
    return np.searchsorted(_BASE_HEIGHT[1:], h, side="right")


def _layer_by_layer(
    layers: NDArray[np.intp] | int, formula: Callable[[int, NDArray], NDArray], x: NDArray | float
) -> NDArray:
    """``formula(layer, x)`` for the values of ``x`` in each layer of ``layers`` (a single value: its own layer)."""
    if isinstance(x, float):
        return formula(int(layers), x)
    out = np.empty(np.shape(x))
    for layer in np.unique(layers).tolist():
        inside = layers == layer
        out[inside] = formula(layer, x[inside])
    return out


@blockwise
def temperature_at_elevation(elevation: ArrayLike) -> NDArray[np.float64]:
    """Kinetic air temperature T [K] at geometric elevation [m], eq. (23) with Table 8.

    Above 80 km the kinetic temperature is the molecular-scale temperature times M/M0.

    >>> round(float(temperature_at_elevation(86_000.0)), 2)  # 1976 tables: 186.87 K
    186.87
    """
    z = np.asarray(elevation, dtype=float)
    return _molecular_temperature(geopotential_height(z)) * np.interp(z, _RATIO_Z, _RATIO_M)


def _molecular_temperature(h: NDArray) -> NDArray:
    """Molecular-scale temperature T_M [K] at geopotential height [m'], eq. (23): Tb + Lb (H - Hb), written
    (Tb - Lb Hb) + Lb H."""
    i = _layer_of_height(h)
    return (_BASE_T[i] - _LAPSE[i] * _BASE_HEIGHT[i]) + _LAPSE[i] * h


def _layer_pressure(layer: int, h: NDArray) -> NDArray:
    """P [Pa] at geopotential height ``h`` [m'] in ``layer``.

    Eq. (33a) where the lapse rate Lb is not zero, P = Pb (Tb / (Tb + Lb (H - Hb)))**(k/Lb), with k = g0 M0 / R*,
    written ln(P/Pb) = (-k/Lb) ln((Tb - Lb Hb)/Tb + (Lb/Tb) H); eq. (33b) where it is zero,
    ln(P/Pb) = -k (H - Hb) / Tb, written (-k/Tb) H + (k/Tb) Hb.
    """
    lapse, base_t = _LAPSE[layer], _BASE_T[layer]
    if lapse == 0.0:
        slope = -_K / base_t
        ln_ratio = slope * h + -slope * _BASE_HEIGHT[layer]
    else:
        ln_ratio = -_K / lapse * np.log((base_t - lapse * _BASE_HEIGHT[layer]) / base_t + lapse / base_t * h)
    return _BASE_P[layer] * np.exp(ln_ratio)


def _layer_height(layer: int, p: NDArray) -> NDArray:
    """Geopotential height [m'] of standard pressure ``p`` [Pa] in ``layer``: eqs. (33a) and (33b) solved for H,
    H = Hb + (Tb/Lb) (exp((-Lb/k) ln(P/Pb)) - 1), or Hb + (-Tb/k) ln(P/Pb) where Lb is zero."""
    lapse, base_t = _LAPSE[layer], _BASE_T[layer]
    ln_ratio = np.log(p * (1.0 / _BASE_P[layer]))
    if lapse == 0.0:
        return _BASE_HEIGHT[layer] + ln_ratio * (-base_t / _K)
    return _BASE_HEIGHT[layer] + np.expm1(ln_ratio * (-lapse / _K)) * (base_t / lapse)


@blockwise
def pressure_at_elevation(
    elevation: ArrayLike, sea_level_pressure: ArrayLike = SEA_LEVEL_PRESSURE
) -> NDArray[np.float64]:
    """Air pressure P [Pa] at geometric elevation [m], eqs. (33a) and (33b).

    ``sea_level_pressure`` [Pa] scales the whole standard profile by P_sl / P0, as an
    altimeter setting (QNH) does: a station's reported sea-level pressure then gives
    its local absolute pressure.

    >>> round(float(pressure_at_elevation(-5_000.0)), -1)  # 1976 tables: 1.7776E+5 Pa
    177760.0
    """
    h = geopotential_height(elevation)
    return _layer_by_layer(_layer_of_height(h), _layer_pressure, h) * (sea_level_pressure / SEA_LEVEL_PRESSURE)


@blockwise
def density_at_elevation(
    elevation: ArrayLike, sea_level_pressure: ArrayLike = SEA_LEVEL_PRESSURE
) -> NDArray[np.float64]:
    """Air density rho [kg/m3] at geometric elevation [m], eq. (42): P M0 / (R* T_M).

    >>> round(float(density_at_elevation(0.0)), 4)  # 1976 tables: 1.2250 kg/m3
    1.225
    """
    t_m = _molecular_temperature(geopotential_height(elevation))
    return pressure_at_elevation(elevation, sea_level_pressure) * MOLAR_MASS_AIR / (GAS_CONSTANT * t_m)


def _layer_of_pressure(p: NDArray | float) -> NDArray[np.intp] | int:
    """Index of the layer holding each standard pressure [Pa]: how many upper bases have at least that pressure
    (a single value placed with ``bisect``, as in :func:`_layer_of_height`)."""
    if isinstance(p, float):
        return len(_UPPER_PRESSURES) - bisect.bisect_left(_UPPER_PRESSURES, p)
    return len(_UPPER_PRESSURES) - np.searchsorted(_UPPER_PRESSURES, p, side="left")


@blockwise
def elevation_at_pressure(
    pressure: ArrayLike, sea_level_pressure: ArrayLike = SEA_LEVEL_PRESSURE
) -> NDArray[np.float64]:
    """Geometric elevation [m] at which the standard atmosphere has pressure [Pa].

    The exact inverse of :func:`pressure_at_elevation`, closed form layer by layer:
    H = Hb + Tb (exp(-L ln(P/Pb) / k) - 1) / L, or Hb - Tb ln(P/Pb) / k where L = 0.

    >>> round(float(elevation_at_pressure(22_700.0)))
    11000
    """
    p = pressure * (SEA_LEVEL_PRESSURE / sea_level_pressure)
    return geometric_elevation(_layer_by_layer(_layer_of_pressure(p), _layer_height, p))


PRESSURE_AT_MIN_ELEVATION = float(pressure_at_elevation(MIN_ELEVATION))
"""Standard pressure at -5 000 m [Pa], the highest the inverse accepts."""
PRESSURE_AT_MAX_ELEVATION = float(pressure_at_elevation(MAX_ELEVATION))
"""Standard pressure at 86 000 m [Pa], the lowest the inverse accepts."""

MODEL = "U.S. Standard Atmosphere 1976"
"""The model's published name."""
METHOD = "hydrostatic equation in layers of constant lapse rate, with geopotential height"
"""How the model computes its profile."""
SOURCE = (
    "NOAA, NASA and USAF, U.S. Standard Atmosphere, 1976, NOAA-S/T 76-1562, U.S. Government "
    "Printing Office, Washington D.C., 1976, eqs. (18), (23), (33a), (33b), (42) and Table 8"
)
"""Citation of the model."""
