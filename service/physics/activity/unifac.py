"""The UNIFAC group-contribution method (A. Fredenslund, R. L. Jones and J. M. Prausnitz, AIChE J. 21 (1975)
1086-1099), as the original UNIFAC tables use it (H. K. Hansen et al., Ind. Eng. Chem. Res. 30 (1991) 2352).

ln gamma_i = ln gamma_i^C + ln gamma_i^R. Combinatorial: UNIQUAC's (:func:`~service.physics.activity.uniquac.
combinatorial`), with r_i = sum_k nu_ki R_k and q_i = sum_k nu_ki Q_k.
Residual: ln gamma_i^R = sum_k nu_ki (ln Gamma_k - ln Gamma_k^(i)), with, for group fractions X_m and
Theta_m = Q_m X_m / sum Q X, ln Gamma_k = Q_k [1 - ln(sum_m Theta_m psi_mk) - sum_m Theta_m psi_km / sum_n
Theta_n psi_nm], psi_mn = exp(-a_mn / T); Gamma_k^(i) the same in pure component i.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics.activity.uniquac import combinatorial

Array = NDArray[np.float64]


@dataclass(frozen=True)
class Unifac:
    """``counts``: subgroups per component (n, G); ``r`` and ``q``: the subgroups' volume and area (G,);
    ``a``: the interaction parameters between subgroups (G, G) [K], those of their main groups."""

    counts: Array
    r: Array
    q: Array
    a: Array

    def log_gamma(self, x: ArrayLike, temperature: ArrayLike) -> Array:
        """ln gamma_i [-] at mole fractions ``x`` (..., n) and ``temperature`` [K] (...).

        Ethanol (CH3, CH2, OH) and water (H2O) at x = (0.3, 0.7) and 351.45 K; thermo 0.6.1's UNIFAC
        (version 0) gives 0.510073 and 0.200861:

        >>> model = Unifac(np.array([[1, 1, 1, 0], [0, 0, 0, 1.0]]), np.array([0.9011, 0.6744, 1.0, 0.92]),
        ...     np.array([0.848, 0.54, 1.2, 1.4]), np.array([[0, 0, 986.5, 1318.0], [0, 0, 986.5, 1318.0],
        ...     [156.4, 156.4, 0, 353.5], [300.0, 300.0, -229.1, 0]]))
        >>> [round(float(v), 6) for v in model.log_gamma([0.3, 0.7], 351.45)]
        [0.510073, 0.200861]
        """
        x = np.asarray(x, dtype=float)
        t = np.asarray(temperature, dtype=float)
        psi = self._psi(t[..., None, None])  # (..., G, G)
        groups = x @ self.counts
        mixture = self._group_log_gamma(groups / groups.sum(-1, keepdims=True), psi)  # (..., G)
        pure = self.counts / self.counts.sum(-1, keepdims=True)  # (n, G)
        alone = self._group_log_gamma(pure, psi[..., None, :, :])  # (..., n, G)
        residual = np.sum(self.counts * (mixture[..., None, :] - alone), axis=-1)
        return self._combinatorial(x) + residual

    def _psi(self, temperature: Array) -> Array:
        return np.exp(-self.a / temperature)

    def _combinatorial(self, x: Array) -> Array:
        return combinatorial(x, self.counts @ self.r, self.counts @ self.q)

    def _group_log_gamma(self, fractions: Array, psi: Array) -> Array:
        """ln Gamma_k for group fractions (..., G) and psi (..., G, G)."""
        area = self.q * fractions
        theta = area / area.sum(-1, keepdims=True)
        into = np.einsum("...m,...mk->...k", theta, psi)  # sum_m Theta_m psi_mk
        back = np.einsum("...m,...km->...k", theta / into, psi)  # sum_m Theta_m psi_km / sum_n Theta_n psi_nm
        return self.q * (1.0 - np.log(into) - back)


@dataclass(frozen=True)
class ModifiedUnifac(Unifac):
    """Modified UNIFAC (Dortmund) (U. Weidlich and J. Gmehling, Ind. Eng. Chem. Res. 26 (1987) 1372-1381):
    psi_mn = exp(-(a_mn + b_mn T + c_mn T**2) / T) with ``b`` [-] and ``c`` [1/K] beside ``a`` [K], and the
    combinatorial part ln gamma_i^C = 1 - V'_i + ln V'_i - 5 q_i (1 - V_i/F_i + ln(V_i/F_i)), V'_i = r_i**(3/4) /
    sum x r**(3/4), V_i = r_i / sum x r, F_i = q_i / sum x q.

    Ethanol (CH3, CH2, OH(P)) and water at x = (0.3, 0.7) and 351.45 K; thermo 0.6.1's UNIFAC (version 1, the
    2016 parameters) gives 0.533842 and 0.182079:

    >>> model = ModifiedUnifac(np.array([[1, 1, 1, 0], [0, 0, 0, 1.0]]), np.array([0.6325, 0.6325, 1.2302, 1.7334]),
    ...     np.array([1.0608, 0.7081, 0.8927, 2.4561]), np.array([[0, 0, 2777.0, 1391.3], [0, 0, 2777.0, 1391.3],
    ...     [1606.0, 1606.0, 0, -801.9], [-17.253, -17.253, 1460.0, 0]]), np.array([[0, 0, -4.674, -3.6156],
    ...     [0, 0, -4.674, -3.6156], [-4.746, -4.746, 0, 3.824], [0.8389, 0.8389, -8.673, 0]]),
    ...     np.array([[0, 0, 0.001551, 0.001144], [0, 0, 0.001551, 0.001144], [0.0009181, 0.0009181, 0, -0.007514],
    ...     [0.0009021, 0.0009021, 0.01641, 0]]))
    >>> [round(float(v), 6) for v in model.log_gamma([0.3, 0.7], 351.45)]
    [0.533842, 0.182079]
    """

    b: Array = field(default_factory=lambda: np.zeros((0, 0)))
    c: Array = field(default_factory=lambda: np.zeros((0, 0)))

    def _psi(self, temperature: Array) -> Array:
        return np.exp(-(self.a + self.b * temperature + self.c * np.square(temperature)) / temperature)

    def _combinatorial(self, x: Array) -> Array:
        r_i, q_i = self.counts @ self.r, self.counts @ self.q
        r34 = np.power(r_i, 0.75)
        v_prime = r34 / (x @ r34)[..., None]
        v = r_i / (x @ r_i)[..., None]
        f = q_i / (x @ q_i)[..., None]
        return 1.0 - v_prime + np.log(v_prime) - 5.0 * q_i * (1.0 - v / f + np.log(v / f))
