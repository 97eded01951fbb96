"""Physical quantities at the HTTP edge: values with their units in, ``{"value", "unit"}`` out."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

import numpy as np
from marshmallow import ValidationError, fields

from service.api.numbers import finite_numbers
from service.fluids.cautions import Kind, Shown
from service.physics.array_blocks import Numbers
from service.physics.units import Dimension, Reference, Unit, codes, default_unit, resolve_unit, spellings


@dataclass(frozen=True)
class Quantity:
    """Numbers as sent, with the unit the request gave them (None: the request's default)."""

    value: Numbers
    unit: Unit | None = None


UNIT_SCHEMAS: dict[str, tuple[Dimension, Reference | None]] = {
    "PressureUnitSpelling": ("pressure", None),
    "GaugePressureUnitSpelling": ("pressure", "gauge"),
    "TemperatureUnitSpelling": ("temperature", None),
    "LengthUnitSpelling": ("length", None),
    "ConcentrationUnitSpelling": ("concentration", None),
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
RATIO = Unit("1", "ratio", 1.0)  # type: ignore[arg-type]
"""The unit of a ratio such as a water activity: none."""


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


def format_value(value_si: float, unit: Unit, digits: int = 6) -> str:
    """An SI value shown in ``unit`` for a message, e.g. ``'0.611657 kPa'``."""
    return f"{float(unit.from_si(value_si)):.{digits}g} {unit.code}"


def unit_of(kind: Kind, units: Mapping[str, Unit]) -> Unit:
    """The request's unit for numbers of ``kind`` (a temperature difference: the temperature unit's scale)."""
    dimension = "temperature" if kind == "temperature difference" else kind
    return units.get(dimension) or default_unit(dimension)


def number_text(number: Shown, units: Mapping[str, Unit]) -> str:
    """A number of a message in the request's unit: ``0.611657 kPa``; a temperature difference in K or degR."""
    unit = unit_of(number.kind, units)
    if number.kind == "temperature difference":
        shown = difference(number.value, unit)
        return f"{shown['value']:.{number.digits}g} {shown['unit']}"
    return format_value(number.value, unit, number.digits)
