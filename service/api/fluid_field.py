"""The ``fluid`` of a request: a catalog name, or in a POST body a fluid the caller defines."""

from __future__ import annotations

from typing import Any

from marshmallow import Schema, ValidationError, fields, validate, validates_schema

from service.api.problems import invalid
from service.api.quantities import Number, UnitField, printable
from service.api.rules import resolve_catalog_fluid
from service.fluids.catalog import Fluid
from service.fluids.custom import fluid_from_boiling_point, fluid_from_equation
from service.physics.units import Unit

_NAME = fields.String(
    load_default="caller-defined fluid",
    validate=[validate.Length(min=1, max=100), printable],
    metadata={"description": "A label for the answers."},
)
_FORM_KEYS = {
    "antoine": {"A", "B", "C", "log_base"},
    "wagner": {"coefficients", "exponents"},
    "dippr101": {"A", "B", "C", "D", "E"},
}


def _above_zero(value: float) -> None:
    """Refuse zero and below (a plain function, so the document states exclusiveMinimum itself)."""
    if value <= 0:
        raise ValidationError("Must be greater than 0.")


class EquationFluid(Schema):
    """A vapor-pressure equation as a handbook prints it."""

    name = _NAME
    equation = fields.String(
        required=True,
        validate=validate.OneOf(sorted(_FORM_KEYS)),
        metadata={
            "description": "antoine: log_b(p) = A - B/(t + C) in `pressure_unit` and `temperature_unit`; "
            "wagner: ln(p/pc) = (Tc/T) sum(a_i tau**e_i), tau = 1 - T/Tc, needs critical_temperature and "
            "critical_pressure; dippr101: ln(p/Pa) = A + B/T + C ln T + D T**E with T in K."
        },
    )
    A = Number()
    B = Number()
    C = Number()
    D = Number()
    E = Number()
    log_base = fields.Raw(
        metadata={
            "description": 'antoine: the base of the logarithm, the number 10 or the string "e".',
            # Two typed enums rather than one mixed enum, which client generators cannot type.
            "oneOf": [{"type": "integer", "enum": [10]}, {"type": "string", "enum": ["e"]}],
        }
    )
    coefficients = fields.List(Number(), validate=validate.Length(min=1, max=8))
    exponents = fields.List(Number(validate=validate.Range(min=0.5, max=50)), validate=validate.Length(min=1, max=8))
    critical_temperature = Number(metadata={"description": "In `temperature_unit`."})
    critical_pressure = Number(metadata={"description": "In `pressure_unit`."})
    t_min = Number(required=True, metadata={"description": "Lower end of the stated range."})
    t_max = Number(required=True, metadata={"description": "Upper end of the stated range."})
    temperature_unit = UnitField(
        "temperature",
        metadata={
            "description": "Unit of t_min, t_max, critical_temperature and, for antoine, of t in the equation "
            "(default: the request's temperature_unit)."
        },
    )
    pressure_unit = UnitField(
        "pressure",
        metadata={
            "description": "Unit of critical_pressure and, for antoine, of p in the equation "
            "(default: the request's pressure_unit)."
        },
    )

    @validates_schema
    def _form(self, data: dict[str, Any], **_: Any) -> None:
        form = data["equation"]
        given = set(data) & set().union(*_FORM_KEYS.values())
        missing, extra = _FORM_KEYS[form] - given, given - _FORM_KEYS[form]
        if missing:
            raise ValidationError(f"{form} needs {', '.join(sorted(missing))}", "equation")
        if extra:
            raise ValidationError(f"{form} does not use {', '.join(sorted(extra))}", "equation")
        if form == "antoine" and data["log_base"] not in (10, "e"):
            raise ValidationError('must be 10 or "e"', "log_base")
        if form == "wagner":
            if len(data["coefficients"]) != len(data["exponents"]):
                raise ValidationError("needs as many exponents as coefficients", "exponents")
            if "critical_temperature" not in data or "critical_pressure" not in data:
                raise ValidationError("wagner needs critical_temperature and critical_pressure", "equation")


class PointFluid(Schema):
    """One known boiling point; Clausius-Clapeyron carries it to other pressures."""

    name = _NAME
    boiling_point = Number(required=True, metadata={"description": "In `temperature_unit`."})
    pressure = Number(
        validate=_above_zero,
        metadata={
            "description": "Pressure of the known boiling point, in `pressure_unit` (default 1 atm).",
            "exclusiveMinimum": 0,
        },
    )
    enthalpy_of_vaporization = Number(
        validate=[_above_zero, validate.Range(max=1000)],
        metadata={
            "description": "In kJ/mol. Without it, Trouton's rule estimates it and the answer says so.",
            "exclusiveMinimum": 0,
        },
    )
    temperature_unit = UnitField("temperature", metadata={"description": "Default: the request's."})
    pressure_unit = UnitField("pressure", metadata={"description": "Default: the request's."})


class FluidField(fields.Field):
    """A catalog name, or an :class:`EquationFluid` or :class:`PointFluid` object."""

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> str | dict[str, Any]:
        if isinstance(value, str):
            return value
        if not isinstance(value, dict):
            raise ValidationError("must be a catalog name or a fluid object")
        schema = EquationFluid if "equation" in value else PointFluid if "boiling_point" in value else None
        if schema is None:
            raise ValidationError('a fluid object has "equation" (with coefficients) or "boiling_point"')
        return {"kind": schema.__name__, **schema().load(value)}


def resolve_fluid(value: str | dict[str, Any], units: dict[str, Unit]) -> Fluid:
    """The fluid a request names or defines."""
    if isinstance(value, str):
        return resolve_catalog_fluid(value)
    t_unit = value.get("temperature_unit") or units["temperature"]
    p_unit = value.get("pressure_unit") or units["pressure"]

    def kelvin(v: float) -> float:
        return float(t_unit.to_si(v))

    try:
        if value["kind"] == "PointFluid":
            pressure = value.get("pressure")
            return fluid_from_boiling_point(
                value["name"],
                kelvin(value["boiling_point"]),
                101_325.0 if pressure is None else pressure * p_unit.scale,
                None if value.get("enthalpy_of_vaporization") is None else value["enthalpy_of_vaporization"] * 1e3,
            )
        table = {
            k: v
            for k, v in value.items()
            if k
            not in {
                "kind",
                "name",
                "equation",
                "critical_temperature",
                "critical_pressure",
                "temperature_unit",
                "pressure_unit",
            }
        }
        table |= {
            "form": value["equation"],
            "t_min": kelvin(value["t_min"]),
            "t_max": kelvin(value["t_max"]),
            "temperature_unit": t_unit.code,
            "pressure_unit": p_unit.code,
        }
        critical = None
        if "critical_temperature" in value:
            critical = (kelvin(value["critical_temperature"]), value["critical_pressure"] * p_unit.scale)
        return fluid_from_equation(value["name"], table, critical)
    except ValueError as exc:
        raise invalid("fluid", str(exc)) from None


FLUID = fields.String(
    load_default="water",
    metadata={
        "description": "Catalog id, CAS registry number or alias of the fluid (see /v1/fluids).",
        "example": "water",
    },
)
BODY_FLUID = FluidField(
    load_default="water",
    metadata={
        "description": "Catalog id, CAS registry number or alias; or a fluid defined here: an equation with its "
        "coefficients and range, or one known boiling point (Clausius-Clapeyron).",
        "oneOf": [
            {"type": "string"},
            {"$ref": "#/components/schemas/EquationFluid"},
            {"$ref": "#/components/schemas/PointFluid"},
        ],
    },
)
EXTRAPOLATE = fields.Boolean(
    load_default=False,
    metadata={
        "description": "Answer outside the equation's stated range (but between triple and critical point) "
        "with a warning, instead of refusing."
    },
)
