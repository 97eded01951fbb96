"""The inputs that describe the pressure on a liquid, and the pressures an answer shows.

:data:`PRESSURE_INPUTS` declares them once for every path that boils; :func:`readings` hands
them to the domain (:mod:`service.fluids.site_pressure`), which decides what they mean.
"""

from __future__ import annotations

from typing import Any

from numpy.typing import NDArray

from service.api.computing_path import Input, Inputs
from service.api.quantity_fields import quantity
from service.fluids.site_pressure import LocalPressure, PressureReadings
from service.physics import site
from service.physics.units import Unit

SITE_INPUTS = {
    "barometric_pressure": Input(
        "pressure",
        "Absolute air pressure measured on site (a barometer reading, not reduced to sea level), between "
        f"{site.AIR_PRESSURE_RANGE[0] / 1e3:g} kPa and {site.AIR_PRESSURE_RANGE[1] / 1e3:g} kPa: the band air "
        "pressure takes where people work.",
        reference="absolute",
    ),
    "elevation": Input(
        "length",
        "Geometric elevation of the site above mean sea level; the U.S. Standard "
        "Atmosphere 1976 gives its air pressure.",
    ),
    "sea_level_pressure": Input(
        "pressure",
        "A weather station's sea-level pressure (QNH); scales the standard atmosphere at `elevation`.",
        reference="absolute",
    ),
}
PRESSURE_INPUTS = {
    "pressure": Input("pressure", "Absolute pressure on the liquid.", reference="absolute"),
    "gauge_pressure": Input(
        "pressure",
        "Pressure relative to the local atmosphere, as a gauge reads it; negative for vacuum. Its own unit may "
        "be a gauge spelling (psig, barg, kPag).",
        reference="gauge",
    ),
    **SITE_INPUTS,
}
"""The ways a request may give the pressure on a liquid; see :func:`service.fluids.site_pressure.local_pressure`."""

INSTRUMENT_INPUTS = {
    "pressure_uncertainty": Input(
        "pressure", "Standard uncertainty of the pressure reading; gives the boiling point's uncertainty."
    ),
    "depth": Input(
        "length",
        "How far below the liquid surface the sensor sits: the liquid there boils at the surface pressure plus "
        "its own hydrostatic head.",
    ),
}


def readings(inputs: Inputs) -> PressureReadings:
    """The request's pressure readings [SI], for the domain."""
    return PressureReadings(**{name: inputs.get(name) for name in PRESSURE_INPUTS})


def pressure_fields(
    inputs: Inputs, local: LocalPressure, unit: Unit, at_depth: NDArray | None = None
) -> dict[str, Any]:
    """The pressures an answer shows: the gauge reading as sent, the absolute pressure used, and, where the
    sensor sits at a depth (``at_depth``, the pressure there [Pa]), the pressure on the surface."""
    out: dict[str, Any] = {}
    if inputs.get("gauge_pressure") is not None:
        out["gauge_pressure"] = inputs.echo("gauge_pressure", unit)
    surface = inputs.echo(local.source, unit) if local.source else quantity(local.value, unit)
    if at_depth is None:
        out["pressure"] = surface
    else:
        out["pressure"] = quantity(at_depth, unit)
        out["surface_pressure"] = surface
    return out
