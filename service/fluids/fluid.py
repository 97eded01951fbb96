"""A fluid as the service computes with it, and its saturated-liquid density.

Catalog entries (:mod:`service.fluids.catalog`) and fluids a request defines
(:mod:`service.fluids.caller_defined`) both become a :class:`Fluid`. SI throughout:
temperature [K], pressure [Pa], density [kg/m3].
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import cached_property

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.fluids.boiling import LiquidDensity
from service.fluids.cautions import literal
from service.fluids.limits import Limit, Limits
from service.physics.inverse_table import InverseTable, inverse_table
from service.physics.units import ATMOSPHERE
from service.physics.vapor_pressure import VaporPressureEquation


@dataclass(frozen=True)
class Fluid:
    """A fluid's vapor-pressure equation with its stated range [K], fixed points [K, Pa] and identity.

    A fluid that a caller defines in a request knows only its equation and range: its fixed
    points default to limits that never refuse (0 and infinity) and its identity to blanks.
    """

    id: str
    name: str
    equation: VaporPressureEquation = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str
    critical_temperature: float = math.inf
    critical_pressure: float = math.inf
    triple_temperature: float = 0.0
    triple_pressure: float = 0.0
    formula: str = ""
    cas: str = ""
    aliases: tuple[str, ...] = ()
    molar_mass: float | None = None
    normal_boiling_point: float | None = None
    """The catalog's reference value [K] (see ``constants_source``); what the equation gives is
    :attr:`boiling_point_at_one_atmosphere`."""
    constants_source: str = ""
    lower_limit_note: str | None = None
    """Why the fluid does not boil below its triple point, where that is not sublimation."""
    notes: tuple[str, ...] = ()
    """Cautions that go into the warnings of every answer from this fluid."""
    vapor_associates: str | None = None
    """Why its vapor is not an ideal gas (it associates, as carboxylic acids dimerise), where that is so."""
    liquid_density: LiquidDensity | None = None
    tabulated: bool = True
    """Answer saturation temperatures from a table (catalog fluids) or by Newton (a request's own)."""

    @cached_property
    def temperature_limits(self) -> tuple[float, float]:
        """Where the equation may answer at all [K], extrapolation included.

        From the triple point (or the equation's lower pole) to the critical temperature (or the
        reducing temperature a Wagner equation was fitted with, if lower), and never beyond half
        or twice the stated range's ends: that bounds a caller's fluid with no known fixed points.
        """
        low, high = self.equation.domain
        return max(self.triple_temperature, low, 0.5 * self.t_min), min(self.critical_temperature, high, 2 * self.t_max)

    @cached_property
    def stated_range(self) -> tuple[float, float]:
        """The equation's stated temperature range [K], within :attr:`temperature_limits`."""
        low, high = self.temperature_limits
        return max(self.t_min, low), min(self.t_max, high)

    @cached_property
    def p_min(self) -> float:
        """Saturation pressure at the lower end of the stated range [Pa].

        Where the range starts at the triple point, the catalog's triple-point pressure counts too:
        the equation may put it a rounding above the published figure (water: 611.65707 vs 611.657 Pa).
        """
        low = float(self.equation.pressure(self.stated_range[0]))
        return min(low, self.triple_pressure) if self.stated_range[0] == self.triple_temperature else low

    @cached_property
    def p_max(self) -> float:
        """Saturation pressure at the upper end of the stated range [Pa]."""
        return float(self.equation.pressure(self.stated_range[1]))

    @cached_property
    def boiling_point_at_one_atmosphere(self) -> float | None:
        """The boiling point [K] that this fluid's equation gives at 101 325 Pa, the normal boiling point as the
        service computes it; None where the fluid does not boil at 1 atm (below its triple-point pressure or
        above its critical pressure) or the equation does not reach it."""
        low, high = self.pressure_limits
        if not (self.triple_pressure < ATMOSPHERE < self.critical_pressure and low <= ATMOSPHERE <= high):
            return None
        return float(self.saturation_temperature(ATMOSPHERE))

    @cached_property
    def boiling_pressure_limits(self) -> Limits:
        """Where the fluid boils [Pa]: between its triple-point and critical pressures, within its equation's
        stated range unless extrapolated."""
        name, below = literal(self.name), literal(self._below_triple(liquid=False))
        return Limits(
            (
                Limit(
                    self.triple_pressure,
                    self.critical_pressure,
                    f"the triple-point pressure of {name}, {{limit}}: {below}",
                    f"the critical pressure of {name}, {{limit}}: above it liquid and vapor no longer differ",
                ),
            ),
            (self.p_min, self.p_max),
            self.pressure_limits,
            literal(f"the {self.method} for {self.name}"),
        )

    @cached_property
    def liquid_temperature_limits(self) -> Limits:
        """Where the fluid has a vapor pressure over its liquid [K]: between its triple and critical points,
        within its equation's stated range unless extrapolated."""
        name, below = literal(self.name), literal(self._below_triple(liquid=True))
        return Limits(
            (
                Limit(
                    self.triple_temperature,
                    self.critical_temperature,
                    f"the triple-point temperature of {name}, {{limit}}: {below}",
                    f"the critical temperature of {name}, {{limit}}: above it there is no liquid",
                ),
            ),
            self.stated_range,
            self.temperature_limits,
            literal(f"the {self.method} for {self.name}"),
        )

    def _below_triple(self, liquid: bool) -> str:
        if self.lower_limit_note:
            return self.lower_limit_note
        return "below it the liquid freezes" if liquid else "below it the solid sublimes instead of boiling"

    def saturation_pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """Vapor pressure [Pa] at ``temperature`` [K]."""
        return self.equation.pressure(temperature)

    def saturation_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT along saturation [Pa/K] at ``temperature`` [K]."""
        return self.equation.slope(temperature)

    def saturation_pressure_and_slope(self, temperature: ArrayLike) -> tuple[NDArray[np.float64], NDArray[np.float64]]:
        """Vapor pressure [Pa] and dp/dT [Pa/K] at ``temperature`` [K], evaluated together."""
        return self.equation.pressure_and_slope(temperature)

    def saturation_temperature(self, pressure: ArrayLike) -> NDArray[np.float64]:
        """Boiling point [K] at absolute ``pressure`` [Pa], within :attr:`temperature_limits`.

        Catalog fluids answer from an :class:`InverseTable` built on first use; a fluid
        defined in a request, used once, runs the Newton iteration directly.
        """
        if self.tabulated:
            return self._inverse_table(pressure)
        return self.equation.temperature(pressure, *self.temperature_limits)

    def prepare(self) -> None:
        """Compute the cached pressure limits and inverse table now instead of on first use."""
        names = (
            "p_min",
            "p_max",
            "pressure_limits",
            "boiling_pressure_limits",
            "liquid_temperature_limits",
            *(("_inverse_table",) if self.tabulated else ()),
        )
        for name in (*names, "boiling_point_at_one_atmosphere"):
            getattr(self, name)

    @cached_property
    def _inverse_table(self) -> InverseTable:
        """The saturation-temperature table, shared with :mod:`service.physics.water` for the IAPWS equation."""
        return inverse_table(self.equation, *self.temperature_limits)

    @cached_property
    def pressure_limits(self) -> tuple[float, float]:
        """Saturation pressures at :attr:`temperature_limits` [Pa]: as far as extrapolation reaches."""
        low, high = self.equation.pressure(np.array(self.temperature_limits))
        return float(low), float(high)
