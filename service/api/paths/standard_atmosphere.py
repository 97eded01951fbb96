"""The standard atmosphere at an elevation."""

from __future__ import annotations

from typing import Any

import numpy as np
from flask import Blueprint

from service.api import answer_schemas
from service.api.computing_path import ComputingPath, Input, Inputs
from service.api.quantity_fields import DENSITY, format_value, quantity
from service.api.rendering import provenance
from service.fluids import questions
from service.physics import atmosphere

blueprint = Blueprint("atmosphere", __name__)


def standard_atmosphere(inputs: Inputs) -> dict[str, Any]:
    sea_level = inputs.get("sea_level_pressure")
    found = questions.standard_air(inputs.values["elevation"], sea_level)
    model = atmosphere.MODEL
    if sea_level is not None and np.ndim(sea_level) == 0:
        scaled_to = format_value(float(sea_level), inputs.units["pressure"])
        model += f", pressure scaled to a sea-level pressure of {scaled_to}"
    elif sea_level is not None:
        model += ", pressure scaled to the given sea-level pressures"
    return {
        "elevation": inputs.echo("elevation", inputs.units["length"]),
        "geopotential_height": quantity(found.geopotential_height, inputs.units["length"]),
        "pressure": quantity(found.pressure, inputs.units["pressure"]),
        "temperature": quantity(found.temperature, inputs.units["temperature"]),
        "density": quantity(found.density, DENSITY),
        "model": model,
        **provenance(found, inputs.units),
    }


ComputingPath(
    path="/v1/atmosphere",
    name="Atmosphere",
    summary="Air pressure, temperature and density at an elevation",
    description=(
        "The U.S. Standard Atmosphere 1976 (identical to ISO 2533 and the ICAO standard atmosphere up to "
        "32 km) at a geometric elevation from -5,000 m to 86,000 m. A weather station's `sea_level_pressure` "
        "scales the pressure profile, as an altimeter setting does."
    ),
    inputs={
        "elevation": Input("length", "Geometric elevation above mean sea level.", required=True),
        "sea_level_pressure": Input("pressure", "A weather station's sea-level pressure (QNH).", reference="absolute"),
    },
    options={},
    dimensions=("pressure", "temperature", "length"),
    response=answer_schemas.AtmosphereAnswer,
    compute=standard_atmosphere,
    example={"elevation": 1420.0},
    errors=(400, 422),
).register(blueprint)
