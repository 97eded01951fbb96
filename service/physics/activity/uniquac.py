"""The UNIQUAC equation (D. S. Abrams and J. M. Prausnitz, AIChE J. 21 (1975) 116-128).

ln gamma_i = ln gamma_i^C + ln gamma_i^R. Combinatorial, with phi_i = r_i x_i / sum r x, theta_i = q_i x_i /
sum q x and l_i = 5 (r_i - q_i) - (r_i - 1):
ln gamma_i^C = ln(phi_i / x_i) + 5 q_i ln(theta_i / phi_i) + l_i - (phi_i / x_i) sum_j x_j l_j.
Residual: ln gamma_i^R = q_i [1 - ln(sum_j theta_j tau_ji) - sum_j theta_j tau_ij / sum_k theta_k tau_kj],
tau_ij = exp(a_ij + b_ij / T), T [K]. The pure components' r and q belong to the interaction parameters: a set
fitted with other r and q gives wrong answers.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from numpy.typing import ArrayLike, NDArray

Array = NDArray[np.float64]


def combinatorial(x: Array, r: Array, q: Array) -> Array:
    """ln gamma_i^C [-] at mole fractions ``x`` (..., n) of components of volume ``r`` and area ``q`` (n,) (the
    combinatorial part above, which UNIFAC shares); finite where x_i = 0."""
    phi_x = r / (x @ r)[..., None]  # phi_i / x_i
    theta_phi = (q / (x @ q)[..., None]) / phi_x
    ell = 5.0 * (r - q) - (r - 1.0)
    return np.log(phi_x) + 5.0 * q * np.log(theta_phi) + ell - phi_x * (x @ ell)[..., None]


@dataclass(frozen=True)
class Uniquac:
    """UNIQUAC with tau_ij = exp(a_ij + b_ij / T); ``r``, ``q`` (n,) [-]; ``a`` [-] and ``b`` [K] n x n."""

    r: Array
    q: Array
    a: Array
    b: Array

    def log_gamma(self, x: ArrayLike, temperature: ArrayLike) -> Array:
        """ln gamma_i [-] at mole fractions ``x`` (..., n) and ``temperature`` [K] (...).

        Water (1), ethanol (2) and benzene (3) at 298.15 K and x = (0.7273, 0.0909, 0.1818), r = (0.92, 2.1055,
        3.1878), q = (1.4, 1.972, 2.4), b = -(0, 526.02, 309.64; -318.06, 0, -91.532; 1325.1, 302.57, 0) K
        (J. Gmehling, M. Kleiber, B. Kolbe and J. Rarey, Chemical Thermodynamics for Process Simulation, 2nd ed.,
        2019, example 5.19, as quoted in thermo's documentation: gamma = 1.570, 0.2948 and 18.11):

        >>> b = -np.array([[0.0, 526.02, 309.64], [-318.06, 0.0, -91.532], [1325.1, 302.57, 0.0]])
        >>> model = Uniquac(np.array([0.92, 2.1055, 3.1878]), np.array([1.4, 1.972, 2.4]), np.zeros((3, 3)), b)
        >>> [float(f"{v:.4g}") for v in np.exp(model.log_gamma([0.7273, 0.0909, 0.1818], 298.15))]
        [1.57, 0.2948, 18.11]
        """
        x = np.asarray(x, dtype=float)
        t = np.asarray(temperature, dtype=float)[..., None, None]
        tau = np.exp(self.a + self.b / t)  # (..., n, n)
        area = self.q * x
        theta = area / area.sum(-1, keepdims=True)
        into = np.einsum("...j,...ji->...i", theta, tau)  # sum_j theta_j tau_ji
        back = np.einsum("...j,...ij->...i", theta / into, tau)  # sum_j theta_j tau_ij / sum_k theta_k tau_kj
        return combinatorial(x, self.r, self.q) + self.q * (1.0 - np.log(into) - back)
