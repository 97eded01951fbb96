"""Wilson against published examples and the thermo package (test-only reference) for the same parameters."""

from __future__ import annotations

import numpy as np
import pytest

from service.physics.activity.wilson import Wilson

thermo_wilson = pytest.importorskip("thermo.wilson")

# Ethanol, water and methanol: a_ij = ln(V_j/V_i) and b_ij [K] of the kind ChemSep's Wilson sets have (made up).
A = np.array([[0.0, -0.94, -0.36], [0.94, 0.0, 0.58], [0.36, -0.58, 0.0]])
B = np.array([[0.0, -160.0, 30.0], [-480.0, 0.0, -90.0], [-55.0, -220.0, 0.0]])


@pytest.mark.parametrize("x", [[0.2, 0.5, 0.3], [0.9, 0.05, 0.05], [0.0, 0.4, 0.6]])
@pytest.mark.parametrize("temperature", [300.0, 351.45, 372.0])
def test_equals_thermo(x: list[float], temperature: float) -> None:
    # thermo 0.6 Wilson: Lambda = exp(a + b/T), the same equation (Wilson 1964).
    reference = thermo_wilson.Wilson(T=temperature, xs=x, lambda_as=A.tolist(), lambda_bs=B.tolist())
    np.testing.assert_allclose(np.exp(Wilson(A, B).log_gamma(x, temperature)), reference.gammas(), rtol=1e-9)


def test_ethanol_water_with_fixed_lambdas() -> None:
    # Ethanol (1) and water (2) at x1 = 0.252 with Lambda12 = 0.154 and Lambda21 = 0.888 (Gmehling, Kolbe,
    # Kleiber and Rarey, Chemical Thermodynamics for Process Simulation, as quoted in thermo's documentation:
    # gamma = 1.8815 and 1.1656).
    model = Wilson(np.log([[1.0, 0.154], [0.888, 1.0]]), np.zeros((2, 2)))
    np.testing.assert_allclose(np.exp(model.log_gamma([0.252, 0.748], 343.15)), [1.8815, 1.1656], atol=1e-4)


def test_points_vectorised_as_one_by_one() -> None:
    x = np.array([[0.2, 0.5, 0.3], [0.6, 0.1, 0.3]])
    t = np.array([320.0, 360.0])
    model = Wilson(A, B)
    together = model.log_gamma(x, t)
    for i in range(2):
        np.testing.assert_allclose(together[i], model.log_gamma(x[i], t[i]), rtol=1e-15)


def test_no_interaction_is_an_ideal_solution() -> None:
    # Lambda = 1 everywhere: every gamma is 1 (Raoult's law), by the equation's form.
    zeros = np.zeros((3, 3))
    np.testing.assert_allclose(Wilson(zeros, zeros).log_gamma([0.2, 0.5, 0.3], 350.0), 0.0, atol=1e-15)


def test_a_pure_component_has_gamma_one() -> None:
    # At x_i = 1: ln gamma_i = 1 - ln(1) - 1 = 0 (Wilson 1964, the equation's form).
    assert Wilson(A, B).log_gamma([1.0, 0.0, 0.0], 340.0)[0] == pytest.approx(0.0, abs=1e-15)
