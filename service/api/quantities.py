"""Physical quantities at the HTTP edge: parse values and units in, format them out."""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from typing import Any

import numpy as np
from marshmallow import ValidationError, fields
from numpy.typing import NDArray

from service.physics.units import Dimension, Reference, Unit, codes, resolve_unit, spellings

Numbers = NDArray[np.float64] | float
"""An array of numbers, or a single number (a float or a numpy scalar)."""


@dataclass(frozen=True)
class Quantity:
    """Numbers as sent, with the unit the request gave them (None: the request's default)."""

    value: Numbers
    unit: Unit | None = None


_JSON_NUMBER = re.compile(r"-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?")
"""A number as JSON writes it (RFC 8259, section 6), in ASCII digits: the one syntax every input takes."""
OUT_OF_RANGE = "out of range: beyond double precision (magnitude above about 1.8e308)"
NOT_A_NUMBER = "must be a number as JSON writes it: ASCII digits, an optional minus sign, fraction and exponent"


def parse_number(text: str) -> float:
    """A number written as text (a query string, a CSV cell), in JSON's syntax; ValidationError otherwise.

    >>> parse_number("-1.5e3"), parse_number("0")
    (-1500.0, 0.0)
    """
    if not _JSON_NUMBER.fullmatch(text):
        raise ValidationError(NOT_A_NUMBER)
    value = float(text)
    if not math.isfinite(value):
        raise ValidationError(OUT_OF_RANGE)
    return value


def finite_numbers(value: Any) -> Numbers:
    """A number as a float, or a flat list (or float array, from CSV) of numbers as a float array.

    Anything else, or a number that is not finite, raises ValidationError.
    """
    if isinstance(value, np.ndarray):
        array = value
    elif isinstance(value, bool) or not isinstance(value, int | float | list):
        raise ValidationError("must be a number or an array of numbers")
    elif isinstance(value, list) and not set(map(type, value)) <= {int, float}:
        raise ValidationError("an array must hold numbers only")
    else:
        try:
            array = np.asarray(value, dtype=float) if isinstance(value, list) else float(value)
        except OverflowError:  # a whole number too large for a double
            raise ValidationError(OUT_OF_RANGE) from None
    if not all_finite(array):
        raise ValidationError(OUT_OF_RANGE)
    return array


class Number(fields.Float):
    """A finite number: a JSON number, or text in JSON's number syntax (a query string)."""

    def __init__(self, **kwargs: Any) -> None:
        super().__init__(allow_nan=False, **kwargs)

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> float:
        if isinstance(value, str):
            return super()._deserialize(parse_number(value), attr, data, **kwargs)
        if isinstance(value, bool) or not isinstance(value, int | float):
            raise ValidationError("must be a number")
        return super()._deserialize(finite_numbers(value), attr, data, **kwargs)


def printable(text: str) -> None:
    """Refuse control characters (line ends, tabs): labels are echoed into text and CSV answers line by line."""
    if any(not c.isprintable() for c in text):
        raise ValidationError("must not hold control characters such as line ends")


class WholeNumber(fields.Integer):
    """A whole number: a JSON integer, or ASCII digits in a query string."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> int:
        text_ok = not isinstance(value, str) or _WHOLE.fullmatch(value)
        if isinstance(value, bool) or not isinstance(value, int | str) or not text_ok:
            raise ValidationError("must be a whole number in ASCII digits")
        return super()._deserialize(value, attr, data, **kwargs)


_WHOLE = re.compile(r"-?[0-9]{1,9}")


# A single value is a float (a numpy scalar, mostly); these answer it without a numpy reduction,
# which costs microseconds on a scalar.


def all_finite(value: Numbers) -> bool:
    """Whether a number, or every number of an array, is finite."""
    return math.isfinite(value) if isinstance(value, float) else bool(np.isfinite(value).all())


def any_true(mask: NDArray[np.bool_] | bool) -> bool:
    """Whether any element of a boolean array, or a single boolean, is true."""
    return bool(mask.any()) if isinstance(mask, np.ndarray) else bool(mask)


def largest(values: Numbers, empty: float) -> float:
    """The largest of the numbers, or ``empty`` when an array has none."""
    return float(values.max(initial=empty)) if isinstance(values, np.ndarray) else float(values)


UNIT_SCHEMAS: dict[str, tuple[Dimension, Reference | None]] = {
    "PressureUnitSpelling": ("pressure", None),
    "GaugePressureUnitSpelling": ("pressure", "gauge"),
    "TemperatureUnitSpelling": ("temperature", None),
    "LengthUnitSpelling": ("length", None),
}
"""The named lists of unit spellings in the OpenAPI document (an absolute pressure takes the same as a
request's pressure_unit)."""


def unit_schema(dimension: Dimension, reference: Reference | None = None) -> dict[str, Any]:
    """A reference to the document's list of the unit spellings a quantity of ``dimension`` (and kind of
    pressure) takes."""
    listed = (dimension, "gauge" if reference == "gauge" else None)  # an absolute pressure takes pressure_unit's list
    name = next(n for n, kind in UNIT_SCHEMAS.items() if kind == listed)
    return {"$ref": f"#/components/schemas/{name}"}


def unit_spellings_schema(name: str) -> dict[str, Any]:
    """The JSON Schema behind :func:`unit_schema`'s reference ``name``."""
    return {"type": "string", "enum": spellings(*UNIT_SCHEMAS[name])}


class UnitField(fields.String):
    """A unit code or alias of one dimension, loaded as a :class:`Unit`.

    With a ``reference``, the spelling may mark that kind of pressure (``psia`` for absolute);
    without one it sets the unit of every pressure of a request, and a gauge spelling is refused.
    """

    def __init__(self, dimension: Dimension, reference: Reference | None = None, **kwargs: Any) -> None:
        self.dimension, self.reference = dimension, reference
        metadata = kwargs.pop("metadata", {})
        accepted = f"One of {', '.join(codes(dimension))} or a listed alias; letter case counts where it has meaning."
        metadata = {**metadata, "description": f"{metadata.get('description', '')} {accepted}".strip()}
        super().__init__(metadata=metadata, **kwargs)

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> Unit:
        text = super()._deserialize(value, attr, data, **kwargs)
        try:
            return resolve_unit(text, self.dimension, self.reference)
        except KeyError as exc:
            raise ValidationError(str(exc)) from exc


class QuantityField(fields.Field):
    """A quantity in a JSON body: a number, an array of numbers, or ``{"value", "unit"}``.

    ``reference`` says whether a pressure is absolute or a gauge reading: a unit spelling that marks
    the other kind (``psig`` on an absolute pressure) is refused.
    """

    def __init__(self, dimension: Dimension, reference: Reference | None = None, **kwargs: Any) -> None:
        self.dimension, self.reference = dimension, reference
        super().__init__(**kwargs)

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> Quantity:
        if not isinstance(value, dict):
            return Quantity(finite_numbers(value))
        if "value" not in value or set(value) - {"value", "unit"}:
            raise ValidationError('a quantity object has "value" and an optional "unit"')
        unit = value.get("unit")
        if unit is None:  # a CSV column without a unit in its header
            return Quantity(finite_numbers(value["value"]))
        if not isinstance(unit, str):
            raise ValidationError("unit must be a string")
        try:
            return Quantity(finite_numbers(value["value"]), resolve_unit(unit, self.dimension, self.reference))
        except KeyError as exc:
            raise ValidationError(str(exc)) from exc


DENSITY = Unit("kg/m3", "density", 1.0)  # type: ignore[arg-type]
"""The one unit densities are given in."""


def quantity(value_si: Numbers, unit: Unit) -> dict[str, Any]:
    """``{"value", "unit"}`` for an SI value or array, converted to ``unit``."""
    return {"value": _plain(unit.from_si(value_si)), "unit": unit.code}


def ratio(value_si: Numbers, top: Unit, bottom: Unit) -> dict[str, Any]:
    """A slope such as dT/dp as ``{"value", "unit": "degC/kPa"}``; temperatures count as differences.

    A code with a slash of its own is bracketed: ``degC/(kgf/cm2)``.
    """
    top_code, bottom_code = (f"({u.code})" if "/" in u.code else u.code for u in (top, bottom))
    return {"value": _plain(value_si * bottom.scale / top.scale), "unit": f"{top_code}/{bottom_code}"}


def difference(value_kelvin: Numbers, unit: Unit) -> dict[str, Any]:
    """A temperature difference [K] as ``{"value", "unit"}``: in K for K and degC, degR for degF and degR."""
    return {"value": _plain(value_kelvin / unit.scale), "unit": "K" if unit.scale == 1.0 else "degR"}


def _plain(value: Numbers) -> Numbers:
    """A float, or the array itself: orjson writes float arrays directly, with no list in between."""
    return np.ascontiguousarray(value) if isinstance(value, np.ndarray) and value.ndim else float(value)


_EXACT_POWERS = 22
"""10**k is exact in double precision up to k = 22: the fast rounding below divides by such powers only."""
_FAST_DIGITS = 14
"""Up to this many digits x * 10**k stays well inside the 53-bit mantissa, so its rounding error is tiny."""


def significant(value: Numbers, digits: int) -> Numbers:
    """``value`` rounded to ``digits`` significant digits: the double nearest the rounded decimal, so that
    JSON and CSV show it in its short form (``95.2498``). A number whose rounding would overflow stays as it is.

    Vectorised: x is scaled by an exact power of ten, rounded to a whole number and scaled back. The
    scaling itself rounds, so where the scaled number lies within a few units in its last place of a half
    (a tie the scaling may have moved), and for more than 14 digits or powers beyond 10**22, the number is
    rounded through its decimal text instead, which is exact.

    >>> significant(95.24976013, 6), significant(-0.000123456, 2), significant(123456.0, 2)
    (95.2498, -0.00012, 120000.0)
    >>> significant(876.5370964165805, 15), significant(0.125, 2)
    (876.537096416581, 0.12)
    """
    array = np.asarray(value, dtype=float)
    with np.errstate(divide="ignore", over="ignore", invalid="ignore"):
        magnitude = np.floor(np.log10(np.abs(array)))
        exponent = np.where(np.isfinite(magnitude), digits - 1 - magnitude, 0).astype(np.int64)
        scale = np.power(10.0, np.minimum(np.abs(exponent), _EXACT_POWERS))
        scaled = np.where(exponent >= 0, array * scale, array / scale)
        whole = np.round(scaled)
        out = np.where(exponent >= 0, whole / scale, whole * scale)
        near_tie = np.abs(np.abs(scaled - np.trunc(scaled)) - 0.5) <= 4 * np.spacing(np.abs(scaled))
    doubtful = near_tie | (np.abs(exponent) > _EXACT_POWERS) | (digits > _FAST_DIGITS)
    if doubtful.any():
        out = np.array(out, dtype=float, copy=True, ndmin=1)
        flat = np.ravel(doubtful)
        out.reshape(-1)[flat] = [float(f"{v:.{digits}g}") for v in np.ravel(array)[flat].tolist()]
        out = out.reshape(array.shape)
    out = np.where(np.isfinite(out), out, array)
    return out if out.ndim else float(out)


def format_value(value_si: float, unit: Unit, digits: int = 6) -> str:
    """An SI value shown in ``unit`` for a message, e.g. ``'0.611657 kPa'``."""
    return f"{float(unit.from_si(value_si)):.{digits}g} {unit.code}"
