"""What boils: the one interface every computing path asks its questions of.

A pure fluid (:class:`~service.fluids.fluid.Fluid`) implements it; an aqueous solution and a
liquid mixture are to implement it next. Everything is SI: temperature [K], pressure [Pa].
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass, field
from typing import Protocol

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.fluids.limits import Limits


@dataclass(frozen=True)
class LiquidDensity:
    """A saturated-liquid density correlation [kg/m3] with its stated range [K] and citation."""

    density: Callable[[ArrayLike], NDArray[np.float64]] = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str


class Boiling(Protocol):
    """A liquid that boils: its saturation line with slopes, its limits, its density and its citations."""

    @property
    def id(self) -> str:
        """The name answers carry (a catalog id, or the caller's label)."""

    @property
    def name(self) -> str:
        """The name messages use."""

    @property
    def method(self) -> str:
        """The published name of the saturation equation."""

    @property
    def source(self) -> str:
        """Where the equation and its coefficients come from."""

    @property
    def notes(self) -> tuple[str, ...]:
        """Cautions that go into the warnings of every answer."""

    @property
    def critical_temperature(self) -> float:
        """Where liquid and vapor stop differing [K]; infinity when unknown."""

    @property
    def liquid_density(self) -> LiquidDensity | None:
        """The saturated-liquid density correlation, where one is known."""

    def saturation_temperature(self, pressure: ArrayLike) -> NDArray[np.float64]:
        """Boiling point [K] at absolute ``pressure`` [Pa]."""

    def saturation_pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """Vapor pressure [Pa] at ``temperature`` [K]."""

    def saturation_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT along saturation [Pa/K] at ``temperature`` [K]."""

    @property
    def boiling_pressure_limits(self) -> Limits:
        """Where it answers a boiling point for a pressure [Pa]."""

    @property
    def liquid_temperature_limits(self) -> Limits:
        """Where it answers a vapor pressure for a liquid temperature [K]."""
