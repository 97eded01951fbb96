"""The standard atmosphere at an elevation."""

from __future__ import annotations

from typing import Any

import numpy as np
from flask import Blueprint

from service.api import schemas
from service.api.operations import Input, Inputs, Operation
from service.api.quantities import DENSITY, format_value, quantity
from service.api.rules import local_atmosphere
from service.physics import atmosphere

blueprint = Blueprint("atmosphere", __name__)


def standard_atmosphere(inputs: Inputs) -> dict[str, Any]:
    elevation = inputs.values["elevation"]
    pressure = local_atmosphere(inputs)  # checks the elevation and the sea-level pressure
    sea_level = inputs.get("sea_level_pressure")
    scale_to = atmosphere.SEA_LEVEL_PRESSURE if sea_level is None else sea_level
    model = atmosphere.MODEL
    warnings = []
    if sea_level is None:
        warnings.append(
            "Standard-day values: real air pressure departs from them with the weather by a few "
            "percent; send a station's sea_level_pressure to follow today's weather."
        )
    elif np.ndim(sea_level) == 0:
        model += (
            f", pressure scaled to a sea-level pressure of {format_value(float(sea_level), inputs.units['pressure'])}"
        )
    else:
        model += ", pressure scaled to the given sea-level pressures"
    return {
        "elevation": inputs.echo("elevation", inputs.units["length"]),
        "geopotential_height": quantity(atmosphere.geopotential_height(elevation), inputs.units["length"]),
        "pressure": quantity(pressure, inputs.units["pressure"]),
        "temperature": quantity(atmosphere.temperature_at_elevation(elevation), inputs.units["temperature"]),
        "density": quantity(atmosphere.density_at_elevation(elevation, scale_to), DENSITY),
        "model": model,
        "method": "hydrostatic equation in layers of constant lapse rate, with geopotential height",
        "source": atmosphere.SOURCE,
        "warnings": warnings,
    }


Operation(
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
    response=schemas.AtmosphereAnswer,
    compute=standard_atmosphere,
    example={"elevation": 1420.0},
    errors=(400, 422),
).register(blueprint)
