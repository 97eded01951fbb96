"""NRTL against the thermo package (test-only reference) for the same parameters, and its limits."""

from __future__ import annotations

import numpy as np
import pytest

from service.physics.activity.nrtl import Nrtl

thermo_nrtl = pytest.importorskip("thermo.nrtl")

# Ethanol, water and methanol: b_ij [K] and alpha as ChemSep redistributes the DECHEMA sets (data/pairs/nrtl.toml).
B = np.array([[0.0, -29.1667, -17.855], [624.868, 0.0, -47.87], [19.01, 152.7, 0.0]])
ALPHA = np.array([[0.0, 0.2937, 0.3009], [0.2937, 0.0, 0.2999], [0.3009, 0.2999, 0.0]])
A = np.array([[0.0, 0.1, -0.2], [0.3, 0.0, 0.05], [-0.1, 0.2, 0.0]])


@pytest.mark.parametrize("x", [[0.2, 0.5, 0.3], [0.9, 0.05, 0.05], [0.0, 0.4, 0.6]])
@pytest.mark.parametrize("temperature", [300.0, 351.45, 372.0])
def test_equals_thermo(x: list[float], temperature: float) -> None:
    # thermo 0.6 NRTL: tau = a + b/T, G = exp(-alpha tau), the same equation (Renon and Prausnitz 1968).
    reference = thermo_nrtl.NRTL(T=temperature, xs=x, tau_as=A.tolist(), tau_bs=B.tolist(), alpha_cs=ALPHA.tolist())
    ours = Nrtl(A, B, ALPHA).log_gamma(x, temperature)
    np.testing.assert_allclose(np.exp(ours), reference.gammas(), rtol=1e-9)


def test_points_vectorised_as_one_by_one() -> None:
    x = np.array([[0.2, 0.5, 0.3], [0.6, 0.1, 0.3]])
    t = np.array([320.0, 360.0])
    model = Nrtl(A, B, ALPHA)
    together = model.log_gamma(x, t)
    for i in range(2):
        np.testing.assert_array_equal(together[i], model.log_gamma(x[i], t[i]))


def test_no_interaction_is_an_ideal_solution() -> None:
    # tau = 0 everywhere: every gamma is 1 (Raoult's law), by the equation's form.
    zeros = np.zeros((3, 3))
    assert np.all(Nrtl(zeros, zeros, ALPHA).log_gamma([0.2, 0.5, 0.3], 350.0) == 0.0)


def test_a_pure_component_has_gamma_one() -> None:
    # At x_i = 1 both sums vanish for component i: ln gamma_i = 0 exactly (Renon and Prausnitz 1968, eq. form).
    assert Nrtl(A, B, ALPHA).log_gamma([1.0, 0.0, 0.0], 340.0)[0] == 0.0


def test_two_components_written_out_equal_the_general_form() -> None:
    # The binary form (Renon and Prausnitz 1968) against the n-component one with a third component absent.
    model = Nrtl(A[:2, :2], B[:2, :2], ALPHA[:2, :2])
    x = np.array([[0.2, 0.8], [0.7, 0.3], [1.0, 0.0]])
    t = np.array([300.0, 340.0, 370.0])
    padded = np.concatenate([x, np.zeros((3, 1))], axis=-1)
    general = Nrtl(A * [[1, 1, 0], [1, 1, 0], [0, 0, 0]], B * [[1, 1, 0], [1, 1, 0], [0, 0, 0]], ALPHA)
    np.testing.assert_allclose(model.log_gamma(x, t), general.log_gamma(padded, t)[:, :2], rtol=1e-13, atol=1e-15)
