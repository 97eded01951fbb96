"""Liquid heads: the pressure below a liquid surface, and the net positive suction head at a pump.

SI throughout: pressure [Pa], density [kg/m3], lengths and heads [m], with the standard
acceleration of gravity g = 9.80665 m/s2 (CGPM 1901).
"""

from __future__ import annotations

from collections.abc import Callable

import numpy as np
from numpy.typing import NDArray

from service.physics.units import STANDARD_GRAVITY

DEPTH_ITERATIONS = 4
"""The head changes the boiling point, which changes the density: the pressure converges in 3 rounds."""


def boiling_pressure_at_depth(
    surface: NDArray | float, depth: NDArray | float, density_at_boiling: Callable[[NDArray], NDArray]
) -> NDArray[np.float64]:
    """The pressure [Pa] at ``depth`` [m] below the surface of a boiling liquid at ``surface`` [Pa].

    p = p_surface + rho(p) g depth, with ``density_at_boiling(p)`` the liquid's density [kg/m3] at its
    saturation temperature at p, by fixed-point iteration: the density changes by well under 1 % over
    the head, so each round gains about two digits.

    Water at 100 kPa and 2 m, at a constant 958.4 kg/m3 (the saturated liquid at 100 degC, IAPWS), adds
    958.4 * 9.80665 * 2 = 18 797 Pa (hand calculation):

    >>> round(float(boiling_pressure_at_depth(100e3, 2.0, lambda p: np.full_like(p, 958.4))))
    118797
    """
    pressure = surface
    for _ in range(DEPTH_ITERATIONS):
        pressure = surface + density_at_boiling(pressure) * STANDARD_GRAVITY * depth
    return pressure


def npsh_available(
    surface: NDArray | float,
    vapor: NDArray | float,
    density: NDArray | float,
    static_head: NDArray | float,
    friction_loss: NDArray | float,
) -> NDArray[np.float64]:
    """Net positive suction head available [m]: (p_surface - p_vapor) / (rho g) + static_head - friction_loss.

    The definition in ANSI/HI 9.6.1 (Hydraulic Institute, recalled from memory). Cold water (20 degC:
    vapor pressure 2.339 kPa, 998.2 kg/m3) open to 101.325 kPa at the suction's level has about 10.1 m,
    the familiar 10.3 m water column less its vapor pressure (common practice, no source):

    >>> round(float(npsh_available(101_325.0, 2_339.0, 998.2, 0.0, 0.0)), 2)
    10.11
    """
    return (surface - vapor) / (density * STANDARD_GRAVITY) + static_head - friction_loss
