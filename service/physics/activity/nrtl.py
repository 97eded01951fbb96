"""The NRTL equation (H. Renon and J. M. Prausnitz, AIChE J. 14 (1968) 135-144).

ln gamma_i = sum_j(x_j tau_ji G_ji) / sum_k(x_k G_ki)
             + sum_j [x_j G_ij / sum_k(x_k G_kj)] (tau_ij - sum_m(x_m tau_mj G_mj) / sum_k(x_k G_kj)),
G_ij = exp(-alpha_ij tau_ij), tau_ij = a_ij + b_ij / T, T [K].
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from numpy.typing import ArrayLike, NDArray


@dataclass(frozen=True)
class Nrtl:
    """NRTL with tau_ij = a_ij + b_ij / T; ``a``, ``b`` [K] and ``alpha`` are n x n (zero diagonals)."""

    a: NDArray[np.float64]
    b: NDArray[np.float64]
    alpha: NDArray[np.float64]

    def log_gamma(self, x: ArrayLike, temperature: ArrayLike) -> NDArray[np.float64]:
        """ln gamma_i [-] at mole fractions ``x`` (..., n) and ``temperature`` [K] (...).

        Ethanol (1) and water (2), the DECHEMA set as ChemSep redistributes it (b12 = -29.17 K, b21 = 624.87 K,
        alpha = 0.2937), at infinite dilution of ethanol at 351.45 K (thermo 0.6.1 gives 1.69293):

        >>> b = np.array([[0.0, -29.166654483541816], [624.8676222389441, 0.0]])
        >>> model = Nrtl(np.zeros((2, 2)), b, np.full((2, 2), 0.2937) * (1 - np.eye(2)))
        >>> [round(float(v), 3) for v in model.log_gamma([0.0, 1.0], 351.45)]
        [1.693, 0.0]
        """
        x = np.asarray(x, dtype=float)
        t = np.asarray(temperature, dtype=float)[..., None, None]
        tau = self.a + self.b / t  # (..., n, n)
        g = np.exp(-self.alpha * tau)
        xg = np.einsum("...k,...kj->...j", x, g)  # sum_k x_k G_kj
        xtg = np.einsum("...k,...kj->...j", x, tau * g)  # sum_k x_k tau_kj G_kj
        first = xtg / xg
        weight = x[..., None, :] * g / xg[..., None, :]  # x_j G_ij / sum_k x_k G_kj
        second = np.sum(weight * (tau - first[..., None, :]), axis=-1)
        return first + second
