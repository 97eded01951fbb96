"""Liquid heads and NPSH available, by hand calculation from their definitions."""

import numpy as np
import pytest

from service.physics.hydrostatics import boiling_pressure_at_depth, npsh_available
from service.physics.units import STANDARD_GRAVITY


def test_the_head_of_a_liquid_of_constant_density() -> None:
    # p = p0 + rho g h (hydrostatics; common practice, no source): 1 m of 1000 kg/m3 adds 9 806.65 Pa.
    pressure = boiling_pressure_at_depth(np.array([1e5, 2e5]), 1.0, lambda p: np.full_like(p, 1000.0))
    np.testing.assert_allclose(pressure, [1e5 + 1000 * STANDARD_GRAVITY, 2e5 + 1000 * STANDARD_GRAVITY])


def test_the_iteration_meets_a_density_that_changes_with_pressure() -> None:
    def density(p: np.ndarray) -> np.ndarray:
        return 1000.0 - 1e-4 * (p - 1e5)

    pressure = float(boiling_pressure_at_depth(1e5, 10.0, density))
    assert pressure == pytest.approx(1e5 + density(pressure) * STANDARD_GRAVITY * 10.0, abs=1e-3)


def test_npsh_available_adds_the_static_head_and_takes_the_losses() -> None:
    # ANSI/HI 9.6.1's definition (recalled from memory): 10 kPa over the vapor pressure of 1000 kg/m3 is 1.0197 m.
    npsh = npsh_available(np.array([110e3, 110e3]), 100e3, 1000.0, np.array([2.0, -1.0]), 0.5)
    np.testing.assert_allclose(npsh, [1.0197162 + 1.5, 1.0197162 - 1.5], rtol=1e-7)
