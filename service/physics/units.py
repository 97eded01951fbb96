"""Unit tables and conversions for pressure, temperature, length and concentration.

Every conversion is affine: ``si = value * scale + offset``. Pressure and length are
pure scales; temperature scales carry an offset. Factors are exact by definition:

- 1 atm = 101 325 Pa (CGPM 1954); 1 Torr = 1/760 atm;
- 1 psi = 0.45359237 kg * 9.80665 m/s2 / (0.0254 m)**2 = 6894.757293168 Pa;
- 1 mmHg = 13.5951 g/cm3 * 9.80665 m/s2 * 1 mm = 133.322387415 Pa (conventional);
- 1 inHg = 3386.389 Pa (conventional, 32 degF column; NIST SP 811, appendix B.8);
- 1 kgf/cm2 = 9.80665 N / 1 cm2 = 98 066.5 Pa (the technical atmosphere);
- 1 mH2O = 1000 kg/m3 * 9.80665 m/s2 * 1 m = 9806.65 Pa and 1 inH2O = 0.0254 of it, 249.08891 Pa:
  the conventional water column of density 1000 kg/m3, which water has near 4 degC (its greatest
  density, 999.97 kg/m3, is at 3.98 degC). A column of water at 60 degF, as some gas meters are read,
  is 0.1 % lighter (NIST SP 811, appendix B.8, lists 248.84 Pa per inch; recalled from memory);
- 1 ft = 0.3048 m (international foot, 1959).

How a unit is spelled (:func:`resolve_unit`): the canonical codes and aliases match exactly, and
their all-lower, all-upper and capitalised forms too (`kpa`, `PSI`, `mm hg`, `°c`), unless such a
form could also be read as another unit: `MPA` and `mpa` could be the megapascal or
the millipascal, `MBAR` the millibar or the megabar, so only `MPa` and `mbar` are read as those. A
spelling may mark its pressure as absolute (`psia`, `bara`, `kPaA`) or gauge (`psig`, `barg`,
`kPag`); where that disagrees with the input it is given for, it is refused.

>>> round(resolve_unit("psi", "pressure").to_si(14.6959487755), 3)
101325.0
>>> round(resolve_unit("degF", "temperature").from_si(373.15), 6)
212.0
"""

from __future__ import annotations

import dataclasses
from collections import defaultdict
from dataclasses import dataclass
from typing import Literal

import numpy as np
from numpy.typing import ArrayLike, NDArray

Dimension = Literal["pressure", "temperature", "length", "concentration"]
Reference = Literal["absolute", "gauge"]


class UnitError(KeyError):
    """A unit spelling that names no unit, could name two, or marks the wrong kind of pressure."""

    def __str__(self) -> str:
        return str(self.args[0])


@dataclass(frozen=True)
class Unit:
    """One unit: ``si = value * scale + offset``; ``reference`` where its spelling marks absolute or gauge."""

    code: str
    dimension: Dimension
    scale: float
    offset: float = 0.0
    name: str = dataclasses.field(default="", compare=False)
    reference: Reference | None = None

    def to_si(self, value: ArrayLike) -> NDArray[np.float64] | float:
        """``value`` in this unit, in SI [Pa, K or m]; a float stays a float."""
        return _numbers(value) * self.scale + self.offset

    def from_si(self, value: ArrayLike) -> NDArray[np.float64] | float:
        """``value`` in SI [Pa, K or m], in this unit; a float stays a float."""
        return (_numbers(value) - self.offset) / self.scale


def _numbers(value: ArrayLike) -> NDArray[np.float64] | float:
    """``value`` as float64: an array, or a single float as it is (scalar arithmetic is cheaper, same floats)."""
    return value if isinstance(value, float | np.ndarray) else np.asarray(value, dtype=float)


ATMOSPHERE = 101_325.0
"""The standard atmosphere [Pa] (CGPM 1954)."""
STANDARD_GRAVITY = 9.80665
"""The standard acceleration of gravity g [m/s2] (CGPM 1901): heads of liquid, the kgf, the water columns."""
_PRESSURE = (
    Unit("Pa", "pressure", 1.0, name="pascal"),
    Unit("hPa", "pressure", 100.0, name="hectopascal"),
    Unit("kPa", "pressure", 1e3, name="kilopascal"),
    Unit("MPa", "pressure", 1e6, name="megapascal"),
    Unit("bar", "pressure", 1e5, name="bar"),
    Unit("mbar", "pressure", 100.0, name="millibar"),
    Unit("atm", "pressure", ATMOSPHERE, name="standard atmosphere"),
    Unit("psi", "pressure", 6894.757293168, name="pound-force per square inch"),
    Unit("mmHg", "pressure", 133.322387415, name="millimetre of mercury"),
    Unit("Torr", "pressure", ATMOSPHERE / 760.0, name="torr"),
    Unit("inHg", "pressure", 3386.389, name="inch of mercury (32 degF)"),
    Unit("kgf/cm2", "pressure", STANDARD_GRAVITY * 1e4, name="kilogram-force per square centimetre"),
    Unit("mH2O", "pressure", 1000.0 * STANDARD_GRAVITY, name="metre of water (conventional, 4 degC)"),
    Unit("inH2O", "pressure", 1000.0 * STANDARD_GRAVITY * 0.0254, name="inch of water (conventional, 4 degC)"),
)
_TEMPERATURE = (
    Unit("K", "temperature", 1.0, name="kelvin"),
    Unit("degC", "temperature", 1.0, 273.15, name="degree Celsius"),
    Unit("degF", "temperature", 5.0 / 9.0, 459.67 * 5.0 / 9.0, name="degree Fahrenheit"),
    Unit("degR", "temperature", 5.0 / 9.0, name="degree Rankine"),
)
_LENGTH = (
    Unit("m", "length", 1.0, name="metre"),
    Unit("km", "length", 1e3, name="kilometre"),
    Unit("ft", "length", 0.3048, name="foot"),
)

_CONCENTRATION = (
    Unit("wt%", "concentration", 0.01, name="mass percent of solute"),
    Unit("g/kg", "concentration", 1e-3, name="grams of solute per kilogram of solution (salinity)"),
    Unit("mol/kg", "concentration", 1.0, name="moles of solute per kilogram of water (molality)"),
    Unit("degBx", "concentration", 0.01, name="degree Brix (mass percent of sucrose)"),
)
"""Concentrations of a solute: the mass fractions convert to kg/kg; a molality stays in mol/kg, since its
conversion needs the solute's molar mass (:mod:`service.fluids.solution`)."""
UNITS: dict[str, Unit] = {u.code: u for u in _PRESSURE + _TEMPERATURE + _LENGTH + _CONCENTRATION}
"""Canonical unit codes, as they appear in every response."""

DEFAULT_UNITS: dict[Dimension, str] = {"pressure": "kPa", "temperature": "degC", "length": "m", "concentration": "wt%"}

_ALIASES = {
    "pascal": "Pa",
    "pascals": "Pa",
    "hectopascal": "hPa",
    "kilopascal": "kPa",
    "megapascal": "MPa",
    "millibar": "mbar",
    "mb": "mbar",
    "lbf/in2": "psi",
    "mm Hg": "mmHg",
    "in Hg": "inHg",
    "kg/cm2": "kgf/cm2",
    "kgf/cm²": "kgf/cm2",
    "kg/cm²": "kgf/cm2",
    "mH₂O": "mH2O",
    "inH₂O": "inH2O",
    "in H2O": "inH2O",
    "inWC": "inH2O",
    "kelvin": "K",
    "C": "degC",
    "°C": "degC",
    "℃": "degC",
    "celsius": "degC",
    "deg C": "degC",
    "F": "degF",
    "°F": "degF",
    "℉": "degF",
    "fahrenheit": "degF",
    "deg F": "degF",
    "R": "degR",
    "°R": "degR",
    "rankine": "degR",
    "deg R": "degR",
    "meter": "m",
    "meters": "m",
    "metre": "m",
    "metres": "m",
    "kilometre": "km",
    "kilometer": "km",
    "feet": "ft",
    "%": "wt%",
    "wt %": "wt%",
    "mass%": "wt%",
    "% w/w": "wt%",
    "‰": "g/kg",
    "molal": "mol/kg",
    "Bx": "degBx",
    "°Bx": "degBx",
    "brix": "degBx",
    "foot": "ft",
}
_REFERENCED: dict[str, tuple[str, Reference]] = {
    "psia": ("psi", "absolute"),
    "bara": ("bar", "absolute"),
    "kPaA": ("kPa", "absolute"),
    "psig": ("psi", "gauge"),
    "barg": ("bar", "gauge"),
    "kPag": ("kPa", "gauge"),
}
"""The trade's spellings that say whether a pressure is absolute or gauge."""
_OTHER_UNITS = {
    "mPa": "the millipascal",
    "Mbar": "the megabar",
    "Mb": "the megabar",
    "M": "the nautical mile",
}
"""Units the service does not take whose spellings differ from one it takes only in letter case."""


def _spellings() -> dict[str, Unit]:
    """Every accepted spelling: the exact ones, then their lower, upper and capitalised forms, where no other
    unit folds to the same letters."""
    exact = dict(UNITS)
    exact |= {alias: UNITS[code] for alias, code in _ALIASES.items()}
    exact |= {name: dataclasses.replace(UNITS[code], reference=ref) for name, (code, ref) in _REFERENCED.items()}
    meanings: dict[str, set[str]] = defaultdict(set)
    for name, unit in exact.items():
        meanings[name.casefold()].add(unit.code)
    for name in _OTHER_UNITS:
        meanings[name.casefold()].add(name)
    out = dict(exact)
    for name, unit in exact.items():
        if len(meanings[name.casefold()]) == 1:
            for form in (name.lower(), name.upper(), name.capitalize()):
                out.setdefault(form, unit)
    return out


_SPELLINGS = _spellings()


def spellings(dimension: Dimension, reference: Reference | None = None) -> list[str]:
    """The spellings accepted for a quantity of ``dimension``: canonical codes first.

    ``reference`` is the kind of pressure the quantity is (absolute or gauge): spellings that mark the
    other kind are left out, and with no reference (a unit for every pressure of a request, or a
    difference) so are the gauge ones.
    """
    allowed = {None, reference} | ({"absolute"} if reference is None else set())
    return [name for name, unit in _SPELLINGS.items() if unit.dimension == dimension and unit.reference in allowed]


def resolve_unit(name: str, dimension: Dimension, reference: Reference | None = None) -> Unit:
    """Return the unit that ``name`` spells, for a quantity of ``dimension``.

    ``reference`` says whether the quantity is an absolute or a gauge pressure; a spelling that marks
    the other kind is refused, and so is a gauge spelling where no reference is given. Raises
    :class:`UnitError` (a ``KeyError``) with a message saying what is wrong and what to write instead.

    >>> resolve_unit("°C", "temperature").code
    'degC'
    >>> resolve_unit("PSIA", "pressure").code
    'psi'
    >>> resolve_unit("MPA", "pressure")  # doctest: +ELLIPSIS
    Traceback (most recent call last):
    ...
    service.physics.units.UnitError: 'MPA' could be MPa (megapascal) or mPa (the millipascal): write the unit ...
    """
    unit = _SPELLINGS.get(name.strip())
    if unit is None or unit.dimension != dimension:
        raise UnitError(_not_a_unit(name.strip(), dimension))
    if unit.reference == "gauge" and reference != "gauge":
        raise UnitError(f"{name.strip()} marks a gauge reading; here the pressure is absolute: write {unit.code}")
    if unit.reference == "absolute" and reference == "gauge":
        raise UnitError(f"{name.strip()} marks an absolute pressure; write a gauge reading in {unit.code}")
    return unit


def _not_a_unit(name: str, dimension: Dimension) -> str:
    """Why ``name`` is no unit of ``dimension``: the units it could be, or the codes to choose from."""
    folded = name.casefold()
    if name in _OTHER_UNITS:
        return f"{name} is {_OTHER_UNITS[name]}, which this service does not take; use one of " + ", ".join(
            codes(dimension)
        )
    ours = {f"{u.code} ({u.name})" for n, u in _SPELLINGS.items() if n.casefold() == folded}
    others = {f"{n} ({meaning})" for n, meaning in _OTHER_UNITS.items() if n.casefold() == folded}
    candidates = sorted(ours | others)
    if len(candidates) > 1:
        return f"{name!r} could be {' or '.join(candidates)}: write the unit with its letter case"
    return f"unknown {dimension} unit {name!r}; use one of {', '.join(codes(dimension))}"


def default_unit(dimension: Dimension) -> Unit:
    """The unit a request gets for ``dimension`` when it names none (kPa, degC, m)."""
    return UNITS[DEFAULT_UNITS[dimension]]


def codes(dimension: Dimension) -> list[str]:
    """Canonical codes of one dimension, in table order."""
    return [u.code for u in UNITS.values() if u.dimension == dimension]
