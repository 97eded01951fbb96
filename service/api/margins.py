"""Field answers: margin to boiling, and NPSH available at a pump suction."""

from __future__ import annotations

from typing import Any

import numpy as np
from flask import Blueprint
from marshmallow import validate

from service.api import schemas
from service.api.fluid_field import BODY_FLUID, EXTRAPOLATE, FLUID, resolve_fluid
from service.api.operations import Input, Inputs, Operation
from service.api.quantities import DENSITY, Number, any_true, difference, quantity
from service.api.rules import (
    INSTRUMENT_INPUTS,
    PRESSURE_INPUTS,
    boiling_pressure_at_depth,
    check_boiling_pressure,
    check_liquid_temperature,
    local_pressure,
    note_near_critical,
    pressure_fields,
    provenance,
    refuse_outside,
    require_liquid_density,
    temperature_uncertainty,
)
from service.fluids.cautions import Caution, Warnings
from service.physics.units import STANDARD_GRAVITY

blueprint = Blueprint("margins", __name__)

DEFAULT_TOLERANCE = 0.1
"""Within this many kelvin of the saturation temperature a liquid counts as saturated."""
COVERAGE = 2.0
"""With a pressure uncertainty u, the saturated band widens by k u, k = 2: about 95 % coverage for a normal
distribution (JCGM 100:2008, the GUM, section 6.3)."""

TOLERANCE = Number(
    validate=validate.Range(min=0.0),
    metadata={
        "description": "Half-width of the `saturated` band, as a temperature difference in K (for K and degC "
        "requests) or degR (for degF and degR requests). Default 0.1 K."
    },
)
NPSH_CAUTION = (
    "NPSH available must exceed the pump maker's NPSH required for this duty point by the margin the maker "
    "and the applicable standard call for; confirm with the maker and a licensed engineer."
)


def saturation_margin(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)
    p_unit, t_unit = inputs.units["pressure"], inputs.units["temperature"]
    warnings: Warnings = []
    local = local_pressure(inputs)
    check_boiling_pressure(fluid, local.value, p_unit, inputs.options["extrapolate"], warnings)
    pressure, density = boiling_pressure_at_depth(fluid, local.value, inputs, warnings)
    saturation = fluid.saturation_temperature(pressure)
    note_near_critical(fluid, saturation, t_unit, warnings)
    tolerance_setting = inputs.options.get("tolerance")
    tolerance = DEFAULT_TOLERANCE if tolerance_setting is None else tolerance_setting * t_unit.scale  # a difference
    uncertainty = temperature_uncertainty(1.0 / fluid.saturation_pressure_slope(saturation), inputs)
    band = tolerance if uncertainty is None else tolerance + COVERAGE * uncertainty
    margin = saturation - inputs.values["temperature"]
    state = np.where(margin > band, "subcooled", np.where(margin < -band, "superheated", "saturated"))
    answer = {
        "fluid": fluid.id,
        **pressure_fields(inputs, local, p_unit, None if density is None else pressure),
        "temperature": inputs.echo("temperature", t_unit),
        "saturation_temperature": quantity(saturation, t_unit),
    }
    if uncertainty is not None:
        answer["saturation_temperature_uncertainty"] = difference(uncertainty, t_unit)
    return {
        **answer,
        "margin": difference(margin, t_unit),
        "state": state.tolist() if state.ndim else str(state),
        "tolerance": difference(tolerance, t_unit),
        **provenance(fluid, local.note, warnings, density),
    }


def npsh_available(inputs: Inputs) -> dict[str, Any]:
    fluid = resolve_fluid(inputs.options["fluid"], inputs.units)
    p_unit, t_unit, l_unit = inputs.units["pressure"], inputs.units["temperature"], inputs.units["length"]
    extrapolate = inputs.options["extrapolate"]
    warnings: Warnings = []
    temperature = inputs.values["temperature"]
    check_liquid_temperature(fluid, temperature, t_unit, extrapolate, warnings)
    density = require_liquid_density(fluid)
    outside = (temperature < density.t_min) | (temperature > density.t_max)
    if any_true(outside):
        where = f"the stated range of the {density.method} for {fluid.name}, {{limit}}"
        if not extrapolate:
            refuse_outside("temperature", temperature, t_unit, density.t_min, density.t_max, where, where)
        warnings.append(
            Caution(
                f"temperature lies outside the stated range of the {density.method}: the density is extrapolated.",
                outside,
            )
        )
    local = local_pressure(inputs)
    friction = inputs.get("friction_loss")
    friction = np.zeros(inputs.shape) if friction is None else friction
    refuse_outside("friction_loss", friction, l_unit, 0.0, None, "zero, {limit}: a loss is not negative", "")
    vapor = fluid.saturation_pressure(temperature)
    rho = density.density(temperature)
    static = inputs.values["static_head"]
    npsh = (local.value - vapor) / (rho * STANDARD_GRAVITY) + static - friction
    boiling = local.value < vapor
    if any_true(boiling):
        warnings.append(
            Caution(
                "The surface pressure is below the liquid's vapor pressure: the liquid boils at the "
                "surface, and no pump suction from it is free of vapor.",
                boiling,
            )
        )
    negative = npsh < 0
    if any_true(negative):
        warnings.append(
            Caution(
                "NPSH available is negative: the pressure at the suction falls below the vapor pressure, so the "
                "liquid flashes before it reaches the impeller and no pump can take it as a liquid. Raise the "
                "level or the pressure, cool the liquid, or cut the suction losses.",
                negative,
            )
        )
    warnings.append(NPSH_CAUTION)
    return {
        "fluid": fluid.id,
        **pressure_fields(inputs, local, p_unit),
        "temperature": inputs.echo("temperature", t_unit),
        "vapor_pressure": quantity(vapor, p_unit),
        "liquid_density": quantity(rho, DENSITY),
        "static_head": inputs.echo("static_head", l_unit),
        "friction_loss": quantity(friction, l_unit)
        if inputs.get("friction_loss") is None
        else inputs.echo("friction_loss", l_unit),
        "npsh_available": quantity(npsh, l_unit),
        **provenance(fluid, local.note, warnings, density),
    }


MEASURED_TEMPERATURE = Input("temperature", "Measured temperature of the liquid.", required=True)

Operation(
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
    inputs={"temperature": MEASURED_TEMPERATURE, **PRESSURE_INPUTS, **INSTRUMENT_INPUTS},
    options={"fluid": FLUID, "extrapolate": EXTRAPOLATE, "tolerance": TOLERANCE},
    body_options={"fluid": BODY_FLUID},
    dimensions=("pressure", "temperature", "length"),
    response=schemas.SaturationMarginAnswer,
    compute=saturation_margin,
    example={"fluid": "ethanol", "temperature": 48.0, "gauge_pressure": -55.0, "elevation": 1420.0},
).register(blueprint)

Operation(
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
    },
    options={"fluid": FLUID, "extrapolate": EXTRAPOLATE},
    body_options={"fluid": BODY_FLUID},
    dimensions=("pressure", "temperature", "length"),
    response=schemas.NpshAnswer,
    compute=npsh_available,
    example={"fluid": "water", "temperature": 72.0, "elevation": 1420.0, "static_head": 2.4, "friction_loss": 0.6},
).register(blueprint)
