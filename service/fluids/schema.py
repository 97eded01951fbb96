"""The schema every catalog entry obeys, built-in or added by an operator.

Numbers are SI: temperature [K], pressure [Pa], molar mass [kg/mol]. The ``vapor_pressure`` and
``liquid_density`` tables name their equation ``form`` and carry that form's coefficients, as
:mod:`service.fluids.forms` declares them.
"""

from __future__ import annotations

import re
from collections.abc import Mapping
from typing import Any, ClassVar

from marshmallow import INCLUDE, RAISE, Schema, ValidationError, fields, validate, validates, validates_schema

from service.fluids.forms import DENSITY_FORMS, VAPOR_PRESSURE_FORMS, Form

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


class _TableSchema(Schema):
    """A correlation table of one form: its coefficients, method, citation and stated range [K]."""

    class Meta:
        register = False

    declared: ClassVar[Form]

    form = fields.String(required=True)
    method = fields.String(required=True, validate=validate.Length(min=3))
    source = fields.String(required=True, validate=validate.Length(min=10))
    t_min = fields.Float(required=True, validate=_positive)
    t_max = fields.Float(required=True, validate=_positive)

    @validates_schema
    def _coefficients(self, data: dict[str, Any], **_: Any) -> None:
        missing = [c.name for c in self.declared.coefficients if c.name not in data]
        if missing:
            raise ValidationError(f"form {self.declared.key!r} needs {', '.join(missing)}", "form")
        if data["t_min"] >= data["t_max"]:
            raise ValidationError("t_min must be below t_max", "t_max")
        for check in self.declared.checks:
            check(data)


class FormTable(fields.Field):
    """A table loaded by the schema of the form it names, one of ``forms``; ``unknown`` (marshmallow's INCLUDE or
    RAISE) says what becomes of keys the form does not declare."""

    def __init__(self, forms: Mapping[str, Form], unknown: str, **kwargs: Any) -> None:
        super().__init__(**kwargs)
        self.unknown = unknown
        self.schemas = {
            key: type(
                f"{key}-table",
                (_TableSchema,),
                {"declared": form, **{c.name: c.field() for c in (*form.coefficients, *form.optional)}},
            )
            for key, form in forms.items()
        }

    def _deserialize(self, value: Any, attr: str | None, data: Any, **kwargs: Any) -> dict[str, Any]:
        if not isinstance(value, Mapping):
            raise ValidationError("must be a table")
        form = value.get("form")
        if not isinstance(form, str) or form not in self.schemas:
            raise ValidationError({"form": [f"must be one of {', '.join(self.schemas)}"]})
        return self.schemas[form](unknown=self.unknown).load(value)


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
    vapor_associates = fields.String(load_default=None, validate=validate.Length(min=10))
    vapor_pressure = FormTable(VAPOR_PRESSURE_FORMS, unknown=INCLUDE, required=True)
    liquid_density = FormTable(DENSITY_FORMS, unknown=RAISE, load_default=None)

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
