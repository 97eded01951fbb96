"""Response schemas: the shape of every answer, as the OpenAPI document publishes it.

Views build their answers as plain dicts (no per-request serialization pass); the
contract tests validate every answer against the document these schemas generate.
"""

from __future__ import annotations

from marshmallow import Schema, fields

from service.api.problems import problem_type
from service.physics.units import codes

_NUMBERS = {"oneOf": [{"type": "number"}, {"type": "array", "items": {"type": "number"}}]}


def _quantity_schema(name: str, unit: dict[str, object]) -> type[Schema]:
    return Schema.from_dict(
        {
            "value": fields.Raw(
                required=True, metadata={**_NUMBERS, "description": "A number, or an array for array requests."}
            ),
            "unit": fields.String(required=True, metadata=unit),
        },
        name=name,
    )


Pressure = _quantity_schema("Pressure", {"enum": codes("pressure")})
Temperature = _quantity_schema("Temperature", {"enum": codes("temperature")})
Length = _quantity_schema("Length", {"enum": codes("length")})
Density = _quantity_schema("Density", {"enum": ["kg/m3"]})
TemperatureDifference = _quantity_schema(
    "TemperatureDifference",
    {"enum": ["K", "degR"], "description": "K for kelvin and Celsius requests, degR for Fahrenheit and Rankine."},
)
_UNIT_CODE = r"([A-Za-z][A-Za-z0-9]*|\([A-Za-z][A-Za-z0-9]*/[A-Za-z][A-Za-z0-9]*\))"
Slope = _quantity_schema(
    "Slope",
    {
        "pattern": f"^{_UNIT_CODE}/{_UNIT_CODE}$",
        "description": "A ratio of units, e.g. `degC/kPa`, `kPa/degC` or `degC/(kgf/cm2)`; "
        "temperatures in a slope count as differences (1 degC = 1 K, 1 degF = 1 degR).",
    },
)


_FLUID = "Catalog id of the fluid, or the name of a fluid the request defined."


class Provenance(Schema):
    """What every computed answer says of how it was computed."""

    tag = fields.Raw(
        metadata={
            "description": "The request's `tag`, echoed: one label, or one per point in an array answer.",
            "oneOf": [{"type": "string"}, {"type": "array", "items": {"type": "string"}}],
        }
    )
    method = fields.String(required=True, metadata={"description": "The published name of the equation(s) used."})
    source = fields.String(required=True, metadata={"description": "Citation of the equation(s)."})
    warnings = fields.List(
        fields.String(),
        required=True,
        metadata={
            "description": "Cautions about this answer: standard atmosphere in place of a barometer, "
            "extrapolation, nearness to the critical point. In an array answer each begins with the points it "
            "concerns: `all points: ...`, or `points 0, 3-5: ...` (indexes from 0)."
        },
    )


Concentration = _quantity_schema("Concentration", {"enum": codes("concentration")})
WaterActivity = _quantity_schema("WaterActivity", {"enum": ["1"], "description": "A ratio, without unit."})
Fraction = _quantity_schema(
    "Fraction", {"enum": ["1", "mole fraction", "mass fraction"], "description": "A fraction or ratio, without unit."}
)


class Dissolved(Schema):
    """What an answer for water with a solute adds."""

    solute = fields.String(metadata={"description": "Id of the solute (see /v1/solutes), for a solution."})
    concentration = fields.Nested(Concentration, metadata={"description": "The concentration sent."})
    boiling_point_elevation = fields.Nested(
        TemperatureDifference,
        metadata={"description": "How far the solution boils above pure water at the same pressure."},
    )
    water_activity = fields.Nested(
        WaterActivity,
        metadata={"description": "The solution's vapor pressure over pure water's at the same temperature."},
    )


class FluidAnswer(Provenance, Dissolved):
    """An answer about one fluid, or about water with a solute."""

    fluid = fields.String(required=True, metadata={"description": _FLUID})


_GAUGE = {"description": "The gauge reading sent, beside the absolute `pressure` it gives."}


class BoilingPointAnswer(FluidAnswer):
    gauge_pressure = fields.Nested(Pressure, metadata=_GAUGE)
    pressure = fields.Nested(Pressure, required=True, metadata={"description": "The absolute pressure used."})
    boiling_point = fields.Nested(Temperature, required=True, metadata={"description": "Saturation temperature."})
    sensitivity = fields.Nested(
        Slope, required=True, metadata={"description": "dT/dp: how far the boiling point moves per unit of pressure."}
    )
    surface_pressure = fields.Nested(
        Pressure,
        metadata={
            "description": "With `depth`: the pressure on the surface; `pressure` is then the pressure at the sensor."
        },
    )
    boiling_point_uncertainty = fields.Nested(
        TemperatureDifference,
        metadata={
            "description": "With `pressure_uncertainty`: |dT/dp| times it, the standard uncertainty of the boiling "
            "point from the pressure reading alone."
        },
    )


class SaturationMarginAnswer(FluidAnswer):
    gauge_pressure = fields.Nested(Pressure, metadata=_GAUGE)
    pressure = fields.Nested(
        Pressure,
        required=True,
        metadata={"description": "The absolute pressure used: at the sensor, with `depth`."},
    )
    surface_pressure = fields.Nested(
        Pressure, metadata={"description": "With `depth`: the pressure on the liquid surface."}
    )
    temperature = fields.Nested(Temperature, required=True, metadata={"description": "The measured temperature."})
    saturation_temperature = fields.Nested(Temperature, required=True)
    saturation_temperature_uncertainty = fields.Nested(
        TemperatureDifference,
        metadata={
            "description": "With `pressure_uncertainty`: |dT/dp| times it. The `saturated` band is `tolerance` plus "
            "twice this."
        },
    )
    margin = fields.Nested(
        TemperatureDifference,
        required=True,
        metadata={"description": "Saturation temperature minus measured temperature; positive means below boiling."},
    )
    state = fields.Raw(
        required=True,
        metadata={
            "description": "subcooled, saturated (within tolerance) or superheated; an array for array requests.",
            "oneOf": [
                {"type": "string", "enum": ["subcooled", "saturated", "superheated"]},
                {"type": "array", "items": {"type": "string", "enum": ["subcooled", "saturated", "superheated"]}},
            ],
        },
    )
    tolerance = fields.Nested(TemperatureDifference, required=True)


class NpshAnswer(FluidAnswer):
    gauge_pressure = fields.Nested(Pressure, metadata=_GAUGE)
    pressure = fields.Nested(
        Pressure, required=True, metadata={"description": "Absolute pressure on the liquid surface."}
    )
    temperature = fields.Nested(Temperature, required=True)
    vapor_pressure = fields.Nested(Pressure, required=True)
    liquid_density = fields.Nested(
        Density, required=True, metadata={"description": "Saturated-liquid density at the liquid temperature."}
    )
    static_head = fields.Nested(Length, required=True)
    friction_loss = fields.Nested(Length, required=True)
    npsh_available = fields.Nested(
        Length, required=True, metadata={"description": "Net positive suction head available, as a head of the liquid."}
    )


class VaporPressureAnswer(FluidAnswer):
    temperature = fields.Nested(Temperature, required=True)
    vapor_pressure = fields.Nested(Pressure, required=True, metadata={"description": "Saturation pressure."})
    sensitivity = fields.Nested(Slope, required=True, metadata={"description": "dp/dT along saturation."})


class ElevationAnswer(Provenance, Dissolved):
    elevation = fields.Nested(Length, required=True, metadata={"description": "Geometric elevation."})
    pressure = fields.Nested(Pressure, required=True, metadata={"description": "Absolute air pressure there."})
    fluid = fields.String(metadata={"description": f"{_FLUID} Present when the lookup went through a boiling point."})
    boiling_point = fields.Nested(Temperature, metadata={"description": "The boiling point asked for."})


class AtmosphereAnswer(Provenance):
    elevation = fields.Nested(Length, required=True, metadata={"description": "Geometric elevation."})
    geopotential_height = fields.Nested(Length, required=True)
    pressure = fields.Nested(Pressure, required=True)
    temperature = fields.Nested(Temperature, required=True, metadata={"description": "Standard air temperature."})
    density = fields.Nested(Density, required=True, metadata={"description": "Air density."})
    model = fields.String(required=True, metadata={"description": "The atmosphere model and any scaling applied."})


class FixedPoint(Schema):
    temperature = fields.Nested(Temperature, required=True)
    pressure = fields.Nested(Pressure, required=True)


class ValidRange(Schema):
    temperature_min = fields.Nested(Temperature, required=True)
    temperature_max = fields.Nested(Temperature, required=True)
    pressure_min = fields.Nested(Pressure, required=True)
    pressure_max = fields.Nested(Pressure, required=True)


class ReferenceBoilingPoint(Schema):
    temperature = fields.Nested(Temperature, required=True, metadata={"description": "The published value."})
    difference = fields.Nested(
        TemperatureDifference,
        required=True,
        allow_none=True,
        metadata={"description": "The computed normal boiling point minus the published one."},
    )
    source = fields.String(required=True, metadata={"description": "Where the published value comes from."})


class FluidSummary(Schema):
    id = fields.String(required=True)
    name = fields.String(required=True)
    formula = fields.String(required=True)
    cas = fields.String(required=True, metadata={"description": "CAS registry number."})
    aliases = fields.List(fields.String(), required=True)
    normal_boiling_point = fields.Nested(
        Temperature,
        allow_none=True,
        required=True,
        metadata={
            "description": "The boiling point at 101.325 kPa as the service computes it from the vapor-pressure "
            "equation; null where the fluid does not boil at 1 atm."
        },
    )
    range = fields.Nested(
        ValidRange, required=True, metadata={"description": "Stated range of the vapor-pressure equation."}
    )
    method = fields.String(required=True, metadata={"description": "The vapor-pressure equation's published name."})
    source = fields.String(required=True, metadata={"description": "Citation of its coefficients."})


class FluidDetail(FluidSummary):
    molar_mass = fields.Float(required=True, metadata={"description": "Molar mass [kg/mol]."})
    critical_point = fields.Nested(FixedPoint, required=True)
    triple_point = fields.Nested(FixedPoint, required=True)
    constants_source = fields.String(
        required=True, metadata={"description": "Citation of the critical point, triple point and molar mass."}
    )
    reference_normal_boiling_point = fields.Nested(
        ReferenceBoilingPoint,
        required=True,
        allow_none=True,
        metadata={"description": "A published normal boiling point beside the computed one; null if none is listed."},
    )


class FluidList(Schema):
    count = fields.Integer(required=True)
    fluids = fields.List(fields.Nested(FluidSummary), required=True)


class CurvePoint(Schema):
    temperature = fields.Nested(Temperature, required=True)
    concentration = fields.Nested(Concentration, required=True)


class ConcentrationCurve(Schema):
    points = fields.List(
        fields.Nested(CurvePoint),
        required=True,
        metadata={"description": "Straight lines between the points; beyond them, the nearest point's value."},
    )
    source = fields.String(required=True)


class SoluteTemperatureRange(Schema):
    temperature_min = fields.Nested(Temperature, required=True)
    temperature_max = fields.Nested(Temperature, required=True)


class SoluteSummary(Schema):
    id = fields.String(required=True)
    name = fields.String(required=True)
    formula = fields.String(required=True)
    cas = fields.String(required=True, allow_none=True, metadata={"description": "CAS registry number, if it has one."})
    aliases = fields.List(fields.String(), required=True)
    molar_mass = fields.Float(required=True, metadata={"description": "In kg/mol (sea salt: its mean)."})
    concentration_units = fields.List(fields.String(), required=True)
    range = fields.Nested(
        SoluteTemperatureRange, required=True, metadata={"description": "The equation's stated temperature range."}
    )
    concentration_max = fields.Nested(
        ConcentrationCurve,
        required=True,
        metadata={"description": "The top of the equation's stated concentration range along temperature."},
    )
    solubility = fields.Nested(
        ConcentrationCurve,
        required=True,
        allow_none=True,
        metadata={"description": "The most that dissolves along temperature; above it the solid crystallises."},
    )
    notes = fields.List(fields.String(), required=True)
    method = fields.String(required=True, metadata={"description": "The water-activity equation's published name."})
    source = fields.String(required=True)


class SoluteList(Schema):
    count = fields.Integer(required=True)
    solutes = fields.List(fields.Nested(SoluteSummary), required=True)


class Problem(Schema):
    """RFC 9457 problem details."""

    type = fields.String(required=True, metadata={"format": "uri", "examples": [problem_type(422)]})
    title = fields.String(required=True)
    status = fields.Integer(required=True)
    detail = fields.String(required=True)
    errors = fields.Dict(
        keys=fields.String(),
        values=fields.List(fields.String()),
        metadata={"description": "Messages by input field, for validation failures."},
    )


class Health(Schema):
    status = fields.String(required=True)
    fluids = fields.Integer(metadata={"description": "Fluids loaded (readiness only)."})


class Index(Schema):
    service = fields.String(required=True)
    version = fields.String(required=True)
    paths = fields.List(fields.String(), required=True)
    documentation = fields.String(required=True)
