"""The Wilson equation (G. M. Wilson, J. Am. Chem. Soc. 86 (1964) 127-130).

ln gamma_i = 1 - ln(sum_j x_j Lambda_ij) - sum_k x_k Lambda_ki / sum_j x_j Lambda_kj,
Lambda_ij = exp(a_ij + b_ij / T), T [K]; in the usual form Lambda_ij = (V_j / V_i) exp(-A_ij / (R T)), so that
a_ij = ln(V_j / V_i) with the liquids' molar volumes V and b_ij = -A_ij / R.

The equation cannot describe two liquid phases: a mixture that splits needs another model's test for it.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from numpy.typing import ArrayLike, NDArray


@dataclass(frozen=True)
class Wilson:
    """Wilson with Lambda_ij = exp(a_ij + b_ij / T); ``a`` [-] and ``b`` [K] are n x n (zero diagonals)."""

    a: NDArray[np.float64]
    b: NDArray[np.float64]

    def log_gamma(self, x: ArrayLike, temperature: ArrayLike) -> NDArray[np.float64]:
        """ln gamma_i [-] at mole fractions ``x`` (..., n) and ``temperature`` [K] (...).

        2-propanol (1) and water (2) at 353.15 K and x1 = 0.25, with V = 76.92 and 18.07 cm3/mol and A12 = 437.98,
        A21 = 1238.0 cal/mol (J. M. Smith and H. C. Van Ness, Introduction to Chemical Engineering Thermodynamics,
        4th ed., 1987, as quoted in thermo's documentation: gamma = 2.1244 and 1.1904, with R = 1.987):

        >>> a = np.array([[0.0, np.log(18.07 / 76.92)], [np.log(76.92 / 18.07), 0.0]])
        >>> model = Wilson(a, -np.array([[0.0, 437.98], [1238.0, 0.0]]) / 1.987)
        >>> [round(float(v), 3) for v in np.exp(model.log_gamma([0.25, 0.75], 353.15))]
        [2.124, 1.19]
        """
        x = np.asarray(x, dtype=float)
        t = np.asarray(temperature, dtype=float)[..., None, None]
        lam = np.exp(self.a + self.b / t)  # (..., n, n)
        mixed = np.einsum("...ij,...j->...i", lam, x)  # sum_j x_j Lambda_ij
        return 1.0 - np.log(mixed) - np.einsum("...k,...ki->...i", x / mixed, lam)
