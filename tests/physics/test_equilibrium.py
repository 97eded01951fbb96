"""Modified Raoult's law solvers: self-consistency, with an ideal solution and with NRTL."""

from __future__ import annotations

import numpy as np

from service.physics.activity.nrtl import Nrtl
from service.physics.equilibrium import ModifiedRaoult

# Two made-up components with Antoine-like vapor pressures ln p = a - b/T [Pa] (invented for the test).
A_, B_ = np.array([23.0, 23.5]), np.array([3800.0, 4300.0])


def raoult(model: Nrtl | None) -> ModifiedRaoult:
    def pressures(t: np.ndarray) -> np.ndarray:
        return np.exp(A_ - B_ / t[..., None])

    def with_slopes(t: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        return pressures(t), pressures(t) * B_ / t[..., None] ** 2

    def log_gamma(x: np.ndarray, t: np.ndarray) -> np.ndarray:
        return np.zeros_like(x) if model is None else model.log_gamma(x, t)

    return ModifiedRaoult(pressures, with_slopes, log_gamma, 200.0, 600.0)


NRTL = Nrtl(np.zeros((2, 2)), np.array([[0.0, 150.0], [300.0, 0.0]]), np.full((2, 2), 0.3) * (1 - np.eye(2)))
X = np.array([[0.1, 0.9], [0.5, 0.5], [0.9, 0.1]])
P = np.full(3, 101_325.0)


def test_bubble_temperature_gives_back_its_pressure() -> None:
    for model in (None, NRTL):
        equilibrium = raoult(model)
        t, y, _ = equilibrium.bubble_temperature(P, X, np.full(3, 350.0))
        p, y_again, _ = equilibrium.bubble_pressure(t, X)
        np.testing.assert_allclose(p, P, rtol=1e-12)
        np.testing.assert_allclose(y.sum(-1), 1.0, rtol=1e-14)
        np.testing.assert_allclose(y_again, y, rtol=1e-12)


def test_dew_point_of_the_bubble_vapor_is_the_bubble_point() -> None:
    equilibrium = raoult(NRTL)
    t, y, _ = equilibrium.bubble_temperature(P, X, np.full(3, 350.0))
    t_dew, x_dew, _ = equilibrium.dew_temperature(P, y, np.full(3, 350.0))
    np.testing.assert_allclose(t_dew, t, atol=1e-8)
    np.testing.assert_allclose(x_dew, X, atol=1e-8)
    p_dew, x_again, _ = equilibrium.dew_pressure(t, y)
    np.testing.assert_allclose(p_dew, P, rtol=1e-10)
    np.testing.assert_allclose(x_again, X, atol=1e-8)
