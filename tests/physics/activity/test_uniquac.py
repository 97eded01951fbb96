"""UNIQUAC against published examples and the thermo package (test-only reference) for the same parameters."""

from __future__ import annotations

import numpy as np
import pytest

from service.physics.activity.uniquac import Uniquac

thermo_uniquac = pytest.importorskip("thermo.uniquac")

# Water, ethanol and benzene: r and q as ChemSep gives them, b_ij [K] of the size its sets have (made up).
R = np.array([0.92, 2.11, 3.19])
Q = np.array([1.4, 1.97, 2.4])
A = np.array([[0.0, 0.1, -0.2], [0.3, 0.0, 0.05], [-0.1, 0.2, 0.0]])
B = np.array([[0.0, -276.4, -526.0], [169.7, 0.0, -91.5], [-1325.1, 302.6, 0.0]])


@pytest.mark.parametrize("x", [[0.2, 0.5, 0.3], [0.9, 0.05, 0.05], [0.001, 0.4, 0.599]])
@pytest.mark.parametrize("temperature", [300.0, 351.45, 372.0])
def test_equals_thermo(x: list[float], temperature: float) -> None:
    # thermo 0.6 UNIQUAC: tau = exp(a + b/T), the same equation (Abrams and Prausnitz 1975); it divides by x_i.
    reference = thermo_uniquac.UNIQUAC(
        T=temperature, xs=x, rs=R.tolist(), qs=Q.tolist(), tau_as=A.tolist(), tau_bs=B.tolist()
    )
    ours = Uniquac(R, Q, A, B).log_gamma(x, temperature)
    np.testing.assert_allclose(np.exp(ours), reference.gammas(), rtol=1e-9)


def test_water_ethanol_benzene_second_phase() -> None:
    # Gmehling, Kleiber, Kolbe and Rarey, Chemical Thermodynamics for Process Simulation, 2nd ed. (2019),
    # example 5.19, the second liquid phase x = (1/6, 1/6, 2/3) at 25 degC: gamma = 8.856, 0.860, 1.425.
    b = -np.array([[0.0, 526.02, 309.64], [-318.06, 0.0, -91.532], [1325.1, 302.57, 0.0]])
    model = Uniquac(np.array([0.92, 2.1055, 3.1878]), np.array([1.4, 1.972, 2.4]), np.zeros((3, 3)), b)
    gamma = np.exp(model.log_gamma([1 / 6, 1 / 6, 2 / 3], 298.15))
    np.testing.assert_allclose(gamma, [8.856, 0.860, 1.425], rtol=6e-4)


def test_acetonitrile_benzene_heptane() -> None:
    # Poling, Prausnitz and O'Connell, The Properties of Gases and Liquids, 5th ed. (2000), problem 8.32, at
    # 45 degC: gamma = 7.15, 1.25, 1.06.
    b = np.array([[0.0, -60.28, -23.71], [-89.57, 0.0, 135.9], [-545.8, -245.4, 0.0]])
    model = Uniquac(np.array([1.87, 3.19, 5.17]), np.array([1.72, 2.4, 4.4]), np.zeros((3, 3)), b)
    gamma = np.exp(model.log_gamma([0.1311, 0.0330, 0.8359], 318.15))
    np.testing.assert_allclose(gamma, [7.15, 1.25, 1.06], atol=0.005)


def test_points_vectorised_as_one_by_one() -> None:
    x = np.array([[0.2, 0.5, 0.3], [0.6, 0.1, 0.3]])
    t = np.array([320.0, 360.0])
    model = Uniquac(R, Q, A, B)
    together = model.log_gamma(x, t)
    for i in range(2):
        np.testing.assert_allclose(together[i], model.log_gamma(x[i], t[i]), rtol=1e-15)


def test_no_interaction_and_equal_sizes_is_an_ideal_solution() -> None:
    # tau = 1 and the same r and q for all: both parts vanish (Abrams and Prausnitz 1975, the equation's form).
    model = Uniquac(np.full(3, 2.0), np.full(3, 1.8), np.zeros((3, 3)), np.zeros((3, 3)))
    np.testing.assert_allclose(model.log_gamma([0.2, 0.5, 0.3], 350.0), 0.0, atol=1e-15)


def test_a_pure_component_has_gamma_one() -> None:
    assert Uniquac(R, Q, A, B).log_gamma([1.0, 0.0, 0.0], 340.0)[0] == pytest.approx(0.0, abs=1e-14)
