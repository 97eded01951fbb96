"""Boiling point, vapor pressure and elevation: the saturation paths."""

from __future__ import annotations

from typing import Any

import numpy as np
from flask import Blueprint
from numpy.typing import NDArray

from service.api import schemas
from service.api.fluid_field import BODY_FLUID, EXTRAPOLATE, FLUID, resolve_fluid
from service.api.operations import Input, Inputs, Operation
from service.api.problems import Problem
from service.api.quantities import difference, largest, quantity, ratio
from service.api.rules import (
    INSTRUMENT_INPUTS,
    PRESSURE_INPUTS,
    SITE_INPUTS,
    WEATHER_SPREAD,
    LocalPressure,
    boiling_pressure_at_depth,
    check_boiling_pressure,
    check_liquid_temperature,
    local_pressure,
    note_near_critical,
    pressure_fields,
    provenance,
    refuse_outside,
    sea_level_pressure,
    temperature_uncertainty,
)
from service.fluids.cautions import Warnings
from service.physics import atmosphere
from service.physics.units import Unit

blueprint = Blueprint("saturation", __name__)

ELEVATION_WARNING = (
    "The elevation is where the U.S. Standard Atmosphere 1976 has this pressure; on a real "
    "day the weather moves it by up to a few hundred metres."
)


def boiling_point(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    warnings: Warnings = []
    local = local_pressure(inputs)
    check_boiling_pressure(fluid, local.value, p_unit, inputs.options["extrapolate"], warnings)
    pressure, density = boiling_pressure_at_depth(fluid, local.value, inputs, warnings)
    temperature = fluid.saturation_temperature(pressure)
    slope = 1.0 / fluid.saturation_pressure_slope(temperature)
    note_near_critical(fluid, temperature, t_unit, warnings)
    answer = {
        "fluid": fluid.id,
        **pressure_fields(inputs, local, p_unit, None if density is None else pressure),
        "boiling_point": quantity(temperature, t_unit),
    }
    uncertainty = temperature_uncertainty(slope, inputs)
    if uncertainty is not None:
        answer["boiling_point_uncertainty"] = difference(uncertainty, t_unit)
    return {
        **answer,
        "sensitivity": ratio(slope, t_unit, p_unit),
        **provenance(fluid, weather_note(local, slope, t_unit), warnings, density),
    }


def weather_note(local: LocalPressure, slope: NDArray, t_unit: Unit) -> str | None:
    """The caution owed for the local atmosphere; on a standard day, with how far the weather moves the answer."""
    if not local.standard_day:
        return local.note
    spread = difference(largest(np.abs(slope) * WEATHER_SPREAD * local.atmosphere, empty=0.0), t_unit)
    return (
        f"{local.note} A {WEATHER_SPREAD:.0%} change in the air pressure moves this "
        f"boiling point by about {spread['value']:.2g} {spread['unit']}."
    )


def vapor_pressure(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)
    temperature = inputs.get("temperature")
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    warnings: Warnings = []
    check_liquid_temperature(fluid, temperature, t_unit, inputs.options["extrapolate"], warnings)
    note_near_critical(fluid, temperature, t_unit, warnings)
    return {
        "fluid": fluid.id,
        "temperature": inputs.echo("temperature", t_unit),
        "vapor_pressure": quantity(fluid.saturation_pressure(temperature), p_unit),
        "sensitivity": ratio(fluid.saturation_pressure_slope(temperature), p_unit, t_unit),
        **provenance(fluid, None, warnings),
    }


def elevation(inputs: Inputs) -> dict[str, Any]:
    pressure, boiling = inputs.get("pressure"), inputs.get("boiling_point")
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    if (pressure is None) == (boiling is None):
        raise Problem(
            400,
            "Give pressure, or boiling_point (with fluid), but not both.",
            {"pressure": ["give pressure or boiling_point"], "boiling_point": ["give boiling_point or pressure"]},
        )
    warnings: Warnings = []
    answer: dict[str, Any] = {}
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)  # an unknown name is a 404 either way
    if boiling is not None:
        check_liquid_temperature(fluid, boiling, t_unit, inputs.options["extrapolate"], warnings, "boiling_point")
        pressure = fluid.saturation_pressure(boiling)
        answer = {"fluid": fluid.id, "boiling_point": inputs.echo("boiling_point", t_unit)}
    sea_level = sea_level_pressure(inputs)
    scale = sea_level / atmosphere.SEA_LEVEL_PRESSURE
    refuse_outside(
        "pressure",
        pressure,
        p_unit,
        atmosphere.PRESSURE_AT_MAX_ELEVATION * scale,
        atmosphere.PRESSURE_AT_MIN_ELEVATION * scale,
        "{limit}, the pressure at the top of the standard atmosphere (86 km)",
        "{limit}, the pressure at the bottom of the standard atmosphere (-5 km)",
    )
    return {
        "elevation": quantity(atmosphere.elevation_at_pressure(pressure, sea_level), inputs.units["length"]),
        "pressure": quantity(pressure, p_unit) if boiling is not None else inputs.echo("pressure", p_unit),
        **answer,
        **provenance(fluid if boiling is not None else None, ELEVATION_WARNING, warnings),
    }


for _operation in (
    Operation(
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
        inputs={**PRESSURE_INPUTS, **INSTRUMENT_INPUTS},
        options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
        body_options={"fluid": BODY_FLUID},
        dimensions=("pressure", "temperature", "length"),
        response=schemas.BoilingPointAnswer,
        compute=boiling_point,
        example={"fluid": "water", "gauge_pressure": 950.0, "elevation": 1420.0},
    ),
    Operation(
        path="/v1/vapor-pressure",
        name="VaporPressure",
        summary="Vapor pressure of a liquid at a temperature",
        description="The saturation pressure of a fluid at `temperature`, and its slope dp/dT.",
        inputs={"temperature": Input("temperature", "Liquid temperature.", required=True)},
        options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
        body_options={"fluid": BODY_FLUID},
        dimensions=("pressure", "temperature"),
        response=schemas.VaporPressureAnswer,
        compute=vapor_pressure,
        example={"fluid": "water", "temperature": 72.0},
    ),
    Operation(
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
        },
        options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
        body_options={"fluid": BODY_FLUID},
        dimensions=("pressure", "temperature", "length"),
        response=schemas.ElevationAnswer,
        compute=elevation,
        example={"fluid": "water", "boiling_point": 95.2},
    ),
):
    _operation.register(blueprint)
