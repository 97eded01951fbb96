"""Vapor-liquid equilibrium of a liquid mixture by modified Raoult's law: y_i p = x_i gamma_i p_i(T).

The vapor is an ideal gas and the liquid's non-ideality is its activity coefficients gamma_i
(:mod:`service.physics.activity`); p_i(T) is each pure component's vapor pressure. A low-pressure
method (J. M. Smith, H. C. Van Ness and M. M. Abbott, Introduction to Chemical Engineering
Thermodynamics, 7th ed., section 10.5). Vectorised over N points of n components: mole fractions
(N, n), temperatures [K] and pressures [Pa] (N,).
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

import numpy as np
from numpy.typing import NDArray

Array = NDArray[np.float64]
_MAX_ITERATIONS = 100
_TOLERANCE = 1e-10
"""Iterations stop when every temperature [K] and mole fraction changes by less than this."""
_STEP = 1e-3
"""The temperature step [K] of the forward difference that gives d(ln gamma)/dT."""


@dataclass(frozen=True)
class ModifiedRaoult:
    """``vapor_pressures(T)`` [Pa] gives (N, n) for temperatures (N,), and ``with_slopes(T)`` those and dp/dT
    [Pa/K] together; ``log_gamma(x, T)`` gives ln gamma (N, n); ``low`` and ``high`` [K] bound every temperature
    sought."""

    vapor_pressures: Callable[[Array], Array]
    with_slopes: Callable[[Array], tuple[Array, Array]]
    log_gamma: Callable[[Array, Array], Array]
    low: float
    high: float

    def bubble_pressure(self, temperature: Array, x: Array) -> tuple[Array, Array, Array]:
        """Where liquid ``x`` at ``temperature`` starts to boil: pressure [Pa], vapor y and gamma.

        Benzene and toluene as an ideal solution (Raoult's law), x = 0.5 at 365.15 K with pure vapor pressures
        143.6 and 57.8 kPa: p = 100.7 kPa, y_benzene = 0.713.

        >>> ideal = ModifiedRaoult(lambda t: np.array([[143.6e3, 57.8e3]]), None, lambda x, t: np.zeros_like(x), 0, 1e3)
        >>> p, y, _ = ideal.bubble_pressure(np.array([365.15]), np.array([[0.5, 0.5]]))
        >>> round(float(p[0])), round(float(y[0, 0]), 3)
        (100700, 0.713)
        """
        gamma = np.exp(self.log_gamma(x, temperature))
        partial = x * gamma * self.vapor_pressures(temperature)
        pressure = partial.sum(axis=-1)
        return pressure, partial / pressure[:, None], gamma

    def bubble_temperature(self, pressure: Array, x: Array, start: Array) -> tuple[Array, Array, Array]:
        """Where liquid ``x`` at ``pressure`` [Pa] starts to boil: temperature [K], vapor y and gamma.

        Newton's method on ln(sum x_i gamma_i p_i(T)) - ln p from ``start`` [K], within [low, high]; the slope
        takes in d(ln gamma)/dT by a forward difference of :data:`_STEP` K, so that the steps shrink
        quadratically (held constant, gamma's drift made them shrink only thirtyfold a step for ethanol-water).
        """
        t = np.clip(start, self.low, self.high)
        active = np.ones(t.shape, dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            log_gamma = self.log_gamma(x, t)
            drift = (self.log_gamma(x, t + _STEP) - log_gamma) / _STEP
            pure, slopes = self.with_slopes(t)
            weights = x * np.exp(log_gamma)
            total = (weights * pure).sum(axis=-1)
            step = np.log(total / pressure) * total / (weights * (slopes + pure * drift)).sum(axis=-1)
            moved = np.clip(t - step, self.low, self.high)
            active &= np.abs(moved - t) > _TOLERANCE  # each point stops at its own convergence (alone = in an array)
            t = np.where(active, moved, t)
            if not active.any():
                break
        _, y, gamma = self.bubble_pressure(t, x)
        return t, y, gamma

    def dew_pressure(self, temperature: Array, y: Array) -> tuple[Array, Array, Array]:
        """Where vapor ``y`` at ``temperature`` starts to condense: pressure [Pa], liquid x and gamma.

        1/p = sum y_i / (gamma_i p_i(T)), gamma at the liquid x_i = y_i p / (gamma_i p_i), by successive
        substitution from an ideal liquid.
        """
        pure = self.vapor_pressures(temperature)
        gamma = np.ones_like(y)
        x = y
        active = np.ones(y.shape[:-1], dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            pressure = 1.0 / (y / (gamma * pure)).sum(axis=-1)
            moved = y * pressure[:, None] / (gamma * pure)
            moved /= moved.sum(axis=-1, keepdims=True)
            active &= np.abs(moved - x).max(axis=-1) > _TOLERANCE
            x = np.where(active[:, None], moved, x)
            gamma = np.where(active[:, None], np.exp(self.log_gamma(x, temperature)), gamma)
            if not active.any():
                break
        return 1.0 / (y / (gamma * pure)).sum(axis=-1), x, gamma

    def dew_temperature(self, pressure: Array, y: Array, start: Array) -> tuple[Array, Array, Array]:
        """Where vapor ``y`` at ``pressure`` [Pa] starts to condense: temperature [K], liquid x and gamma.

        Newton's method on ln(sum y_i p / (gamma_i p_i(T))) from ``start`` [K], the liquid x and its gamma
        updated at every step, within [low, high].
        """
        t = np.clip(start, self.low, self.high)
        gamma = np.ones_like(y)
        x = y
        active = np.ones(t.shape, dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            pure, slopes = self.with_slopes(t)
            shares = y * pressure[:, None] / (gamma * pure)  # x_i before normalising
            total = shares.sum(axis=-1)
            step = np.log(total) * total / (shares * slopes / pure).sum(axis=-1)  # too little vapor: hotter
            moved = np.clip(t + step, self.low, self.high)
            liquid = shares / total[:, None]
            active &= (np.abs(moved - t) > _TOLERANCE) | (np.abs(liquid - x).max(axis=-1) > _TOLERANCE)
            t, x = np.where(active, moved, t), np.where(active[:, None], liquid, x)
            gamma = np.where(active[:, None], np.exp(self.log_gamma(x, t)), gamma)
            if not active.any():
                break
        return t, x, gamma
