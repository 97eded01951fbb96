"""Rules shared by the computing paths: fluid lookup, local pressure, validity limits.

Each rule takes SI arrays, refuses what the physics cannot answer with a problem that
names the limit in the request's own unit, and appends cautions to ``warnings``.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

import numpy as np
from flask import current_app
from numpy.typing import NDArray

from service.api.operations import Input, Inputs
from service.api.problems import Problem, invalid
from service.api.quantities import any_true, format_value, quantity
from service.fluids.catalog import Catalog, Fluid, LiquidDensity
from service.fluids.cautions import Caution, Warnings
from service.physics import atmosphere, site
from service.physics.units import STANDARD_GRAVITY, Unit

WEATHER_SPREAD = 0.03
"""Typical departure of real barometric pressure from the standard atmosphere (common practice, no source)."""
NEAR_CRITICAL = 0.98
"""Warn above this fraction of the critical temperature."""
SEA_LEVEL_PRESSURE_RANGE = (85e3, 110e3)
"""Plausible reduced sea-level pressures [Pa]; the recorded extremes lie inside it."""
_MAX_LISTED = 10
_SLACK = 1e-12


def _distinct(value: float, limit: float, unit: Unit) -> tuple[str, str]:
    """A value and its limit formatted with enough digits to tell them apart."""
    for digits in (6, 9, 12, 17):
        shown = format_value(value, unit, digits), format_value(limit, unit, digits)
        if shown[0] != shown[1]:
            break
    return shown


STANDARD_ATMOSPHERE_WARNING = (
    "The local atmospheric pressure is the U.S. Standard Atmosphere 1976 value for the given "
    "elevation, not a measurement: real barometric pressure departs from it with the weather by a "
    "few percent (typically within 3 %). Send barometric_pressure for a measured value."
)


def catalog() -> Catalog:
    return current_app.extensions["catalog"]


def resolve_catalog_fluid(name: str) -> Fluid:
    """The catalog fluid named ``name``; 400 for an empty name, 404 listing the closest names otherwise."""
    if not name.strip():
        raise invalid("fluid", "is empty: give a catalog id, CAS number or alias (GET /v1/fluids lists them)")
    fluid = catalog().get(name)
    if fluid is None:
        close = catalog().close_matches(name)
        hint = f" Closest matches: {', '.join(close)}." if close else ""
        raise Problem(
            404,
            f"No fluid named {name!r} in the catalog.{hint} GET /v1/fluids lists them all.",
            {"fluid": [f"unknown fluid {name!r}"]},
        )
    return fluid


def refuse_outside(
    field: str,
    values: NDArray,
    unit: Unit,
    low: NDArray | float | None,
    high: NDArray | float | None,
    below: str,
    above: str,
) -> None:
    """Answer 422 when any of ``values`` lies below ``low`` or above ``high`` [SI].

    ``below`` and ``above`` describe the limits, with ``{limit}`` where the limit's value in
    ``unit`` goes; the messages give each bad value, with its index in an array request.
    """
    # A limit typed in another unit comes back a rounding error off (0.01 degC is 273.15999999999997 K):
    # values within 1e-12 of a limit count as on it.
    too_low = values < low - _SLACK * abs(low) if low is not None else False
    too_high = values > high + _SLACK * abs(high) if high is not None else False
    if not (any_true(too_low) or any_true(too_high)):
        return
    bad = np.logical_or(too_low, too_high)
    values, too_low = np.broadcast_to(values, bad.shape), np.broadcast_to(too_low, bad.shape)
    lows = np.broadcast_to(-np.inf if low is None else low, bad.shape)
    highs = np.broadcast_to(np.inf if high is None else high, bad.shape)
    messages = []
    for index in np.flatnonzero(bad)[:_MAX_LISTED]:
        limit = float(lows.flat[index] if too_low.flat[index] else highs.flat[index])
        value, shown = _distinct(float(values.flat[index]), limit, unit)
        if too_low.flat[index]:
            text = f"{value} is below " + below.format(limit=shown)
        else:
            text = f"{value} is above " + above.format(limit=shown)
        messages.append(f"index {index}: {text}" if values.ndim else text)
    count = int(bad.sum())
    if count > len(messages):
        messages.append(f"and {count - len(messages)} more")
    raise Problem(
        422, f"{field}: {messages[0]}" + (f" ({count} values in all)" if count > 1 else ""), {field: messages}
    )


SCALED_ATMOSPHERE_WARNING = (
    "The local atmospheric pressure is the U.S. Standard Atmosphere 1976 at the given elevation, scaled to "
    "the station's sea-level pressure: closer to today's weather than a standard day, but not a measurement "
    "on site. Send barometric_pressure for a measured value."
)


@dataclass(frozen=True)
class LocalPressure:
    """The absolute pressure a request describes [Pa], and the local atmosphere when it took part.

    ``note`` is the caution owed when a model stands in for a barometer; ``standard_day`` is
    true when that model is the unscaled standard atmosphere, which the weather moves by a few
    percent.
    """

    value: NDArray[np.float64]
    atmosphere: NDArray[np.float64] | None = None
    note: str | None = None
    standard_day: bool = False
    source: str | None = None
    """The input the pressure is, unchanged (``pressure`` or ``barometric_pressure``), if it is one."""

    def quantity(self, inputs: Inputs, unit: Unit) -> dict[str, Any]:
        """The pressure as ``{"value", "unit"}``: an input that it is comes back as sent."""
        return inputs.echo(self.source, unit) if self.source else quantity(self.value, unit)


def local_atmosphere(inputs: Inputs) -> NDArray[np.float64] | None:
    """Absolute air pressure on site [Pa] from ``barometric_pressure`` or ``elevation``, if given."""
    baro, elevation = inputs.get("barometric_pressure"), inputs.get("elevation")
    sea_level = inputs.get("sea_level_pressure")
    if baro is not None and elevation is not None:
        raise Problem(
            400,
            "Give barometric_pressure or elevation for the local atmosphere, not both.",
            {"barometric_pressure": ["conflicts with elevation"], "elevation": ["conflicts with barometric_pressure"]},
        )
    if sea_level is not None and elevation is None:
        raise Problem(
            400,
            "sea_level_pressure scales the standard atmosphere and needs elevation.",
            {"sea_level_pressure": ["needs elevation"]},
        )
    if baro is not None:
        low, high = site.AIR_PRESSURE_RANGE
        outside = (baro < low) | (baro > high)
        hint = _unit_hint(baro, outside, inputs.units["pressure"]) if any_true(outside) else ""
        refuse_outside(
            "barometric_pressure",
            baro,
            inputs.units["pressure"],
            low,
            high,
            "{limit}, the lowest air pressure where people work (the standard atmosphere about 7,000 m up)" + hint,
            "{limit}, above the air pressure at the bottom of the deepest mines" + hint,
        )
        return baro
    if elevation is None:
        return None
    refuse_outside(
        "elevation",
        elevation,
        inputs.units["length"],
        atmosphere.MIN_ELEVATION,
        atmosphere.MAX_ELEVATION,
        "the bottom of the standard atmosphere, {limit}",
        "the top of the standard atmosphere, {limit}",
    )
    return atmosphere.pressure_at_elevation(elevation, sea_level_pressure(inputs))


def _unit_hint(values: NDArray, outside: NDArray | bool, unit: Unit) -> str:
    """For a barometer reading outside the band: the air pressures its first such number would be in the
    units it fits (two at most)."""
    number = float(unit.from_si(float(np.ravel(values)[np.flatnonzero(np.ravel(outside))[0]])))
    readings = [
        f"{format_value(pascal, unit)} in {' or '.join(u.code for u in units)}"
        for pascal, units in site.air_pressure_readings(number)
        if unit.code not in {u.code for u in units}
    ][:2]
    if not readings:
        return ""
    return f"; as a barometer reading, {number:g} would be {', or '.join(readings)}: check the unit it was sent in"


def sea_level_pressure(inputs: Inputs) -> NDArray[np.float64] | float:
    """The request's ``sea_level_pressure`` [Pa], checked for plausibility, or the standard 101 325 Pa."""
    sea_level = inputs.get("sea_level_pressure")
    if sea_level is None:
        return atmosphere.SEA_LEVEL_PRESSURE
    low, high = SEA_LEVEL_PRESSURE_RANGE
    refuse_outside(
        "sea_level_pressure",
        sea_level,
        inputs.units["pressure"],
        low,
        high,
        "the lowest plausible sea-level pressure, {limit}",
        "the highest plausible sea-level pressure, {limit}",
    )
    return sea_level


def local_pressure(inputs: Inputs) -> LocalPressure:
    """The absolute pressure [Pa]: ``pressure``, or the local atmosphere plus ``gauge_pressure``."""
    pressure, gauge = inputs.get("pressure"), inputs.get("gauge_pressure")
    site = ("barometric_pressure", "elevation", "sea_level_pressure")
    if pressure is not None:
        extra = [name for name in ("gauge_pressure", *site) if inputs.get(name) is not None]
        if extra:
            raise Problem(
                400,
                f"pressure is absolute and stands alone; leave out {', '.join(extra)} "
                "(or send gauge_pressure instead of pressure).",
                {name: ["conflicts with pressure"] for name in extra},
            )
        refuse_outside(
            "pressure",
            pressure,
            inputs.units["pressure"],
            0.0,
            None,
            "zero ({limit}): an absolute pressure is positive",
            "",
        )
        return LocalPressure(pressure, source="pressure")
    atmosphere_pressure = local_atmosphere(inputs)
    if atmosphere_pressure is None:
        field = "gauge_pressure" if gauge is not None else "pressure"
        raise Problem(
            400,
            "Give pressure (absolute), or elevation or barometric_pressure (open to the "
            "atmosphere), or gauge_pressure with barometric_pressure or elevation.",
            {field: ["missing" if field == "pressure" else "needs barometric_pressure or elevation"]},
        )
    note, standard_day = None, False
    if inputs.get("barometric_pressure") is None:
        standard_day = inputs.get("sea_level_pressure") is None
        note = STANDARD_ATMOSPHERE_WARNING if standard_day else SCALED_ATMOSPHERE_WARNING
    if gauge is None:
        source = "barometric_pressure" if inputs.get("barometric_pressure") is not None else None
        return LocalPressure(atmosphere_pressure, atmosphere_pressure, note, standard_day, source)
    refuse_outside(
        "gauge_pressure",
        gauge,
        inputs.units["pressure"],
        -atmosphere_pressure,
        None,
        "{limit}, the deepest vacuum the local atmosphere allows",
        "",
    )
    return LocalPressure(atmosphere_pressure + gauge, atmosphere_pressure, note, standard_day)


def check_boiling_pressure(fluid: Fluid, pressure: NDArray, unit: Unit, extrapolate: bool, warnings: Warnings) -> None:
    """Refuse pressures at which ``fluid`` has no boiling point; note extrapolation."""
    refuse_outside(
        "pressure",
        pressure,
        unit,
        fluid.triple_pressure,
        fluid.critical_pressure,
        f"the triple-point pressure of {fluid.name}, {{limit}}: {_below_triple(fluid)}",
        f"the critical pressure of {fluid.name}, {{limit}}: above it liquid and vapor no longer differ",
    )
    _check_stated_range(
        "pressure", pressure, unit, (fluid.p_min, fluid.p_max), fluid.pressure_limits, fluid, extrapolate, warnings
    )


def check_liquid_temperature(
    fluid: Fluid, temperature: NDArray, unit: Unit, extrapolate: bool, warnings: Warnings, field: str = "temperature"
) -> None:
    """Refuse temperatures at which ``fluid`` has no vapor pressure over its liquid; note extrapolation."""
    refuse_outside(
        field,
        temperature,
        unit,
        fluid.triple_temperature,
        fluid.critical_temperature,
        f"the triple-point temperature of {fluid.name}, {{limit}}: {_below_triple(fluid, liquid=True)}",
        f"the critical temperature of {fluid.name}, {{limit}}: above it there is no liquid",
    )
    _check_stated_range(
        field, temperature, unit, fluid.stated_range, fluid.temperature_limits, fluid, extrapolate, warnings
    )


DEPTH_ITERATIONS = 4
"""The head changes the boiling point, which changes the density: the pressure converges in 3 rounds."""


def boiling_pressure_at_depth(
    fluid: Fluid, surface: NDArray, inputs: Inputs, warnings: Warnings
) -> tuple[NDArray, LiquidDensity | None]:
    """The pressure [Pa] at ``depth`` below the surface of the boiling liquid, and the density used.

    The surface pressure plus the head of the liquid above: rho(T_sat) g depth, with the density at
    the saturation temperature of the deeper point, found by fixed-point iteration. Without ``depth``,
    the surface pressure itself.
    """
    depth = inputs.get("depth")
    if depth is None:
        return surface, None
    refuse_outside("depth", depth, inputs.units["length"], 0.0, None, "the liquid surface, {limit}", "")
    density = require_liquid_density(fluid)
    pressure = surface
    for _ in range(DEPTH_ITERATIONS):
        pressure = surface + density.density(fluid.saturation_temperature(pressure)) * STANDARD_GRAVITY * depth
    check_boiling_pressure(fluid, pressure, inputs.units["pressure"], inputs.options["extrapolate"], warnings)
    return pressure, density


def pressure_fields(
    inputs: Inputs, local: LocalPressure, unit: Unit, at_depth: NDArray | None = None
) -> dict[str, Any]:
    """The pressures an answer shows: the gauge reading as sent, the absolute pressure used, and, where the
    sensor sits at a depth (``at_depth``, the pressure there [Pa]), the pressure on the surface."""
    out: dict[str, Any] = {}
    if inputs.get("gauge_pressure") is not None:
        out["gauge_pressure"] = inputs.echo("gauge_pressure", unit)
    if at_depth is None:
        out["pressure"] = local.quantity(inputs, unit)
    else:
        out["pressure"] = quantity(at_depth, unit)
        out["surface_pressure"] = local.quantity(inputs, unit)
    return out


def temperature_uncertainty(slope: NDArray, inputs: Inputs) -> NDArray | None:
    """|dT/dp| [K/Pa] times the request's ``pressure_uncertainty`` [Pa]: the boiling point's standard
    uncertainty from the pressure reading alone [K]; None without it."""
    uncertainty = inputs.get("pressure_uncertainty")
    if uncertainty is None:
        return None
    refuse_outside("pressure_uncertainty", uncertainty, inputs.units["pressure"], 0.0, None, "zero, {limit}", "")
    return np.abs(slope) * uncertainty


def _below_triple(fluid: Fluid, liquid: bool = False) -> str:
    if fluid.lower_limit_note:
        return fluid.lower_limit_note
    return "below it the liquid freezes" if liquid else "below it the solid sublimes instead of boiling"


def _check_stated_range(
    field: str,
    values: NDArray,
    unit: Unit,
    stated: tuple[float, float],
    reach: tuple[float, float],
    fluid: Fluid,
    extrapolate: bool,
    warnings: Warnings,
) -> None:
    """Refuse values outside the equation's stated range, or with ``extrapolate`` outside its reach, and warn."""
    low, high = stated
    outside = (values < low) | (values > high)
    if not any_true(outside):
        return
    where = f"the stated range of the {fluid.method} for {fluid.name}"
    if not extrapolate:
        beyond = f"{where}, {{limit}} (send extrapolate=true to extrapolate)"
        refuse_outside(field, values, unit, low, high, beyond, beyond)
    limit = f"{{limit}}, as far as the {fluid.method} for {fluid.name} can be extrapolated"
    refuse_outside(field, values, unit, reach[0], reach[1], limit, limit)
    warnings.append(
        Caution(
            f"{field} lies outside {where}, {format_value(low, unit)} to {format_value(high, unit)}: "
            "extrapolated, accuracy unknown.",
            outside,
        )
    )


def note_near_critical(fluid: Fluid, temperature: NDArray, unit: Unit, warnings: Warnings) -> None:
    """Warn when a saturation temperature lies within 2 % of the critical temperature."""
    near = temperature > NEAR_CRITICAL * fluid.critical_temperature
    if any_true(near):
        warnings.append(
            Caution(
                f"Within 2 % of the critical temperature of {fluid.name} "
                f"({format_value(fluid.critical_temperature, unit)}): properties change steeply there and small "
                "errors in pressure or temperature grow large.",
                near,
            )
        )


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
"""The ways a request may give the pressure on a liquid; see :func:`local_pressure`."""

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


def provenance(
    fluid: Fluid | None,
    atmosphere_note: str | None,
    warnings: Warnings,
    density: LiquidDensity | None = None,
) -> dict[str, Any]:
    """``method``, ``source`` and ``warnings`` of an answer from the equations it used."""
    parts = []
    if fluid:
        parts.append((fluid.method, fluid.source))
        warnings.extend(fluid.notes)
    if density:
        parts.append((density.method, density.source))
    if atmosphere_note:
        parts.append((atmosphere.MODEL, atmosphere.SOURCE))
        warnings.append(atmosphere_note)
    return {"method": "; ".join(m for m, _ in parts), "source": "; ".join(s for _, s in parts), "warnings": warnings}


def require_liquid_density(fluid: Fluid) -> LiquidDensity:
    """The fluid's saturated-liquid density correlation; 422 when the catalog has none."""
    if fluid.liquid_density is None:
        raise Problem(
            422,
            f"The catalog has no saturated-liquid density correlation for {fluid.name}; "
            "heads of this liquid cannot be computed.",
            {"fluid": ["no liquid density correlation"]},
        )
    return fluid.liquid_density
