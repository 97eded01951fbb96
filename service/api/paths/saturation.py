"""Boiling point, vapor pressure and elevation: the saturation paths."""

from __future__ import annotations

from typing import Any

from flask import Blueprint

from service.api import answer_schemas
from service.api.computing_path import ComputingPath, Input, Inputs
from service.api.fluid_input import (
    CONCENTRATION,
    FLUID_BODY_OPTIONS,
    FLUID_OPTIONS,
    resolve_boiling,
    solute_fields,
)
from service.api.pressure_inputs import INSTRUMENT_INPUTS, PRESSURE_INPUTS, SITE_INPUTS, pressure_fields, readings
from service.api.quantity_fields import difference, quantity, ratio
from service.api.rendering import provenance
from service.fluids import questions

blueprint = Blueprint("saturation", __name__)


def boiling_point(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_boiling(inputs)
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    found = questions.boiling_point(
        fluid, readings(inputs), inputs.options["extrapolate"], inputs.get("depth"), inputs.get("pressure_uncertainty")
    )
    answer = {
        "fluid": fluid.id,
        **pressure_fields(inputs, found.local, p_unit, None if found.depth_density is None else found.pressure),
        "boiling_point": quantity(found.temperature, t_unit),
    }
    if found.uncertainty is not None:
        answer["boiling_point_uncertainty"] = difference(found.uncertainty, t_unit)
    return {
        **answer,
        "sensitivity": ratio(found.slope, t_unit, p_unit),
        **solute_fields(found, fluid, inputs),
        **provenance(found, inputs.units),
    }


def vapor_pressure(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_boiling(inputs)
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    found = questions.vapor_pressure(fluid, inputs.values["temperature"], inputs.options["extrapolate"])
    return {
        "fluid": fluid.id,
        "temperature": inputs.echo("temperature", t_unit),
        "vapor_pressure": quantity(found.pressure, p_unit),
        "sensitivity": ratio(found.slope, p_unit, t_unit),
        **solute_fields(found, fluid, inputs),
        **provenance(found, inputs.units),
    }


def elevation(inputs: Inputs) -> dict[str, Any]:
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    boiling = inputs.get("boiling_point")
    fluid = resolve_boiling(inputs)  # an unknown name is a 404 either way
    found = questions.elevation(
        fluid, inputs.get("pressure"), boiling, inputs.get("sea_level_pressure"), inputs.options["extrapolate"]
    )
    fluid_fields = {} if boiling is None else {"fluid": fluid.id, "boiling_point": inputs.echo("boiling_point", t_unit)}
    return {
        "elevation": quantity(found.elevation, inputs.units["length"]),
        "pressure": quantity(found.pressure, p_unit) if boiling is not None else inputs.echo("pressure", p_unit),
        **fluid_fields,
        **solute_fields(found, fluid, inputs),
        **provenance(found, inputs.units),
    }


for _operation in (
    ComputingPath(
        path="/v1/boiling-point",
        name="BoilingPoint",
        summary="Boiling point at a pressure, an elevation, or a gauge reading",
        description=(
            "The saturation temperature of a fluid at the absolute pressure the request describes: "
            "`pressure` (absolute); or `elevation` or `barometric_pressure` alone (a vessel open to the "
            "atmosphere); or `gauge_pressure` plus `barometric_pressure` or `elevation` (a gauge reads relative "
            "to the local atmosphere; negative is vacuum). `sensitivity` is dT/dp at that point. For an instrument "
            "check, `pressure_uncertainty` gives `boiling_point_uncertainty` through the slope, and `depth` adds the "
            "hydrostatic head of the boiling liquid above the sensor."
        ),
        inputs={**PRESSURE_INPUTS, **INSTRUMENT_INPUTS, "concentration": CONCENTRATION},
        options=FLUID_OPTIONS,
        body_options=FLUID_BODY_OPTIONS,
        dimensions=("pressure", "temperature", "length", "concentration"),
        response=answer_schemas.BoilingPointAnswer,
        compute=boiling_point,
        example={"fluid": "water", "gauge_pressure": 950.0, "elevation": 1420.0},
    ),
    ComputingPath(
        path="/v1/vapor-pressure",
        name="VaporPressure",
        summary="Vapor pressure of a liquid at a temperature",
        description="The saturation pressure of a fluid at `temperature`, and its slope dp/dT.",
        inputs={
            "temperature": Input("temperature", "Liquid temperature.", required=True),
            "concentration": CONCENTRATION,
        },
        options=FLUID_OPTIONS,
        body_options=FLUID_BODY_OPTIONS,
        dimensions=("pressure", "temperature", "concentration"),
        response=answer_schemas.VaporPressureAnswer,
        compute=vapor_pressure,
        example={"fluid": "water", "temperature": 72.0},
    ),
    ComputingPath(
        path="/v1/elevation",
        name="Elevation",
        summary="Standard-atmosphere elevation of a pressure, or of a boiling point",
        description=(
            "The geometric elevation at which the U.S. Standard Atmosphere 1976 has `pressure`, or at which "
            "`fluid` boils at `boiling_point` in an open vessel. `sea_level_pressure` shifts the profile as an "
            "altimeter setting does."
        ),
        inputs={
            "pressure": Input("pressure", "Absolute air pressure.", reference="absolute"),
            "boiling_point": Input("temperature", "Temperature at which `fluid` boils in the open."),
            "sea_level_pressure": SITE_INPUTS["sea_level_pressure"],
            "concentration": CONCENTRATION,
        },
        options=FLUID_OPTIONS,
        body_options=FLUID_BODY_OPTIONS,
        dimensions=("pressure", "temperature", "length", "concentration"),
        response=answer_schemas.ElevationAnswer,
        compute=elevation,
        example={"fluid": "water", "boiling_point": 95.2},
    ),
):
    _operation.register(blueprint)
