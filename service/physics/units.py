"""Unit tables and conversions for pressure, temperature and length.

Every conversion is affine: ``si = value * scale + offset``. Pressure and length are
pure scales; temperature scales carry an offset. Factors are exact by definition:

- 1 atm = 101 325 Pa (CGPM 1954); 1 Torr = 1/760 atm;
- 1 psi = 0.45359237 kg * 9.80665 m/s2 / (0.0254 m)**2 = 6894.757293168 Pa;
- 1 mmHg = 13.5951 g/cm3 * 9.80665 m/s2 * 1 mm = 133.322387415 Pa (conventional);
- 1 inHg = 3386.389 Pa (conventional, 32 degF column; NIST SP 811, appendix B.8);
- 1 ft = 0.3048 m (international foot, 1959).

>>> round(resolve_unit("psi", "pressure").to_si(14.6959487755), 3)
101325.0
>>> round(resolve_unit("degF", "temperature").from_si(373.15), 6)
212.0
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

import numpy as np
from numpy.typing import ArrayLike, NDArray

Dimension = Literal["pressure", "temperature", "length"]


@dataclass(frozen=True)
class Unit:
    """One unit: ``si = value * scale + offset``."""

    code: str
    dimension: Dimension
    scale: float
    offset: float = 0.0

    def to_si(self, value: ArrayLike) -> NDArray[np.float64] | float:
        """``value`` in this unit, in SI [Pa, K or m]; a float stays a float."""
        return _numbers(value) * self.scale + self.offset

    def from_si(self, value: ArrayLike) -> NDArray[np.float64] | float:
        """``value`` in SI [Pa, K or m], in this unit; a float stays a float."""
        return (_numbers(value) - self.offset) / self.scale


def _numbers(value: ArrayLike) -> NDArray[np.float64] | float:
    """``value`` as float64: an array, or a single float as it is (scalar arithmetic is cheaper, same floats)."""
    return value if isinstance(value, float | np.ndarray) else np.asarray(value, dtype=float)


_ATM = 101_325.0
_PRESSURE = (
    Unit("Pa", "pressure", 1.0),
    Unit("hPa", "pressure", 100.0),
    Unit("kPa", "pressure", 1e3),
    Unit("MPa", "pressure", 1e6),
    Unit("bar", "pressure", 1e5),
    Unit("mbar", "pressure", 100.0),
    Unit("atm", "pressure", _ATM),
    Unit("psi", "pressure", 6894.757293168),
    Unit("mmHg", "pressure", 133.322387415),
    Unit("Torr", "pressure", _ATM / 760.0),
    Unit("inHg", "pressure", 3386.389),
)
_TEMPERATURE = (
    Unit("K", "temperature", 1.0),
    Unit("degC", "temperature", 1.0, 273.15),
    Unit("degF", "temperature", 5.0 / 9.0, 459.67 * 5.0 / 9.0),
    Unit("degR", "temperature", 5.0 / 9.0),
)
_LENGTH = (
    Unit("m", "length", 1.0),
    Unit("km", "length", 1e3),
    Unit("ft", "length", 0.3048),
)

UNITS: dict[str, Unit] = {u.code: u for u in _PRESSURE + _TEMPERATURE + _LENGTH}
"""Canonical unit codes, as they appear in every response."""

DEFAULT_UNITS: dict[Dimension, str] = {"pressure": "kPa", "temperature": "degC", "length": "m"}

_ALIASES = {
    "pascal": "Pa",
    "pascals": "Pa",
    "hectopascal": "hPa",
    "kilopascal": "kPa",
    "megapascal": "MPa",
    "bara": "bar",
    "millibar": "mbar",
    "mb": "mbar",
    "psia": "psi",
    "lbf/in2": "psi",
    "torr": "Torr",
    "mm hg": "mmHg",
    "in hg": "inHg",
    "kelvin": "K",
    "c": "degC",
    "°c": "degC",
    "celsius": "degC",
    "deg c": "degC",
    "f": "degF",
    "°f": "degF",
    "fahrenheit": "degF",
    "deg f": "degF",
    "r": "degR",
    "°r": "degR",
    "rankine": "degR",
    "deg r": "degR",
    "meter": "m",
    "meters": "m",
    "metre": "m",
    "metres": "m",
    "kilometre": "km",
    "kilometer": "km",
    "feet": "ft",
    "foot": "ft",
}
_LOOKUP = {code.lower(): code for code in UNITS} | _ALIASES


def resolve_unit(name: str, dimension: Dimension) -> Unit:
    """Return the unit that ``name`` (a code or a common alias, any case) denotes.

    Raises ``KeyError`` naming the accepted codes when ``name`` is not a unit of
    ``dimension``.

    >>> resolve_unit("°C", "temperature").code
    'degC'
    >>> resolve_unit("PSIA", "pressure").code
    'psi'
    """
    code = _LOOKUP.get(name.strip().lower())
    unit = UNITS.get(code) if code else None
    if unit is None or unit.dimension != dimension:
        raise KeyError(f"unknown {dimension} unit {name!r}; use one of {', '.join(codes(dimension))}")
    return unit


def default_unit(dimension: Dimension) -> Unit:
    """The unit a request gets for ``dimension`` when it names none (kPa, degC, m)."""
    return UNITS[DEFAULT_UNITS[dimension]]


def codes(dimension: Dimension) -> list[str]:
    """Canonical codes of one dimension, in table order."""
    return [u.code for u in UNITS.values() if u.dimension == dimension]
