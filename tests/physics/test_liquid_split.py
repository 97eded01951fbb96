"""The binodal of a binary liquid against the common tangent solved independently, and its one-phase cases."""

from __future__ import annotations

import numpy as np
import pytest
from scipy.optimize import brentq

from service.physics.liquid_split import binodal


def margules(a: float):
    """The two-suffix Margules solution ln gamma_1 = A x2^2, ln gamma_2 = A x1^2 (symmetric; splits for A > 2)."""

    def log_gamma(x: np.ndarray, temperature: np.ndarray) -> np.ndarray:
        return a * np.square(x[..., ::-1]) + 0.0 * temperature[..., None]

    return log_gamma


@pytest.mark.parametrize("a", [2.2, 3.0, 4.0])
def test_symmetric_solution_matches_its_common_tangent(a: float) -> None:
    # By symmetry the two phases are x and 1 - x with equal slopes of g: ln(x / (1 - x)) + A (1 - 2x) = 0
    # (the regular-solution binodal, e.g. Prausnitz et al., Molecular Thermodynamics of Fluid-Phase Equilibria).
    x = brentq(lambda v: np.log(v / (1 - v)) + a * (1 - 2 * v), 1e-12, 0.5 - 1e-9 - np.sqrt(0.25 - 0.5 / a))
    low, high = binodal(margules(a), np.array([300.0]))
    assert low[0] == pytest.approx(x, abs=2e-3)
    assert high[0] == pytest.approx(1 - x, abs=2e-3)


@pytest.mark.parametrize("a", [0.0, 1.5, 2.0, -1.0])
def test_one_phase_where_g_is_convex(a: float) -> None:
    # A <= 2: g is convex at every composition, so the liquid never splits.
    low, high = binodal(margules(a), np.array([300.0, 350.0]))
    assert np.all(np.isnan(low)) and np.all(np.isnan(high))
