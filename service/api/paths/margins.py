"""Field answers: margin to boiling, and NPSH available at a pump suction."""

from __future__ import annotations

from typing import Any

from flask import Blueprint
from marshmallow import validate

from service.api import answer_schemas
from service.api.computing_path import ComputingPath, Input, Inputs
from service.api.fluid_input import (
    CONCENTRATION,
    FLUID_BODY_OPTIONS,
    FLUID_OPTIONS,
    resolve_boiling,
    solute_fields,
)
from service.api.numbers import Number
from service.api.pressure_inputs import INSTRUMENT_INPUTS, PRESSURE_INPUTS, pressure_fields, readings
from service.api.quantity_fields import DENSITY, difference, quantity
from service.api.rendering import provenance
from service.fluids import questions

blueprint = Blueprint("margins", __name__)

TOLERANCE = Number(
    validate=validate.Range(min=0.0),
    metadata={
        "description": "Half-width of the `saturated` band, as a temperature difference in K (for K and degC "
        "requests) or degR (for degF and degR requests). Default 0.1 K."
    },
)


def saturation_margin(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_boiling(inputs)
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    tolerance = inputs.options.get("tolerance")
    found = questions.saturation_margin(
        fluid,
        readings(inputs),
        inputs.values["temperature"],
        inputs.options["extrapolate"],
        None if tolerance is None else tolerance * t_unit.scale,  # a difference
        inputs.get("depth"),
        inputs.get("pressure_uncertainty"),
    )
    answer = {
        "fluid": fluid.id,
        **pressure_fields(inputs, found.local, p_unit, None if found.depth_density is None else found.pressure),
        "temperature": inputs.echo("temperature", t_unit),
        "saturation_temperature": quantity(found.temperature, t_unit),
    }
    if found.uncertainty is not None:
        answer["saturation_temperature_uncertainty"] = difference(found.uncertainty, t_unit)
    return {
        **answer,
        "margin": difference(found.margin, t_unit),
        "state": found.state.tolist() if found.state.ndim else str(found.state),
        "tolerance": difference(found.tolerance, t_unit),
        **solute_fields(found, fluid, inputs),
        **provenance(found, inputs.units),
    }


def npsh_available(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_boiling(inputs)
    p_unit, t_unit, l_unit = inputs.units["pressure"], inputs.units["temperature"], inputs.units["length"]
    friction = inputs.get("friction_loss")
    found = questions.npsh_available(
        fluid,
        readings(inputs),
        inputs.values["temperature"],
        inputs.values["static_head"],
        friction,
        inputs.options["extrapolate"],
        inputs.options.get("liquid_density"),
    )
    return {
        "fluid": fluid.id,
        **pressure_fields(inputs, found.local, p_unit),
        "temperature": inputs.echo("temperature", t_unit),
        "vapor_pressure": quantity(found.vapor_pressure, p_unit),
        "liquid_density": quantity(found.density, DENSITY),
        "static_head": inputs.echo("static_head", l_unit),
        "friction_loss": quantity(found.friction_loss, l_unit)
        if friction is None
        else inputs.echo("friction_loss", l_unit),
        "npsh_available": quantity(found.npsh, l_unit),
        **solute_fields(found, fluid, inputs),
        **provenance(found, inputs.units),
    }


LIQUID_DENSITY = Number(
    validate=validate.Range(min=100.0, max=5000.0),
    metadata={
        "description": "The liquid's density in kg/m3, where the service has no correlation for it (a solution) "
        "or the caller has a measured one; it then replaces the correlation. 100 to 5000.",
    },
)
MEASURED_TEMPERATURE = Input("temperature", "Measured temperature of the liquid.", required=True)

ComputingPath(
    path="/v1/saturation-margin",
    name="SaturationMargin",
    summary="How far a liquid is from boiling",
    description=(
        "The saturation temperature at the pressure on the liquid (given as for /v1/boiling-point) minus the "
        "measured `temperature`: a positive `margin` means below boiling. `state` is `subcooled`, `saturated` "
        "(within `tolerance`) or `superheated`. For an instrument check, `depth` puts the sensor below the surface "
        "(the head of the liquid raises its saturation temperature) and `pressure_uncertainty` widens the "
        "saturated band by twice the saturation temperature's uncertainty, so a reading error within it is not "
        "called superheated. Differences are in K for kelvin and Celsius requests and in degR for Fahrenheit and "
        "Rankine requests."
    ),
    inputs={
        "temperature": MEASURED_TEMPERATURE,
        **PRESSURE_INPUTS,
        **INSTRUMENT_INPUTS,
        "concentration": CONCENTRATION,
    },
    options={**FLUID_OPTIONS, "tolerance": TOLERANCE},
    body_options=FLUID_BODY_OPTIONS,
    dimensions=("pressure", "temperature", "length", "concentration"),
    response=answer_schemas.SaturationMarginAnswer,
    compute=saturation_margin,
    example={"fluid": "ethanol", "temperature": 48.0, "gauge_pressure": -55.0, "elevation": 1420.0},
).register(blueprint)

ComputingPath(
    path="/v1/npsh-available",
    name="NpshAvailable",
    summary="Net positive suction head available at a pump",
    description=(
        "NPSHa = (p_surface - p_vapor) / (rho g) + static_head - friction_loss, with g = 9.80665 m/s2, the "
        "vapor pressure and saturated-liquid density at the liquid `temperature`, and the pressure on the "
        "liquid surface given as for /v1/boiling-point. `static_head` is the liquid level above the pump "
        "suction centreline (negative for a suction lift). Compare NPSHa with the pump maker's NPSH required "
        "plus the margin the maker and the applicable standard call for; the maker and a licensed engineer "
        "have the last word."
    ),
    inputs={
        "temperature": MEASURED_TEMPERATURE,
        **PRESSURE_INPUTS,
        "static_head": Input(
            "length", "Liquid level above the pump suction centreline; negative for a lift.", required=True
        ),
        "friction_loss": Input("length", "Head lost to friction in the suction line (default 0)."),
        "concentration": CONCENTRATION,
    },
    options={**FLUID_OPTIONS, "liquid_density": LIQUID_DENSITY},
    body_options=FLUID_BODY_OPTIONS,
    dimensions=("pressure", "temperature", "length", "concentration"),
    response=answer_schemas.NpshAnswer,
    compute=npsh_available,
    example={"fluid": "water", "temperature": 72.0, "elevation": 1420.0, "static_head": 2.4, "friction_loss": 0.6},
).register(blueprint)
