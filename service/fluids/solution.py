"""Water with a solute dissolved in it, as something that boils (:class:`~service.fluids.boiling.Boiling`).

A request gives the concentration per point, so a :class:`Solution` is built per request around
the catalog's water and a built-in :class:`~service.fluids.solutes.Solute`. SI throughout:
temperature [K], pressure [Pa], mass fraction [kg/kg]; a concentration stays in the basis the
request gives it (mass fraction, molality [mol/kg], or Brix as a mass fraction) so that refusals
show it as sent.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import cached_property
from typing import Literal

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.fluids.boiling import Boiling, LiquidDensity
from service.fluids.cautions import Caution, Warnings, literal
from service.fluids.limits import Limits, Refusal, any_of, refuse_outside
from service.fluids.solutes import Solute
from service.physics import water as water_equations
from service.physics.array_blocks import Numbers
from service.physics.solutions import SolutionLine

Basis = Literal["mass fraction", "molality", "Brix"]
"""How a request states a concentration: a mass fraction [kg/kg] (wt% and g/kg convert to it), a molality
[mol/kg], or degrees Brix (the mass percent of sucrose, as a mass fraction)."""
REACH = 10.0
"""How far [K] beyond a solute equation's stated temperature range ``extrapolate`` may take it (common practice,
no source: empirical fits in temperature go wrong fast outside their data)."""
_SOLVER_MARGIN = 0.5
"""The solver's iterates stay within this many kelvin outside the reach, so that no equation is evaluated far
out of its range (the pressures whose boiling points lie beyond the reach are refused before)."""


def solution(solute: Solute, water: Boiling, concentration: Numbers, basis: Basis) -> Solution:
    """Water with ``solute`` at ``concentration`` (in ``basis``); refused for degrees Brix of anything but
    sucrose, and for concentrations below zero or above the most the solute dissolves at any temperature."""
    if basis == "Brix" and not solute.brix:
        raise Refusal(
            f"Degrees Brix measure sucrose; give the concentration of {solute.name.lower()} in wt%, g/kg or mol/kg.",
            {"concentration_unit": ["degBx is for sucrose solutions only"]},
            400,
        )
    highest = max(solute.stated_max.highest, solute.solubility.highest if solute.solubility else 0.0)
    name = literal(solute.name.lower())
    refuse_outside(
        "concentration",
        "concentration",
        concentration,
        0.0,
        float(_in_basis(highest, basis, solute.molar_mass)),
        "zero, {limit}",
        f"{{limit}}, the most {name} that the data hold dissolved at any temperature",
    )
    return Solution(solute, water, concentration, basis)


def _in_basis(mass_fraction: ArrayLike, basis: Basis, molar_mass: float) -> NDArray[np.float64]:
    """A mass fraction [kg/kg] in ``basis``: molality m = w / (M (1 - w)), else itself."""
    w = np.asarray(mass_fraction, dtype=float)
    return w / (molar_mass * (1.0 - w)) if basis == "molality" else w


@dataclass(frozen=True)
class Solution:
    """Water with ``solute`` dissolved at ``concentration`` (per point, in ``basis``)."""

    solute: Solute
    water: Boiling = field(repr=False)
    concentration: Numbers
    basis: Basis

    @cached_property
    def mass_fraction(self) -> Numbers:
        """The concentration as a mass fraction of solute [kg/kg]: w = m M / (1 + m M) from a molality."""
        if self.basis == "molality":
            moles = self.concentration * self.solute.molar_mass
            return moles / (1.0 + moles)
        return self.concentration

    @property
    def id(self) -> str:
        return self.water.id

    @property
    def name(self) -> str:
        return f"{self.solute.name.lower()} solution"

    @property
    def method(self) -> str:
        return self.solute.method

    @property
    def source(self) -> str:
        return self.solute.source

    @property
    def notes(self) -> tuple[str, ...]:
        return (*self.water.notes, *self.solute.notes)

    @property
    def critical_temperature(self) -> float:
        return self.water.critical_temperature

    @cached_property
    def liquid_density(self) -> LiquidDensity | None:
        """The solute's density correlation at this solution's concentrations, where its data give one."""
        density = self.solute.density
        if density is None:
            return None
        w = self.mass_fraction
        return LiquidDensity(
            lambda t: density.equation.density(t, w), density.t_min, density.t_max, density.method, density.source
        )

    @property
    def boiling_pressure_limits(self) -> Limits:
        """Water's: the solution's own temperature range is checked on the boiling point found."""
        return self.water.boiling_pressure_limits

    @cached_property
    def liquid_temperature_limits(self) -> Limits:
        """Water's liquid range, within the solute equation's stated range, extrapolated at most :data:`REACH`."""
        (band,) = self.water.liquid_temperature_limits.exists
        low, high = float(band.low), float(band.high)  # type: ignore[arg-type]
        stated = max(self.solute.t_min, low), min(self.solute.t_max, high)
        reach = max(stated[0] - REACH, low), min(stated[1] + REACH, high)
        return Limits((band,), stated, reach, literal(f"the {self.method}"))

    @cached_property
    def line(self) -> SolutionLine:
        """The solution's vapor-pressure line at its concentrations, built once."""
        return self.solute.equation.at(self.mass_fraction)

    def saturation_temperature(self, pressure: ArrayLike) -> NDArray[np.float64]:
        """Boiling point [K] at ``pressure`` [Pa], the solver kept just outside the reach."""
        low, high = self.liquid_temperature_limits.reach
        return self.line.boiling_temperature(pressure, max(low - _SOLVER_MARGIN, 0.5 * low), high + _SOLVER_MARGIN)

    def saturation_pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """The solution's vapor pressure [Pa] at ``temperature`` [K]."""
        return self.line.vapor_pressure(temperature)

    def saturation_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT [Pa/K] at fixed concentration."""
        return self.line.vapor_pressure_slope(temperature)

    def check_pressure(self, pressure: Numbers, extrapolate: bool) -> Warnings:
        """Before a boiling point is sought: refuse a ``pressure`` [Pa] at which this solution would boil outside
        its equation's stated temperature range, unless extrapolated (then a caution), and always beyond the
        reach. The limits are the solution's own vapor pressures at the range's ends, per point."""
        limits = self.liquid_temperature_limits
        low, high = (self.line.vapor_pressure(t) for t in limits.stated)
        outside = (pressure < low) | (pressure > high)
        if not any_of(outside):
            return []
        where = f"where this solution boils at the {{end}} of the stated range of {limits.equation}"
        if not extrapolate:
            hint = " (send extrapolate=true to extrapolate)"
            refuse_outside(
                "pressure",
                "pressure",
                pressure,
                low,
                high,
                f"{{limit}}, {where.format(end='bottom')}{hint}",
                f"{{limit}}, {where.format(end='top')}{hint}",
            )
        reach = f"{{limit}}, where this solution boils as far as {limits.equation} can be extrapolated"
        refuse_outside(
            "pressure", "pressure", pressure, *(self.line.vapor_pressure(t) for t in limits.reach), reach, reach
        )
        return [
            Caution(
                f"pressure lies where this solution boils outside the stated range of {limits.equation}: "
                "extrapolated, accuracy unknown.",
                outside,
            )
        ]

    def check_concentration(self, temperature: Numbers, extrapolate: bool) -> Warnings:
        """Refuse a concentration above the solubility at ``temperature`` [K] (the solid crystallises) or, unless
        extrapolated, above the equation's stated range there."""
        solute, name = self.solute, literal(self.solute.name.lower())
        if solute.solubility is not None:
            refuse_outside(
                "concentration",
                "concentration",
                self.concentration,
                None,
                self._in_basis(solute.solubility.at(temperature)),
                "",
                f"{{limit}}, the solubility of {name} at this temperature: the solid crystallises out, and the "
                "saturated solution's boiling point is the highest this liquid reaches",
            )
        stated = self._in_basis(solute.stated_max.at(temperature))
        above = self.concentration > stated
        if not any_of(above):
            return []
        if not extrapolate:
            refuse_outside(
                "concentration",
                "concentration",
                self.concentration,
                None,
                stated,
                "",
                f"{{limit}}, the top of the stated range of the {literal(self.method)} at this temperature "
                "(send extrapolate=true to extrapolate)",
            )
        return [
            Caution(
                f"concentration lies above the stated range of the {literal(self.method)}: extrapolated, "
                "accuracy unknown.",
                above,
            )
        ]

    def elevation_and_activity(self, temperature: Numbers, pressure: Numbers | None = None) -> tuple[Numbers, Numbers]:
        """At a temperature [K] where the solution boils, at ``pressure`` [Pa] if known (else at its own vapor
        pressure there): how far above pure water's boiling point at that pressure [K], and the water activity
        [-] (the pressure over pure water's vapor pressure); exactly 0 and 1 at zero concentration."""
        p_w = water_equations.saturation_pressure(temperature)
        if pressure is None:
            pressure = self.line.water_activity(temperature) * p_w
        zero = self.mass_fraction == 0.0
        elevation = temperature - water_equations.saturation_temperature(pressure)
        return np.where(zero, 0.0, elevation), np.where(zero, 1.0, pressure / p_w)

    def _in_basis(self, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        return _in_basis(mass_fraction, self.basis, self.solute.molar_mass)
