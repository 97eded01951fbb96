"""Saturated-liquid density correlations, in SI: temperature [K], density [mol/m3]."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from numpy.typing import ArrayLike, NDArray


@dataclass(frozen=True)
class Dippr105:
    """DIPPR 105 saturated-liquid density: rho = A / B**(1 + (1 - T/C)**D) [mol/m3].

    *Perry's Chemical Engineers' Handbook*, 8th ed., Table 2-32 (there with A in mol/dm3).
    With A = pc/(R Tc), B = Z_RA, C = Tc and D = 2/7 it is the Rackett equation as modified
    by Spencer and Danner (J. Chem. Eng. Data 17, 236, 1972).

    Methanol with the Perry's 8th ed. coefficients; the CRC Handbook gives 786.6 kg/m3 at
    25 degC (recalled from memory), which the correlation meets within 0.5 %:

    >>> methanol = Dippr105(a=2326.7, b=0.27073, c=512.5, d=0.24713)
    >>> round(float(methanol.molar_density(298.15)) * 0.03204216)
    790
    """

    a: float
    b: float
    c: float
    d: float

    def molar_density(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """Saturated-liquid molar density [mol/m3] at ``temperature`` [K], below C."""
        tau = 1.0 - np.asarray(temperature, dtype=float) / self.c
        return self.a / np.power(self.b, 1.0 + np.power(tau, self.d))
