"""The schema every catalog entry obeys, built-in or added by an operator.

Numbers are SI: temperature [K], pressure [Pa], molar mass [kg/mol]. A ``vapor_pressure``
table names its equation ``form`` and carries that form's coefficients:

- ``wagner``: ``coefficients`` and ``exponents`` of ln(p/pc) = (Tc/T) sum(a_i tau**e_i),
  optionally with the ``reducing_temperature`` and ``reducing_pressure`` it was fitted with;
- ``antoine``: ``A``, ``B``, ``C`` of log_b(p/P_unit) = A - B/(t + C) with ``log_base``
  (10 or "e"), ``pressure_unit`` and ``temperature_unit`` exactly as a handbook prints them;
- ``dippr101``: ``A`` to ``E`` of ln(p/Pa) = A + B/T + C ln T + D T**E;
- ``iapws-1992``: water's own equation, no coefficients.
"""

from __future__ import annotations

import re
from typing import Any

from marshmallow import INCLUDE, Schema, ValidationError, fields, validate, validates, validates_schema

from service.physics.units import codes

FORMS = ("wagner", "antoine", "dippr101", "iapws-1992")
_CAS = re.compile(r"^(\d{2,7})-(\d{2})-(\d)$")

_positive = validate.Range(min=0.0, min_inclusive=False)


def cas_check_digit_ok(cas: str) -> bool:
    """True when ``cas`` has the form NNNNNNN-NN-N and a correct check digit.

    The check digit is the sum of the other digits, each times its position counted
    from the right, modulo 10 (CAS Registry, common practice, no source).

    >>> cas_check_digit_ok("7732-18-5"), cas_check_digit_ok("7732-18-4")
    (True, False)
    """
    match = _CAS.match(cas)
    if not match:
        return False
    digits = (match.group(1) + match.group(2))[::-1]
    return sum(int(d) * (i + 1) for i, d in enumerate(digits)) % 10 == int(match.group(3))


class VaporPressureSchema(Schema):
    """One vapor-pressure correlation: form, coefficients, stated range, citation."""

    class Meta:
        unknown = INCLUDE

    form = fields.String(required=True, validate=validate.OneOf(FORMS))
    method = fields.String(required=True, validate=validate.Length(min=3))
    source = fields.String(required=True, validate=validate.Length(min=10))
    t_min = fields.Float(required=True, validate=_positive)
    t_max = fields.Float(required=True, validate=_positive)

    @validates_schema
    def _coefficients(self, data: dict[str, Any], **_: Any) -> None:
        required = {
            "wagner": ("coefficients", "exponents"),
            "antoine": ("A", "B", "C", "log_base", "pressure_unit", "temperature_unit"),
            "dippr101": ("A", "B", "C", "D", "E"),
            "iapws-1992": (),
        }[data["form"]]
        missing = [k for k in required if k not in data]
        if missing:
            raise ValidationError(f"form {data['form']!r} needs {', '.join(missing)}", "form")
        if data["t_min"] >= data["t_max"]:
            raise ValidationError("t_min must be below t_max", "t_max")
        if data["form"] == "wagner" and len(data["coefficients"]) != len(data["exponents"]):
            raise ValidationError("coefficients and exponents differ in length", "coefficients")
        if data["form"] == "antoine":
            if data["log_base"] not in (10, "e"):
                raise ValidationError('log_base must be 10 or "e"', "log_base")
            if data["pressure_unit"] not in codes("pressure"):
                raise ValidationError(f"pressure_unit must be one of {codes('pressure')}", "pressure_unit")
            if data["temperature_unit"] not in codes("temperature"):
                raise ValidationError(f"temperature_unit must be one of {codes('temperature')}", "temperature_unit")


class LiquidDensitySchema(Schema):
    """A saturated-liquid density correlation: ``dippr105`` (A in kmol/m3, B, C in K, D) or water's own."""

    form = fields.String(required=True, validate=validate.OneOf(("dippr105", "iapws-1992")))
    method = fields.String(required=True, validate=validate.Length(min=3))
    source = fields.String(required=True, validate=validate.Length(min=10))
    t_min = fields.Float(required=True, validate=_positive)
    t_max = fields.Float(required=True, validate=_positive)
    A = fields.Float(validate=_positive)
    B = fields.Float(validate=_positive)
    C = fields.Float(validate=_positive)
    D = fields.Float()

    @validates_schema
    def _coefficients(self, data: dict[str, Any], **_: Any) -> None:
        if data["form"] == "dippr105" and not {"A", "B", "C", "D"} <= set(data):
            raise ValidationError("form 'dippr105' needs A, B, C, D", "form")
        if data["t_min"] >= data["t_max"]:
            raise ValidationError("t_min must be below t_max", "t_max")
        if data["form"] == "dippr105" and data["t_max"] > data["C"]:
            raise ValidationError("t_max is above C, where the DIPPR 105 equation ends", "t_max")


class FluidEntrySchema(Schema):
    """One fluid of the catalog."""

    class Meta:
        unknown = INCLUDE

    id = fields.String(required=True, validate=validate.Regexp(r"^[a-z0-9][a-z0-9-]*$"))
    name = fields.String(required=True, validate=validate.Length(min=1))
    formula = fields.String(required=True, validate=validate.Length(min=1))
    cas = fields.String(required=True)
    aliases = fields.List(fields.String(validate=validate.Length(min=1)), load_default=list)
    molar_mass = fields.Float(required=True, validate=_positive)
    critical_temperature = fields.Float(required=True, validate=_positive)
    critical_pressure = fields.Float(required=True, validate=_positive)
    triple_temperature = fields.Float(required=True, validate=_positive)
    triple_pressure = fields.Float(required=True, validate=_positive)
    normal_boiling_point = fields.Float(load_default=None, validate=_positive)
    constants_source = fields.String(required=True, validate=validate.Length(min=10))
    lower_limit_note = fields.String(load_default=None, validate=validate.Length(min=10))
    notes = fields.List(fields.String(validate=validate.Length(min=10)), load_default=list)
    vapor_pressure = fields.Nested(VaporPressureSchema, required=True)
    liquid_density = fields.Nested(LiquidDensitySchema, load_default=None)

    @validates("cas")
    def _cas(self, value: str, **_: Any) -> None:
        if not cas_check_digit_ok(value):
            raise ValidationError(f"{value!r} is not a CAS registry number with a valid check digit")

    @validates_schema
    def _fixed_points(self, data: dict[str, Any], **_: Any) -> None:
        if not data["triple_temperature"] < data["critical_temperature"]:
            raise ValidationError("triple_temperature must be below critical_temperature", "triple_temperature")
        if not data["triple_pressure"] < data["critical_pressure"]:
            raise ValidationError("triple_pressure must be below critical_pressure", "triple_pressure")
        if data["vapor_pressure"]["t_max"] > data["critical_temperature"]:
            raise ValidationError("vapor_pressure.t_max is above critical_temperature", "vapor_pressure")
