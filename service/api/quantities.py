"""Physical quantities at the HTTP edge: parse values and units in, format them out."""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

import numpy as np
from marshmallow import ValidationError, fields
from numpy.typing import NDArray

from service.physics.units import Dimension, Unit, codes, resolve_unit

Numbers = NDArray[np.float64] | float
"""An array of numbers, or a single number (a float or a numpy scalar)."""


@dataclass(frozen=True)
class Quantity:
    """Numbers as sent, with the unit the request gave them (None: the request's default)."""

    value: Numbers
    unit: Unit | None = None


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
        array = np.asarray(value, dtype=float) if isinstance(value, list) else float(value)
    if not all_finite(array):
        raise ValidationError("numbers must be finite")
    return array


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


class UnitField(fields.String):
    """A unit code or alias of one dimension, loaded as a :class:`Unit`."""

    def __init__(self, dimension: Dimension, **kwargs: Any) -> None:
        self.dimension = dimension
        metadata = kwargs.pop("metadata", {})
        accepted = f"One of {', '.join(codes(dimension))}; common aliases (such as psia, mbar, °C, F) are accepted."
        metadata = {**metadata, "description": f"{metadata.get('description', '')} {accepted}".strip()}
        super().__init__(metadata=metadata, **kwargs)

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> Unit:
        text = super()._deserialize(value, attr, data, **kwargs)
        try:
            return resolve_unit(text, self.dimension)
        except KeyError as exc:
            raise ValidationError(exc.args[0]) from exc


class QuantityField(fields.Field):
    """A quantity in a JSON body: a number, an array of numbers, or ``{"value", "unit"}``."""

    def __init__(self, dimension: Dimension, **kwargs: Any) -> None:
        self.dimension = dimension
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
            return Quantity(finite_numbers(value["value"]), resolve_unit(unit, self.dimension))
        except KeyError as exc:
            raise ValidationError(exc.args[0]) from exc


DENSITY = Unit("kg/m3", "density", 1.0)  # type: ignore[arg-type]
"""The one unit densities are given in."""


def quantity(value_si: Numbers, unit: Unit) -> dict[str, Any]:
    """``{"value", "unit"}`` for an SI value or array, converted to ``unit``."""
    return {"value": _plain(unit.from_si(value_si)), "unit": unit.code}


def ratio(value_si: Numbers, top: Unit, bottom: Unit) -> dict[str, Any]:
    """A slope such as dT/dp as ``{"value", "unit": "degC/kPa"}``; temperatures count as differences."""
    return {"value": _plain(value_si * bottom.scale / top.scale), "unit": f"{top.code}/{bottom.code}"}


def difference(value_kelvin: Numbers, unit: Unit) -> dict[str, Any]:
    """A temperature difference [K] as ``{"value", "unit"}``: in K for K and degC, degR for degF and degR."""
    return {"value": _plain(value_kelvin / unit.scale), "unit": "K" if unit.scale == 1.0 else "degR"}


def _plain(value: Numbers) -> Numbers:
    """A float, or the array itself: orjson writes float arrays directly, with no list in between."""
    return np.ascontiguousarray(value) if isinstance(value, np.ndarray) and value.ndim else float(value)


def format_value(value_si: float, unit: Unit, digits: int = 6) -> str:
    """An SI value shown in ``unit`` for a message, e.g. ``'0.611657 kPa'``."""
    return f"{float(unit.from_si(value_si)):.{digits}g} {unit.code}"
