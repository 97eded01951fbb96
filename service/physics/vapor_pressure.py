"""Vapor-pressure equations: forward p(T), slope dp/dT, and the inverse T(p).

Each form is implemented once, vectorised over numpy arrays, in SI: temperature [K],
pressure [Pa]. The inverse is a safeguarded Newton iteration on x = 1/T, where ln p is
nearly linear (Clausius-Clapeyron), kept inside a bracket that shrinks every step, so it
converges for every input whose answer lies inside the bracket.
"""

from __future__ import annotations

import math
from abc import ABC, abstractmethod
from collections.abc import Iterable, Mapping
from dataclasses import dataclass
from functools import cached_property

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics.array_blocks import in_blocks

_MAX_ITERATIONS = 60
_RELATIVE_TOLERANCE = 1e-14


class VaporPressureEquation(ABC):
    """A saturation-pressure correlation ln p(T) with its analytic slope."""

    @abstractmethod
    def ln_pressure(self, temperature: NDArray) -> NDArray:
        """ln(p [Pa]) at ``temperature`` [K]."""

    @abstractmethod
    def ln_pressure_and_slope(self, temperature: NDArray) -> tuple[NDArray, NDArray]:
        """ln(p [Pa]) and d ln p / dT [1/K] at ``temperature`` [K]."""

    @property
    @abstractmethod
    def domain(self) -> tuple[float, float]:
        """Open interval of temperatures [K] on which the expression is defined."""

    def pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """Saturation pressure [Pa] at ``temperature`` [K]."""
        return in_blocks(self._pressure, temperature)

    def slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT along the saturation curve [Pa/K] at ``temperature`` [K]."""
        return in_blocks(self._slope, temperature)

    def pressure_and_slope(self, temperature: ArrayLike) -> tuple[NDArray[np.float64], NDArray[np.float64]]:
        """Saturation pressure [Pa] and dp/dT [Pa/K] at ``temperature`` [K], from one evaluation of the series
        (a solver that needs both saves the second)."""
        ln_p, d_ln_p = self.ln_pressure_and_slope(np.asarray(temperature, dtype=float))
        pressure = np.exp(ln_p)
        return pressure, pressure * d_ln_p

    def _pressure(self, temperature: NDArray) -> NDArray:
        return np.exp(self.ln_pressure(temperature))

    def _slope(self, temperature: NDArray) -> NDArray:
        ln_p, d_ln_p = self.ln_pressure_and_slope(temperature)
        return np.exp(ln_p) * d_ln_p

    def initial_temperature(self, ln_p: NDArray, low: float, high: float) -> NDArray:
        """A first guess of T(p) [K]: the Clausius-Clapeyron chord between ``low`` and ``high``."""
        ln_lo, ln_hi = (float(v) for v in self.ln_pressure(np.array([low, high])))
        x = 1 / low + (ln_p - ln_lo) * (1 / high - 1 / low) / (ln_hi - ln_lo)
        return 1 / x

    def temperature(self, pressure: ArrayLike, low: float, high: float) -> NDArray[np.float64]:
        """Saturation temperature [K] at ``pressure`` [Pa], searched in [``low``, ``high``] [K].

        The reference inverse: a safeguarded Newton iteration, to full precision. Answers
        outside the bracket come back as the nearer end: callers check the pressure range
        first. :class:`InverseTable` gives the same answers faster.
        """
        ln_p = np.log(np.asarray(pressure, dtype=float))
        x_lo = np.full(ln_p.shape, 1 / high)
        x_hi = np.full(ln_p.shape, 1 / low)
        x = np.clip(1 / self.initial_temperature(ln_p, low, high), x_lo, x_hi)
        active = np.ones(ln_p.shape, dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            t = np.clip(1 / x, low, high)  # 1/(1/T) may round past the end of the bracket
            value, d_ln_p = self.ln_pressure_and_slope(t)
            residual = value - ln_p
            # ln p falls as x = 1/T rises: a positive residual means x is too small.
            x_lo = np.where(residual > 0, x, x_lo)
            x_hi = np.where(residual <= 0, x, x_hi)
            newton = x + residual / (d_ln_p * t * t)
            step = np.where((newton >= x_lo) & (newton <= x_hi), newton, 0.5 * (x_lo + x_hi))
            # Each point stops at its own convergence, so an array answer equals the single ones.
            moved = np.abs(step - x) > _RELATIVE_TOLERANCE * x
            x = np.where(active, step, x)
            active &= moved
            if not active.any():
                break
        return np.clip(1 / x, low, high)


@dataclass(frozen=True)
class _GappedPolynomial:
    """sum(c_i r**k_i) over whole powers k_i, kept high to low for Horner's rule over the gaps."""

    coefficients: tuple[float, ...]
    powers: tuple[int, ...]

    @classmethod
    def of(cls, terms: Iterable[tuple[int, float]]) -> _GappedPolynomial:
        """The polynomial with terms ``(power, coefficient)``; terms of one power are added up."""
        merged: dict[int, float] = {}
        for k, c in terms:
            merged[k] = merged.get(k, 0.0) + c
        powers = sorted(merged, reverse=True)
        return cls(tuple(merged[k] for k in powers), tuple(powers))

    @property
    def steps(self) -> set[int]:
        """The powers of r that Horner's rule multiplies by: the gaps, and the lowest power."""
        return ({a - b for a, b in zip(self.powers, self.powers[1:], strict=False)} | {self.powers[-1]}) - {0}

    def __call__(self, powers: Mapping[int, NDArray], like: NDArray) -> NDArray:
        """The polynomial at r, given r**k for every k in :attr:`steps`; shaped as ``like`` (r)."""
        if len(self.powers) == 1 and not self.powers[0]:
            return np.full_like(like, self.coefficients[0])
        total = self.coefficients[0]
        for c, k, k_next in zip(self.coefficients[1:], self.powers[1:], self.powers, strict=False):
            total = total * powers[k_next - k] + c
        return total * powers[self.powers[-1]] if self.powers[-1] else total


def _power_plan(needed: Iterable[int]) -> tuple[tuple[int, int, bool], ...]:
    """How to build r**k for every k in ``needed`` from r: steps (k, h, odd) with r**k = (r**h)**2 (* r if odd).

    >>> _power_plan({2, 7})
    ((2, 1, False), (3, 1, True), (7, 3, True))
    """
    wanted: set[int] = set()
    for power in needed:
        k = power
        while k > 1 and k not in wanted:
            wanted.add(k)
            k //= 2
    return tuple((k, k // 2, bool(k % 2)) for k in sorted(wanted))


@dataclass(frozen=True)
class Wagner(VaporPressureEquation):
    """Wagner-type equation: ln(p/pc) = (Tc/T) sum(a_i tau**e_i), tau = 1 - T/Tc.

    W. Wagner, Cryogenics 13, 470 (1973); the 2.5-5 and 3-6 exponent sets of
    B. E. Poling, J. M. Prausnitz, J. P. O'Connell, *The Properties of Gases and
    Liquids*, 5th ed., McGraw-Hill, 2001, eq. (7-3.3); and the IAPWS form for water
    (exponents 1, 1.5, 3, 3.5, 4, 7.5). Check values: see ``service.physics.water``.

    Exponents that are multiples of 1/2 (all published sets) are evaluated as a
    polynomial in sqrt(tau) by Horner's rule; any others by powers.
    """

    critical_temperature: float
    critical_pressure: float
    coefficients: tuple[float, ...]
    exponents: tuple[float, ...]

    @property
    def domain(self) -> tuple[float, float]:
        """Up to the reducing temperature, where tau = 0; beyond it tau**e has no real value."""
        return 0.0, self.critical_temperature

    @cached_property
    def _in_sqrt_tau(self) -> tuple[_GappedPolynomial, _GappedPolynomial, tuple[tuple[int, int, bool], ...]] | None:
        """The series and its derivative as polynomials in sqrt(tau), and how to build the powers they share.

        None if an exponent is not half-integral.
        """
        halves = [2 * e for e in self.exponents]
        if any(not math.isfinite(h) or h != round(h) or h < 2 for h in halves):
            return None
        terms = list(zip((int(h) for h in halves), self.coefficients, self.exponents, strict=True))
        series = _GappedPolynomial.of((k, a) for k, a, _ in terms)
        derivative = _GappedPolynomial.of((k - 2, a * e) for k, a, e in terms)
        return series, derivative, _power_plan(series.steps | derivative.steps)

    def _series(self, tau: NDArray, slope: bool) -> tuple[NDArray, NDArray | None]:
        plan = self._in_sqrt_tau
        if plan is None:
            series = sum(a * np.power(tau, e) for a, e in zip(self.coefficients, self.exponents, strict=True))
            d = sum(a * e * np.power(tau, e - 1) for a, e in zip(self.coefficients, self.exponents, strict=True))
            return np.asarray(series), np.asarray(d) if slope else None
        series, derivative, steps = plan
        r = np.sqrt(tau)
        powers = {1: r}
        for k, half, odd in steps:
            square = powers[half] * powers[half]
            powers[k] = square * r if odd else square
        return series(powers, r), derivative(powers, r) if slope else None

    def ln_pressure(self, temperature: NDArray) -> NDArray:
        tc = self.critical_temperature
        series, _ = self._series(1.0 - temperature / tc, slope=False)
        return math.log(self.critical_pressure) + tc / temperature * series

    def ln_pressure_and_slope(self, temperature: NDArray) -> tuple[NDArray, NDArray]:
        tc = self.critical_temperature
        series, d_series = self._series(1.0 - temperature / tc, slope=True)
        reduced = tc / temperature * series
        return math.log(self.critical_pressure) + reduced, -(reduced + d_series) / temperature


@dataclass(frozen=True)
class ExtendedAntoine(VaporPressureEquation):
    """Extended Antoine equation: ln(p [Pa]) = A + B/(T + C) + D T + E ln T + F T**G.

    With D = E = F = 0 it is the three-parameter Antoine equation (C. Antoine, C. R.
    Acad. Sci. 107, 681, 1888); with C = D = 0 it is the DIPPR 101 equation as printed in
    *Perry's Chemical Engineers' Handbook*, 8th ed., Table 2-8. Check values: see
    ``tests/physics/test_vapor_pressure.py``.
    """

    a: float
    b: float
    c: float = 0.0
    d: float = 0.0
    e: float = 0.0
    f: float = 0.0
    g: float = 0.0

    @property
    def domain(self) -> tuple[float, float]:
        """Above the pole at T = -C (and above 0 K)."""
        return max(0.0, -self.c), float("inf")

    def ln_pressure(self, temperature: NDArray) -> NDArray:
        ln_p = self.a + self.b / (temperature + self.c)
        if self.d:
            ln_p = ln_p + self.d * temperature
        if self.e:
            ln_p = ln_p + self.e * np.log(temperature)
        if self.f:
            ln_p = ln_p + self.f * np.power(temperature, self.g)
        return ln_p

    def ln_pressure_and_slope(self, temperature: NDArray) -> tuple[NDArray, NDArray]:
        shifted = temperature + self.c
        ln_p, d_ln_p = self.ln_pressure(temperature), -self.b / np.square(shifted) + self.d
        if self.e:
            d_ln_p = d_ln_p + self.e / temperature
        if self.f:
            d_ln_p = d_ln_p + self.f * self.g * np.power(temperature, self.g - 1.0)
        return ln_p, d_ln_p
