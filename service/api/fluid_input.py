"""What boils in a request: its ``fluid`` (a catalog name, or in a POST body a fluid the caller defines), or
water with a ``solute`` at a ``concentration``."""

from __future__ import annotations

from typing import Any

from marshmallow import Schema, ValidationError, fields, validate, validates_schema

from service.api.catalog_lookup import resolve_catalog_fluid, resolve_solute
from service.api.computing_path import Input, Inputs
from service.api.numbers import Number, printable
from service.api.problems import invalid
from service.api.quantity_fields import RATIO, UnitField, difference, quantity
from service.fluids.boiling import Boiling
from service.fluids.caller_defined import fluid_from_boiling_point, fluid_from_equation
from service.fluids.fluid import Fluid
from service.fluids.forms import VAPOR_PRESSURE_FORMS, Coefficient
from service.fluids.questions import Answer
from service.fluids.solution import Basis, solution
from service.physics.units import Unit

_NAME = fields.String(
    load_default="caller-defined fluid",
    validate=[validate.Length(min=1, max=100), printable],
    metadata={"description": "A label for the answers."},
)
_FORMS = {key: form for key, form in VAPOR_PRESSURE_FORMS.items() if form.caller_definable}
_ORDER = ("number", "choice", "list")
_COEFFICIENTS = {
    c.name: c
    for c in sorted(
        (c for form in _FORMS.values() for c in form.coefficients if c.in_request),
        key=lambda c: (_ORDER.index(c.kind), c.name),
    )
}
"""The coefficients a request may give: numbers, then choices, then lists, each by name (the document's order)."""
_CRITICAL = ("critical_temperature", "critical_pressure")


def _above_zero(value: float) -> None:
    """Refuse zero and below (a plain function, so the document states exclusiveMinimum itself)."""
    if value <= 0:
        raise ValidationError("Must be greater than 0.")


def _users(name: str) -> str:
    """The caller-definable forms whose tables give ``name``, as the document names them."""
    return ", ".join(key for key, form in _FORMS.items() if any(c.name == name for c in form.coefficients))


def _coefficient_metadata(coefficient: Coefficient) -> dict[str, Any]:
    """The document's description of a coefficient, naming the forms that use it, and its choices as typed enums."""
    metadata: dict[str, Any] = {}
    if coefficient.description:
        metadata["description"] = f"{_users(coefficient.name)}: {coefficient.description}"
    if coefficient.choices:
        # Two typed enums rather than one mixed enum, which client generators cannot type.
        metadata["oneOf"] = [
            {"type": "integer" if isinstance(c, int) else "string", "enum": [c]} for c in coefficient.choices
        ]
    return metadata


def _form_text(key: str) -> str:
    """How the document states a form: its equation and, where it needs it, the critical point."""
    needs = f", needs {' and '.join(_CRITICAL)}" if _FORMS[key].needs_critical else ""
    return f"{key}: {_FORMS[key].equation}{needs}"


class _EquationChecks(Schema):
    """What :data:`EquationFluid` checks across its fields, as the form it names declares."""

    @validates_schema
    def _form(self, data: dict[str, Any], **_: Any) -> None:
        form = _FORMS[data["equation"]]
        needed = {c.name for c in form.coefficients if c.in_request}
        given = set(data) & set(_COEFFICIENTS)
        missing, extra = needed - given, given - needed
        if missing:
            raise ValidationError(f"{form.key} needs {', '.join(sorted(missing))}", "equation")
        if extra:
            raise ValidationError(f"{form.key} does not use {', '.join(sorted(extra))}", "equation")
        for check in form.checks:
            check(data)
        critical = [k for k in _CRITICAL if k in data]
        if form.needs_critical and len(critical) < len(_CRITICAL):
            raise ValidationError(f"{form.key} needs {' and '.join(_CRITICAL)}", "equation")
        if len(critical) == 1:
            (absent,) = set(_CRITICAL) - set(critical)
            raise ValidationError(f"{' and '.join(_CRITICAL)} go together", absent)


EquationFluid = _EquationChecks.from_dict(
    {
        "name": _NAME,
        "equation": fields.String(
            required=True,
            validate=validate.OneOf(sorted(_FORMS)),
            metadata={"description": "; ".join(map(_form_text, _FORMS)) + "."},
        ),
        **{c.name: c.field(Number, metadata=_coefficient_metadata(c)) for c in _COEFFICIENTS.values()},
        "critical_temperature": Number(metadata={"description": "In `temperature_unit`."}),
        "critical_pressure": Number(metadata={"description": "In `pressure_unit`."}),
        "t_min": Number(required=True, metadata={"description": "Lower end of the stated range."}),
        "t_max": Number(required=True, metadata={"description": "Upper end of the stated range."}),
        "temperature_unit": UnitField(
            "temperature",
            metadata={
                "description": "Unit of t_min, t_max, critical_temperature and, "
                f"for {_users('temperature_unit')}, of t in the equation (default: the request's temperature_unit)."
            },
        ),
        "pressure_unit": UnitField(
            "pressure",
            metadata={
                "description": f"Unit of critical_pressure and, for {_users('pressure_unit')}, of p in the equation "
                "(default: the request's pressure_unit)."
            },
        ),
    },
    name="EquationFluid",
)
"""A vapor-pressure equation as a handbook prints it: a form of the registry that a caller may define."""


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
                None if pressure is None else float(p_unit.to_si(pressure)),
                None if value.get("enthalpy_of_vaporization") is None else value["enthalpy_of_vaporization"] * 1e3,
            )
        form = _FORMS[value["equation"]]
        table = {c.name: value[c.name] for c in form.coefficients if c.in_request} | {
            "form": form.key,
            "t_min": kelvin(value["t_min"]),
            "t_max": kelvin(value["t_max"]),
            "temperature_unit": t_unit.code,
            "pressure_unit": p_unit.code,
        }
        critical = None
        if "critical_temperature" in value:
            critical = (kelvin(value["critical_temperature"]), float(p_unit.to_si(value["critical_pressure"])))
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


SOLUTE = fields.String(
    validate=[validate.Length(min=1, max=100), printable],
    metadata={
        "description": "A solute dissolved in water (see /v1/solutes): the answer is the solution's, with "
        "`concentration`. `fluid` is then water or left out.",
    },
)
CONCENTRATION = Input(
    "concentration",
    "Concentration of `solute` in the solution: mass percent (wt%, the default), g/kg, mol/kg (molality) or "
    "degBx (sucrose only).",
)
_BASES: dict[str, Basis] = {"mol/kg": "molality", "degBx": "Brix"}
"""How each concentration unit states a concentration; the others are mass fractions."""
FLUID_OPTIONS = {"fluid": FLUID, "solute": SOLUTE, "extrapolate": EXTRAPOLATE}
"""The options of every path that answers for one thing that boils: a fluid, or water with a solute."""
FLUID_BODY_OPTIONS = {"fluid": BODY_FLUID}
"""Their POST body's own field: a fluid may be defined in the body."""


def resolve_boiling(inputs: Inputs) -> Boiling:
    """The request's fluid, or water with its ``solute`` at its ``concentration``."""
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)
    name, concentration = inputs.options.get("solute"), inputs.get("concentration")
    if name is None:
        if concentration is not None:
            raise invalid("concentration", "goes with solute: name what is dissolved (GET /v1/solutes lists them)")
        return fluid
    solute = resolve_solute(name)
    if not (isinstance(inputs.options["fluid"], str) and fluid.id == "water"):
        raise invalid("fluid", f"{solute.name} is dissolved in water: give fluid=water, or leave fluid out")
    if concentration is None:
        raise invalid("concentration", f"give the concentration of {solute.name}")
    return solution(solute, fluid, concentration, _BASES.get(inputs.units["concentration"].code, "mass fraction"))


def solute_fields(found: Answer, boiling: Boiling, inputs: Inputs) -> dict[str, Any]:
    """What an answer for a solution adds: the solute, the concentration as sent, how far it boils above pure
    water at the same pressure, and its water activity; nothing for a pure fluid."""
    if found.water_activity is None:
        return {}
    return {
        "solute": boiling.solute.id,  # type: ignore[attr-defined]
        "concentration": inputs.echo("concentration", inputs.units["concentration"]),
        "boiling_point_elevation": difference(found.boiling_point_elevation, inputs.units["temperature"]),
        "water_activity": quantity(found.water_activity, RATIO),
    }
