"""The questions the computing paths ask of what boils, answered in SI with warnings and citations.

Each function takes SI arrays (or single numpy values) of one shape, refuses what cannot be
answered (:mod:`service.fluids.limits`), and returns the numbers, the cautions owed and the
(method, source) pairs of every equation it used.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np
from numpy.typing import NDArray

from service.fluids.boiling import Boiling, LiquidDensity
from service.fluids.cautions import Caution, Shown, Warnings, literal
from service.fluids.limits import Refusal, any_of, check_limits, refuse_outside
from service.fluids.site_pressure import (
    LocalPressure,
    PressureReadings,
    atmosphere_caution,
    local_atmosphere,
    local_pressure,
    sea_level_pressure,
)
from service.fluids.solution import Solution
from service.physics import atmosphere, hydrostatics
from service.physics.array_blocks import Numbers

NEAR_CRITICAL = 0.98
"""Warn above this fraction of the critical temperature (common practice, no source)."""
DEFAULT_TOLERANCE = 0.1
"""Within this many kelvin of the saturation temperature a liquid counts as saturated: about the accuracy of a
good process thermometer (common practice, no source)."""
COVERAGE = 2.0
"""With a pressure uncertainty u, the saturated band widens by k u, k = 2: about 95 % coverage for a normal
distribution (JCGM 100:2008, the GUM, section 6.3)."""
ELEVATION_WARNING = (
    "The elevation is where the U.S. Standard Atmosphere 1976 has this pressure; on a real "
    "day the weather moves it by up to a few hundred metres."
)
NPSH_CAUTION = (
    "NPSH available must exceed the pump maker's NPSH required for this duty point by the margin the maker "
    "and the applicable standard call for; confirm with the maker and a licensed engineer."
)


@dataclass
class Answer:
    """What every answer carries besides its numbers: cautions, and the (method, source) of each equation."""

    warnings: Warnings = field(default_factory=list)
    citations: list[tuple[str, str]] = field(default_factory=list)
    boiling_point_elevation: Numbers | None = None
    """For a solution: how far [K] it boils above pure water at the same pressure."""
    water_activity: Numbers | None = None
    """For a solution: its vapor pressure over pure water's at the same temperature [-]."""

    def dissolved(
        self, boiling: Boiling, temperature: Numbers, extrapolate: bool, pressure: Numbers | None = None
    ) -> None:
        """For a solution, at ``temperature`` [K] (where it boils, at ``pressure`` [Pa] where that is known):
        refuse a concentration its solute equation does not answer there, and add the boiling-point elevation,
        water activity and water's citation."""
        if not isinstance(boiling, Solution):
            return
        self.warnings += boiling.check_concentration(temperature, extrapolate)
        self.boiling_point_elevation, self.water_activity = boiling.elevation_and_activity(temperature, pressure)
        self.citations.append((boiling.water.method, boiling.water.source))

    def cite(
        self, boiling: Boiling | None, density: LiquidDensity | None = None, air: str | Caution | None = None
    ) -> None:
        """Cite the equations used; the boiling liquid's own notes and the atmosphere's caution go last."""
        if boiling is not None:
            self.citations.append((boiling.method, boiling.source))
            self.warnings.extend(boiling.notes)
        if density is not None:
            self.citations.append((density.method, density.source))
        if air is not None:
            self.citations.append((atmosphere.MODEL, atmosphere.SOURCE))
            self.warnings.append(air)


@dataclass
class BoilingPoint(Answer):
    """A boiling point [K] at the pressure [Pa] the readings describe, with its slope dT/dp [K/Pa]."""

    local: LocalPressure | None = None
    pressure: Numbers | None = None
    """Where the liquid boils [Pa]: the local pressure, or the pressure at ``depth`` below its surface."""
    depth_density: LiquidDensity | None = None
    temperature: Numbers | None = None
    slope: Numbers | None = None
    uncertainty: Numbers | None = None


@dataclass
class Margin(BoilingPoint):
    """How far a liquid at ``measured`` [K] lies below its saturation temperature [K], and its state."""

    measured: Numbers | None = None
    margin: Numbers | None = None
    tolerance: float | Numbers = DEFAULT_TOLERANCE
    state: NDArray[np.str_] | None = None


@dataclass
class VaporPressure(Answer):
    """The vapor pressure [Pa] of a liquid at a temperature, and its slope dp/dT [Pa/K]."""

    pressure: Numbers | None = None
    slope: Numbers | None = None


@dataclass
class Elevation(Answer):
    """The standard-atmosphere elevation [m] of a pressure [Pa]."""

    elevation: Numbers | None = None
    pressure: Numbers | None = None


@dataclass
class Suction(Answer):
    """NPSH available [m] at a pump whose liquid surface is at the pressure the readings describe."""

    local: LocalPressure | None = None
    vapor_pressure: Numbers | None = None
    density: Numbers | None = None
    friction_loss: Numbers | None = None
    npsh: Numbers | None = None


def boiling_point(
    boiling: Boiling,
    readings: PressureReadings,
    extrapolate: bool = False,
    depth: Numbers | None = None,
    pressure_uncertainty: Numbers | None = None,
) -> BoilingPoint:
    """The boiling point at the pressure ``readings`` describe, ``depth`` [m] below the surface if given;
    with ``pressure_uncertainty`` [Pa], the boiling point's standard uncertainty from the reading alone."""
    answer = BoilingPoint()
    _find_boiling_point(answer, boiling, readings, extrapolate, depth, pressure_uncertainty)
    answer.cite(boiling, answer.depth_density, atmosphere_caution(answer.local, answer.slope))
    return answer


def saturation_margin(
    boiling: Boiling,
    readings: PressureReadings,
    measured: Numbers,
    extrapolate: bool = False,
    tolerance: float | Numbers | None = None,
    depth: Numbers | None = None,
    pressure_uncertainty: Numbers | None = None,
) -> Margin:
    """The saturation temperature minus the ``measured`` temperature [K], and the liquid's state:
    ``saturated`` within ``tolerance`` [K] (widened by k = 2 times the saturation temperature's
    uncertainty), ``subcooled`` below it, ``superheated`` above."""
    answer = Margin(measured=measured, tolerance=DEFAULT_TOLERANCE if tolerance is None else tolerance)
    _find_boiling_point(answer, boiling, readings, extrapolate, depth, pressure_uncertainty)
    band = answer.tolerance if answer.uncertainty is None else answer.tolerance + COVERAGE * answer.uncertainty
    answer.margin = margin = answer.temperature - measured
    answer.state = np.where(margin > band, "subcooled", np.where(margin < -band, "superheated", "saturated"))
    answer.cite(boiling, answer.depth_density, answer.local.note)
    return answer


def _find_boiling_point(
    answer: BoilingPoint,
    boiling: Boiling,
    readings: PressureReadings,
    extrapolate: bool,
    depth: Numbers | None,
    pressure_uncertainty: Numbers | None,
) -> None:
    """Fill in the boiling point, its slope and uncertainty at the readings' pressure (and depth)."""
    answer.local = local = local_pressure(readings)
    limits = boiling.boiling_pressure_limits
    answer.warnings += check_limits(limits, "pressure", "pressure", local.value, extrapolate)
    answer.pressure = local.value
    if depth is not None:
        refuse_outside("depth", "length", depth, 0.0, None, "the liquid surface, {limit}")
        density = answer.depth_density = required_density(boiling)
        answer.pressure = hydrostatics.boiling_pressure_at_depth(
            local.value, depth, lambda p: density.density(boiling.saturation_temperature(p))
        )
        answer.warnings += check_limits(limits, "pressure", "pressure", answer.pressure, extrapolate)
    if isinstance(boiling, Solution):  # its equation's range depends on its concentration, point by point
        answer.warnings += boiling.check_pressure(answer.pressure, extrapolate)
    answer.temperature = boiling.saturation_temperature(answer.pressure)
    answer.dissolved(boiling, answer.temperature, extrapolate, answer.pressure)
    answer.slope = 1.0 / boiling.saturation_pressure_slope(answer.temperature)
    answer.warnings += near_critical(boiling, answer.temperature)
    if pressure_uncertainty is not None:
        refuse_outside("pressure_uncertainty", "pressure", pressure_uncertainty, 0.0, None, "zero, {limit}")
        answer.uncertainty = np.abs(answer.slope) * pressure_uncertainty


def vapor_pressure(boiling: Boiling, temperature: Numbers, extrapolate: bool = False) -> VaporPressure:
    """The vapor pressure [Pa] at a liquid ``temperature`` [K], and its slope dp/dT [Pa/K]."""
    answer = VaporPressure()
    answer.warnings += check_limits(
        boiling.liquid_temperature_limits, "temperature", "temperature", temperature, extrapolate
    )
    answer.warnings += near_critical(boiling, temperature)
    answer.dissolved(boiling, temperature, extrapolate)
    answer.pressure = boiling.saturation_pressure(temperature)
    answer.slope = boiling.saturation_pressure_slope(temperature)
    answer.cite(boiling)
    return answer


def elevation(
    boiling: Boiling,
    pressure: Numbers | None = None,
    boiling_point: Numbers | None = None,
    sea_level: Numbers | None = None,
    extrapolate: bool = False,
) -> Elevation:
    """The elevation [m] where the standard atmosphere (scaled to ``sea_level`` [Pa]) has ``pressure`` [Pa],
    or where ``boiling`` boils at ``boiling_point`` [K] in an open vessel."""
    if (pressure is None) == (boiling_point is None):
        raise Refusal(
            "Give pressure, or boiling_point (with fluid), but not both.",
            {"pressure": ["give pressure or boiling_point"], "boiling_point": ["give boiling_point or pressure"]},
            400,
        )
    answer = Elevation()
    if boiling_point is not None:
        answer.warnings += check_limits(
            boiling.liquid_temperature_limits, "boiling_point", "temperature", boiling_point, extrapolate
        )
        answer.dissolved(boiling, boiling_point, extrapolate)
        pressure = boiling.saturation_pressure(boiling_point)
    sea_level = sea_level_pressure(sea_level)
    scale = sea_level / atmosphere.SEA_LEVEL_PRESSURE
    refuse_outside(
        "pressure",
        "pressure",
        pressure,
        atmosphere.PRESSURE_AT_MAX_ELEVATION * scale,
        atmosphere.PRESSURE_AT_MIN_ELEVATION * scale,
        "{limit}, the pressure at the top of the standard atmosphere (86 km)",
        "{limit}, the pressure at the bottom of the standard atmosphere (-5 km)",
    )
    answer.pressure = pressure
    answer.elevation = atmosphere.elevation_at_pressure(pressure, sea_level)
    answer.cite(boiling if boiling_point is not None else None, air=ELEVATION_WARNING)
    return answer


def npsh_available(
    boiling: Boiling,
    readings: PressureReadings,
    temperature: Numbers,
    static_head: Numbers,
    friction_loss: Numbers | None = None,
    extrapolate: bool = False,
    liquid_density: float | None = None,
) -> Suction:
    """NPSH available [m] for a liquid at ``temperature`` [K] whose surface lies ``static_head`` [m] above
    the pump suction, under the pressure the readings describe, less ``friction_loss`` [m]; the liquid's
    density from its correlation, or ``liquid_density`` [kg/m3] as the caller measured it."""
    answer = Suction()
    answer.warnings += check_limits(
        boiling.liquid_temperature_limits, "temperature", "temperature", temperature, extrapolate
    )
    answer.dissolved(boiling, temperature, extrapolate)
    density = None if liquid_density is not None else required_density(boiling, "liquid_density")
    outside = False if density is None else (temperature < density.t_min) | (temperature > density.t_max)
    if density is not None and any_of(outside):
        where = f"the stated range of the {literal(density.method)} for {literal(boiling.name)}, {{limit}}"
        if not extrapolate:
            refuse_outside("temperature", "temperature", temperature, density.t_min, density.t_max, where, where)
        answer.warnings.append(
            Caution(
                f"temperature lies outside the stated range of the {density.method}: the density is extrapolated.",
                outside,
            )
        )
    answer.local = local = local_pressure(readings)
    if friction_loss is None:
        friction_loss = np.zeros(np.shape(temperature))
    refuse_outside("friction_loss", "length", friction_loss, 0.0, None, "zero, {limit}: a loss is not negative")
    answer.friction_loss = friction_loss
    answer.vapor_pressure = vapor = boiling.saturation_pressure(temperature)
    # The caller's one density, shaped as the temperatures (a numpy scalar for one).
    answer.density = density.density(temperature) if density is not None else temperature * 0.0 + liquid_density
    answer.npsh = npsh = hydrostatics.npsh_available(local.value, vapor, answer.density, static_head, friction_loss)
    boils = local.value < vapor
    if any_of(boils):
        answer.warnings.append(
            Caution(
                "The surface pressure is below the liquid's vapor pressure: the liquid boils at the "
                "surface, and no pump suction from it is free of vapor.",
                boils,
            )
        )
    if any_of(npsh < 0):
        answer.warnings.append(
            Caution(
                "NPSH available is negative: the pressure at the suction falls below the vapor pressure, so the "
                "liquid flashes before it reaches the impeller and no pump can take it as a liquid. Raise the "
                "level or the pressure, cool the liquid, or cut the suction losses.",
                npsh < 0,
            )
        )
    answer.warnings.append(NPSH_CAUTION)
    answer.cite(boiling, density, local.note)
    return answer


def near_critical(boiling: Boiling, temperature: Numbers) -> Warnings:
    """The caution owed where a saturation temperature lies within 2 % of the critical temperature."""
    near = temperature > NEAR_CRITICAL * boiling.critical_temperature
    if not any_of(near):
        return []
    return [
        Caution(
            f"Within 2 % of the critical temperature of {literal(boiling.name)} ({{critical}}): properties change "
            "steeply there and small errors in pressure or temperature grow large.",
            near,
            {"critical": Shown(boiling.critical_temperature, "temperature")},
        )
    ]


def required_density(boiling: Boiling, instead: str | None = None) -> LiquidDensity:
    """The saturated-liquid density correlation; refused when none is known, naming the input that can
    give the density ``instead`` where there is one."""
    if boiling.liquid_density is None:
        hint = f" Give {instead}, the liquid's density in kg/m3, measured or from its supplier." if instead else ""
        raise Refusal(
            f"The catalog has no saturated-liquid density correlation for {boiling.name}; "
            f"heads of this liquid cannot be computed.{hint}",
            {instead or "fluid": ["no liquid density correlation"]},
        )
    return boiling.liquid_density


STANDARD_DAY_WARNING = (
    "Standard-day values: real air pressure departs from them with the weather by a few "
    "percent; send a station's sea_level_pressure to follow today's weather."
)


@dataclass
class Air(Answer):
    """The standard atmosphere at an elevation: pressure [Pa], temperature [K], density [kg/m3] and
    geopotential height [m]; the pressure and density scaled to a station's sea-level pressure if given."""

    pressure: Numbers | None = None
    temperature: Numbers | None = None
    density: Numbers | None = None
    geopotential_height: Numbers | None = None


def standard_air(elevation: Numbers, sea_level: Numbers | None = None) -> Air:
    """The U.S. Standard Atmosphere 1976 at ``elevation`` [m], scaled to ``sea_level`` [Pa] if given."""
    pressure = local_atmosphere(PressureReadings(elevation=elevation, sea_level_pressure=sea_level))
    scale_to = atmosphere.SEA_LEVEL_PRESSURE if sea_level is None else sea_level
    answer = Air(
        pressure=pressure,
        temperature=atmosphere.temperature_at_elevation(elevation),
        density=atmosphere.density_at_elevation(elevation, scale_to),
        geopotential_height=atmosphere.geopotential_height(elevation),
    )
    answer.citations.append((atmosphere.METHOD, atmosphere.SOURCE))
    if sea_level is None:
        answer.warnings.append(STANDARD_DAY_WARNING)
    return answer
