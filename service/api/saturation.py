"""Boiling point, vapor pressure and elevation: the saturation paths."""

from __future__ import annotations

from typing import Any

from flask import Blueprint
from marshmallow import fields

from service.api import schemas
from service.api.operations import Input, Inputs, Operation
from service.api.problems import Problem
from service.api.quantities import quantity, ratio
from service.api.rules import (
    STANDARD_ATMOSPHERE_WARNING,
    check_boiling_pressure,
    check_liquid_temperature,
    local_pressure,
    note_near_critical,
    refuse_outside,
    resolve_fluid,
    sea_level_pressure,
)
from service.fluids.catalog import Fluid
from service.physics import atmosphere

blueprint = Blueprint("saturation", __name__)

FLUID = fields.String(
    load_default="water",
    metadata={
        "description": "Catalog id, CAS registry number or alias of the fluid (see /v1/fluids).",
        "example": "water",
    },
)
EXTRAPOLATE = fields.Boolean(
    load_default=False,
    metadata={
        "description": "Answer outside the equation's stated range (but between triple and critical point) "
        "with a warning, instead of refusing."
    },
)

SITE_INPUTS = {
    "barometric_pressure": Input(
        "pressure", "Absolute air pressure measured on site (a barometer reading, not reduced to sea level)."
    ),
    "elevation": Input(
        "length",
        "Geometric elevation of the site above mean sea level; the U.S. Standard "
        "Atmosphere 1976 gives its air pressure.",
    ),
    "sea_level_pressure": Input(
        "pressure", "A weather station's sea-level pressure (QNH); scales the standard atmosphere at `elevation`."
    ),
}


def provenance(fluid: Fluid, standard_atmosphere: bool, warnings: list[str]) -> dict[str, Any]:
    """``method``, ``source`` and ``warnings`` of an answer from ``fluid``'s equation."""
    method, source = fluid.method, fluid.source
    if standard_atmosphere:
        warnings.append(STANDARD_ATMOSPHERE_WARNING)
        method, source = f"{method}; {atmosphere.MODEL}", f"{source}; {atmosphere.SOURCE}"
    return {"method": method, "source": source, "warnings": warnings}


def boiling_point(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"])
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    warnings: list[str] = []
    local = local_pressure(inputs)
    check_boiling_pressure(fluid, local.value, p_unit, inputs.options["extrapolate"], warnings)
    temperature = fluid.saturation_temperature(local.value)
    note_near_critical(fluid, temperature, t_unit, warnings)
    return {
        "fluid": fluid.id,
        "pressure": quantity(local.value, p_unit),
        "boiling_point": quantity(temperature, t_unit),
        "sensitivity": ratio(1.0 / fluid.saturation_pressure_slope(temperature), t_unit, p_unit),
        **provenance(fluid, local.standard_atmosphere, warnings),
    }


def vapor_pressure(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"])
    temperature = inputs.get("temperature")
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    warnings: list[str] = []
    check_liquid_temperature(fluid, temperature, t_unit, inputs.options["extrapolate"], warnings)
    note_near_critical(fluid, temperature, t_unit, warnings)
    return {
        "fluid": fluid.id,
        "temperature": quantity(temperature, t_unit),
        "vapor_pressure": quantity(fluid.saturation_pressure(temperature), p_unit),
        "sensitivity": ratio(fluid.saturation_pressure_slope(temperature), p_unit, t_unit),
        **provenance(fluid, False, warnings),
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
    warnings: list[str] = []
    answer: dict[str, Any] = {"method": atmosphere.MODEL, "source": atmosphere.SOURCE}
    if boiling is not None:
        fluid = resolve_fluid(inputs.options["fluid"])
        check_liquid_temperature(fluid, boiling, t_unit, inputs.options["extrapolate"], warnings, "boiling_point")
        pressure = fluid.saturation_pressure(boiling)
        answer = {
            "fluid": fluid.id,
            "boiling_point": quantity(boiling, t_unit),
            "method": f"{fluid.method}; {atmosphere.MODEL}",
            "source": f"{fluid.source}; {atmosphere.SOURCE}",
        }
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
    warnings.append(
        "The elevation is where the U.S. Standard Atmosphere 1976 has this pressure; on a real "
        "day the weather moves it by up to a few hundred metres."
    )
    return {
        "elevation": quantity(atmosphere.elevation_at_pressure(pressure, sea_level), inputs.units["length"]),
        "pressure": quantity(pressure, p_unit),
        **answer,
        "warnings": warnings,
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
            "to the local atmosphere; negative is vacuum). `sensitivity` is dT/dp at that point."
        ),
        inputs={
            "pressure": Input("pressure", "Absolute pressure on the liquid."),
            "gauge_pressure": Input(
                "pressure", "Pressure relative to the local atmosphere, as a gauge reads it; negative for vacuum."
            ),
            **SITE_INPUTS,
        },
        options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
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
            "pressure": Input("pressure", "Absolute air pressure."),
            "boiling_point": Input("temperature", "Temperature at which `fluid` boils in the open."),
            "sea_level_pressure": SITE_INPUTS["sea_level_pressure"],
        },
        options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
        dimensions=("pressure", "temperature", "length"),
        response=schemas.ElevationAnswer,
        compute=elevation,
        example={"fluid": "water", "boiling_point": 95.2},
    ),
):
    _operation.register(blueprint)
