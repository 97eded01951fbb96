"""Response schemas of the mixture paths (bubble and dew points, azeotropes, pairs), beside
:mod:`service.api.answer_schemas`, whose quantities and provenance they share."""

from __future__ import annotations

from marshmallow import Schema, fields

from service.api.answer_schemas import Fraction, Pressure, Provenance, Temperature


def _by_component(description: str) -> fields.Dict:
    return fields.Dict(
        keys=fields.String(), values=fields.Nested(Fraction), required=True, metadata={"description": description}
    )


def _model_used() -> fields.String:
    return fields.String(
        required=True,
        metadata={"description": "The model used: nrtl, wilson, uniquac, unifac, unifac-dortmund or ideal."},
    )


class _PhasePoint(Provenance):
    components = fields.List(fields.String(), required=True, metadata={"description": "Catalog ids, in order."})
    gauge_pressure = fields.Nested(Pressure, metadata={"description": "The gauge reading sent."})
    pressure = fields.Nested(Pressure, metadata={"description": "The absolute pressure, where one was given."})
    temperature = fields.Nested(Temperature, metadata={"description": "The temperature, where one was given."})
    k_values = _by_component("K = y/x of each component.")
    activity_coefficients = _by_component("The liquid's activity coefficient of each component.")
    relative_volatility = fields.Nested(Fraction, metadata={"description": "K1/K2, for two components."})
    model = _model_used()


class BubblePointAnswer(_PhasePoint):
    bubble_point = fields.Nested(Temperature, metadata={"description": "Where the liquid starts to boil."})
    bubble_pressure = fields.Nested(Pressure, metadata={"description": "Where the liquid starts to boil."})
    vapor_composition = _by_component("The first vapor, in the request's basis.")


class DewPointAnswer(_PhasePoint):
    dew_point = fields.Nested(Temperature, metadata={"description": "Where the vapor starts to condense."})
    dew_pressure = fields.Nested(Pressure, metadata={"description": "Where the vapor starts to condense."})
    liquid_composition = _by_component("The first liquid, in the request's basis.")


class PairEntry(Schema):
    components = fields.List(fields.String(), required=True)
    names = fields.List(fields.String(), required=True)
    model = fields.String(required=True)
    parameters = fields.Dict(
        keys=fields.String(),
        values=fields.Float(),
        required=True,
        metadata={
            "description": "b in K. NRTL: tau_12 = b12/T, tau_21 = b21/T, and alpha. Wilson: Lambda_12 = exp(a12 + "
            "b12/T), Lambda_21 = exp(a21 + b21/T). UNIQUAC: tau_12 = exp(b12/T), tau_21 = exp(b21/T), and each "
            "component's volume r and area q."
        },
    )
    temperature_min = fields.Nested(Temperature, required=True)
    temperature_max = fields.Nested(Temperature, required=True)
    source = fields.String(required=True)


class PairList(Schema):
    count = fields.Integer(required=True)
    pairs = fields.List(fields.Nested(PairEntry), required=True)


class AzeotropePoint(Schema):
    temperature = fields.Nested(Temperature, required=True)
    composition = _by_component("The liquid's (and the vapor's) composition, in mole fractions.")


class AzeotropeAnswer(Provenance):
    components = fields.List(fields.String(), required=True, metadata={"description": "Catalog ids, in order."})
    gauge_pressure = fields.Nested(Pressure, metadata={"description": "The gauge reading sent."})
    pressure = fields.Nested(Pressure, required=True, metadata={"description": "The absolute pressure."})
    azeotrope = fields.Nested(AzeotropePoint, required=True, allow_none=True, metadata={"description": "Or null."})
    reason = fields.String(
        required=True, allow_none=True, metadata={"description": "Why there is none, where azeotrope is null."}
    )
    model = _model_used()
