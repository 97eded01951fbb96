"""Densities of aqueous solutions [kg/m3] from their published correlations.

SI in and out: temperature [K], mass fraction of solute w [kg/kg], density [kg/m3].
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Protocol

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics import water


class SolutionDensity(Protocol):
    def density(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """The solution's density [kg/m3] at ``temperature`` [K] and ``mass_fraction`` [kg/kg]."""


@dataclass(frozen=True)
class OlssonDensity:
    """Sodium hydroxide: rho = b1 + b2 t + b3 t**2 [kg/m3], t [degC], each b_i = sum_j c_ij xi**(j/2) for
    j = 0 to 5, xi the mass fraction of water (J. Olsson, A. Jernqvist and G. Aly, Int. J. Thermophysics 18
    (1997) 779-793). ``k``, ``l``, ``m``: the coefficients of b1, b2, b3."""

    k: tuple[float, ...]
    l: tuple[float, ...]  # noqa: E741 (the paper's name)
    m: tuple[float, ...]

    def density(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """The density [kg/m3].

        >>> olsson = OlssonDensity((5007.2279636, -25131.164248, 74107.692582, -104657.48684, 69821.773186,
        ...     -18145.911810), (-64.786269079, 525.34360564, -1608.4471903, 2350.9753235, -1660.9035108,
        ...     457.6437435), (0.24436776978, -1.9737722344, 6.04601497138, -8.9090614947, 6.37146769397,
        ...     -1.7816083111))
        >>> round(float(olsson.density(293.15, 0.5)))  # the Dow handbook: specific gravity 1.52 at 20 degC
        1523
        """
        polyval = np.polynomial.polynomial.polyval
        root = np.sqrt(1.0 - np.asarray(mass_fraction, dtype=float))
        t = np.asarray(temperature, dtype=float) - 273.15
        b1, b2, b3 = (polyval(root, c) for c in (self.k, self.l, self.m))
        return b1 + t * (b2 + t * b3)


@dataclass(frozen=True)
class CondeDensity:
    """Calcium chloride: rho = rho_w(T) sum_i rho_i (w / (1 - w))**i (M. R. Conde, Int. J. Thermal Sciences 43
    (2004) 367-382, eq. (5)), rho_w saturated liquid water by IAPWS 1992 eq. (2) (Conde fits his own form of it).
    ``rho``: rho_0 = 1, rho_1, ..."""

    rho: tuple[float, ...]

    def density(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """The density [kg/m3].

        >>> conde = CondeDensity((1.0, 0.836014, -0.436300, 0.105642))
        >>> round(float(conde.density(293.15, 0.3)))  # CRC Handbook: 1282 kg/m3 at 30 wt%, 20 degC (recalled)
        1284
        """
        w = np.asarray(mass_fraction, dtype=float)
        ratio = np.polynomial.polynomial.polyval(w / (1.0 - w), self.rho)
        return water.saturated_liquid_density(temperature) * ratio
