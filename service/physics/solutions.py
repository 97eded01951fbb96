"""Water over a dissolved solute: water activity, vapor pressure and boiling point of aqueous solutions.

Each published correlation gives the water activity a_w (the solution's vapor pressure over pure
water's at the same temperature, an ideal vapor assumed) in its own way; :class:`SoluteEquation`
turns that into the solution's vapor pressure p = a_w p_sat,water(T) and, by Newton's method, its
boiling point at a pressure. Pure water is the IAPWS 1992 equation (:mod:`service.physics.water`).
SI throughout: temperature T [K], mass fraction of solute w [kg/kg], pressure [Pa].
"""

from __future__ import annotations

from abc import ABC, abstractmethod
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

import numpy as np
from numpy.typing import ArrayLike, NDArray

from service.physics import water

GAS_CONSTANT = 8.314462618
"""The molar gas constant R [J/(mol K)] (CODATA 2018, exact)."""
WATER_MOLAR_MASS = 0.018015268
"""[kg/mol] (IAPWS R6-95(2018))."""
_MAX_ITERATIONS = 50
_TOLERANCE = 1e-10
"""Newton stops when every step is below this many kelvin."""
_STEP = 0.01
"""Half-width [K] of the central difference that gives d(ln a_w)/dT."""


def mole_fraction(mass_fraction: ArrayLike, molar_mass: float) -> NDArray[np.float64]:
    """Mole fraction of a solute of ``molar_mass`` [kg/mol] at ``mass_fraction`` [kg/kg] in water.

    >>> round(float(mole_fraction(0.6, 0.34229654)), 5)  # 60 wt% sucrose
    0.07317
    """
    w = np.asarray(mass_fraction, dtype=float)
    moles = w / molar_mass
    return moles / (moles + (1.0 - w) / WATER_MOLAR_MASS)


Activity = Callable[[NDArray[np.float64]], NDArray[np.float64]]
"""The water activity [-] of a solution of fixed composition, as a function of temperature [K]."""


class SolutionLine:
    """Water with a solute at one composition (per point): the solution's vapor-pressure line.

    Built once per request by :meth:`SoluteEquation.at`, so that whatever depends on the composition alone is
    computed once, not at every step of a solver.
    """

    def __init__(self, activity: Activity, mass_fraction: ArrayLike) -> None:
        self.activity = activity
        self.mass_fraction = np.asarray(mass_fraction, dtype=float)

    def water_activity(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """a_w [-] at ``temperature`` [K]; exactly 1 at zero concentration."""
        return self.activity(np.asarray(temperature, dtype=float))

    def vapor_pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """The solution's vapor pressure [Pa]: a_w times pure water's."""
        return self.water_activity(temperature) * water.saturation_pressure(temperature)

    def vapor_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT [Pa/K] at fixed concentration: p (d ln p_w/dT + d ln a_w/dT), the second by a central difference
        of :data:`_STEP`."""
        t = np.asarray(temperature, dtype=float)
        pure, p_w = water.saturation_pressure_slope(t), water.saturation_pressure(t)
        log_slope = (np.log(self.activity(t + _STEP)) - np.log(self.activity(t - _STEP))) / (2 * _STEP)
        slope = self.activity(t) * p_w * (pure / p_w + log_slope)
        return np.where(self.mass_fraction == 0.0, pure, slope)

    def boiling_temperature(self, pressure: ArrayLike, low: float = 0.0, high: float = np.inf) -> NDArray[np.float64]:
        """The temperature [K] at which the solution's vapor pressure is ``pressure`` [Pa], kept within
        [``low``, ``high``] [K] (a root beyond them ends on the bound, for the caller to refuse).

        The root of h(T) = g(T) - T, g(T) = T_w(p / a_w(T)) through pure water's inverse table: one step of
        substitution from pure water's boiling point, then the secant method on h, which a_w's slow change with
        temperature makes nearly linear (four to six steps for strong brines, each one a_w and one table
        lookup). A point at zero concentration keeps pure water's answer exactly.
        """
        p = np.asarray(pressure, dtype=float)
        pure = water.saturation_temperature(p)

        def substituted(t: NDArray[np.float64]) -> NDArray[np.float64]:
            wanted = np.clip(p / self.activity(t), water.TRIPLE_PRESSURE, water.CRITICAL_PRESSURE)
            return np.clip(water.saturation_temperature(wanted), low, high)

        before = np.clip(pure, low, high)
        now = substituted(before)
        gap_before = now - before
        active = np.ones(np.shape(now), dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            gap = substituted(now) - now
            turn = gap - gap_before
            step = np.divide(gap * (now - before), turn, out=np.array(gap, dtype=float), where=turn != 0.0)
            moved = np.clip(now - step, low, high)
            # A point stops at its own convergence, so that its answer is the same alone as in an array.
            before, gap_before = np.where(active, now, before), np.where(active, gap, gap_before)
            active &= np.abs(moved - now) > _TOLERANCE
            now = np.where(active, moved, now)
            if not active.any():
                break
        return np.where(self.mass_fraction == 0.0, pure, now)


class ShiftedLine(SolutionLine):
    """A solution that boils as pure water does ``shift`` kelvin lower: p(T) = p_w(T - shift(T))."""

    def __init__(self, shift: Activity, mass_fraction: ArrayLike) -> None:
        super().__init__(
            lambda t: water.saturation_pressure(t - shift(t)) / water.saturation_pressure(t), mass_fraction
        )
        self.shift = shift

    def vapor_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT [Pa/K] = p_w'(T - shift) (1 - d shift/dT), the last by a central difference of :data:`_STEP`."""
        t = np.asarray(temperature, dtype=float)
        rate = (self.shift(t + _STEP) - self.shift(t - _STEP)) / (2 * _STEP)
        return water.saturation_pressure_slope(t - self.shift(t)) * (1.0 - rate)

    def boiling_temperature(self, pressure: ArrayLike, low: float = 0.0, high: float = np.inf) -> NDArray[np.float64]:
        """The solution boils where T - shift(T) is pure water's boiling point, so T = T_w(p) + shift(T), which
        converges in a few steps of the shift alone (its slope is a few thousandths)."""
        pure = water.saturation_temperature(pressure)
        t = np.clip(pure, low, high)
        active = np.ones(np.shape(t), dtype=bool)
        for _ in range(_MAX_ITERATIONS):
            moved = np.clip(pure + self.shift(t), low, high)
            active &= np.abs(moved - t) > _TOLERANCE  # each point stops at its own convergence
            t = np.where(active, moved, t)
            if not active.any():
                break
        return np.where(self.mass_fraction == 0.0, pure, t)


class SoluteEquation(ABC):
    """A solute's water-activity correlation; :meth:`at` gives the solution's line at a composition."""

    @abstractmethod
    def activity(self, mass_fraction: ArrayLike) -> Activity:
        """a_w [-] as a function of temperature [K] at ``mass_fraction`` [kg/kg]; exactly 1 at zero concentration."""

    def at(self, mass_fraction: ArrayLike) -> SolutionLine:
        """The solution's vapor-pressure line at ``mass_fraction`` [kg/kg] (per point)."""
        return SolutionLine(self.activity(mass_fraction), mass_fraction)

    def water_activity(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """a_w [-] at ``temperature`` [K] and ``mass_fraction`` [kg/kg]."""
        return self.at(mass_fraction).water_activity(temperature)

    def vapor_pressure(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """The solution's vapor pressure [Pa] at ``temperature`` [K] and ``mass_fraction`` [kg/kg]."""
        return self.at(mass_fraction).vapor_pressure(temperature)

    def vapor_pressure_slope(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """dp/dT [Pa/K] at ``temperature`` [K] and fixed ``mass_fraction`` [kg/kg]."""
        return self.at(mass_fraction).vapor_pressure_slope(temperature)

    def boiling_temperature(
        self, pressure: ArrayLike, mass_fraction: ArrayLike, low: float = 0.0, high: float = np.inf
    ) -> NDArray[np.float64]:
        """The boiling point [K] at ``pressure`` [Pa] and ``mass_fraction`` [kg/kg], within [``low``, ``high``]."""
        return self.at(mass_fraction).boiling_temperature(pressure, low, high)


@dataclass(frozen=True)
class StarzakPeacock(SoluteEquation):
    """Sucrose: ln gamma_w = (Q / R T) x_s**2 (1 + b x_s + c x_s**2), a_w = gamma_w x_w (a Margules form,
    M. Starzak and S. D. Peacock, Zuckerindustrie 122 (1997) 380-387). ``energy`` Q [J/mol]."""

    energy: float
    b: float
    c: float
    molar_mass: float

    def activity(self, mass_fraction: ArrayLike) -> Activity:
        """a_w of a sucrose solution.

        >>> sucrose = StarzakPeacock(-17638.0, -1.0038, -0.24653, 0.34229654)
        >>> round(float(sucrose.boiling_temperature(101_325.0, 0.6)) - 273.15, 2)  # 60 degBx: about 102.9 degC
        102.91
        """
        x = mole_fraction(mass_fraction, self.molar_mass)
        exponent = self.energy / GAS_CONSTANT * np.square(x) * (1.0 + self.b * x + self.c * np.square(x))
        return lambda temperature: (1.0 - x) * np.exp(exponent / temperature)


@dataclass(frozen=True)
class TemperatureShift(SoluteEquation):
    """A solution that boils as pure water does ``shift`` kelvin lower: p(T, w) = p_w(T - shift(T, w)), so
    a_w = p_w(T - shift) / p_w(T). Subclasses give the shift."""

    @abstractmethod
    def shift_at(self, mass_fraction: NDArray[np.float64]) -> Activity:
        """The temperature shift [K] as a function of temperature [K] at ``mass_fraction``; zero at zero."""

    def shift(self, temperature: ArrayLike, mass_fraction: ArrayLike) -> NDArray[np.float64]:
        """The temperature shift [K] at ``temperature`` [K] and ``mass_fraction`` [kg/kg]."""
        return self.shift_at(np.asarray(mass_fraction, dtype=float))(np.asarray(temperature, dtype=float))

    def activity(self, mass_fraction: ArrayLike) -> Activity:
        return self.at(mass_fraction).activity

    def at(self, mass_fraction: ArrayLike) -> SolutionLine:
        w = np.asarray(mass_fraction, dtype=float)
        return ShiftedLine(self.shift_at(w), w)


@dataclass(frozen=True)
class Sharqawy(TemperatureShift):
    """Seawater: boiling-point elevation BPE = A S**2 + B S, S [g/kg], A = (a0 + a1 t + a2 t**2) 1e-6 and
    B = (b0 + b1 t + b2 t**2) 1e-3, t [degC] the seawater's temperature (M. H. Sharqawy, J. H. Lienhard V and
    S. M. Zubair, Desalination and Water Treatment 16 (2010) 354-380, eq. (36), fitted to L. A. Bromley et al.,
    J. Chem. Eng. Data 19 (1974) 254). ``a`` and ``b``: the three coefficients of A and of B."""

    a: tuple[float, float, float]
    b: tuple[float, float, float]

    def shift_at(self, mass_fraction: NDArray[np.float64]) -> Activity:
        """BPE [K] at the seawater's temperature [K] and salinity [kg/kg]: c0 + c1 t + c2 t**2, t [degC].

        >>> sea = Sharqawy((17.95, 0.2823, -4.584e-4), (6.56, 0.05267, 1.536e-4))
        >>> round(float(sea.shift(373.15, 0.035)), 3)  # the paper's Fig. 11: about 0.52 K
        0.519
        """
        salinity = 1000.0 * mass_fraction
        c0, c1, c2 = (a * 1e-6 * np.square(salinity) + b * 1e-3 * salinity for a, b in zip(self.a, self.b, strict=True))
        return lambda temperature: c0 + (temperature - 273.15) * (c1 + (temperature - 273.15) * c2)


@dataclass(frozen=True)
class PatekKlomfar(TemperatureShift):
    """Lithium bromide: p(T, x) = p_w(T - sum a_i x**m_i (0.4 - x)**n_i (T/Tc)**t_i), x the mole fraction of
    LiBr, Tc = 647.096 K (J. Patek and J. Klomfar, Int. J. Refrigeration 29 (2006) 566-578, eq. (1), Table 4)."""

    a: tuple[float, ...]
    m: tuple[int, ...]
    n: tuple[int, ...]
    t: tuple[int, ...]
    molar_mass: float

    def shift_at(self, mass_fraction: NDArray[np.float64]) -> Activity:
        """The sum [K], its terms grouped by their power of T/Tc.

        >>> libr = PatekKlomfar((-241.303, 19175000.0, -175521000.0, 32543000.0, 392.571, -2126.26, 185127000.0,
        ...     1912.16), (3, 4, 4, 8, 1, 1, 4, 6), (0, 5, 6, 3, 0, 2, 6, 0), (0, 0, 0, 0, 1, 1, 1, 1), 0.08685)
        >>> round(float(libr.vapor_pressure(313.15, 0.6)))  # about 0.66 kPa at 60 wt%, 40 degC
        664
        """
        x = mole_fraction(mass_fraction, self.molar_mass)
        powers: dict[int, NDArray[np.float64]] = {}
        for a, m, n, t in zip(self.a, self.m, self.n, self.t, strict=True):
            powers[t] = powers.get(t, 0.0) + a * np.power(x, m) * np.power(0.4 - x, n)

        def shift(temperature: NDArray[np.float64]) -> NDArray[np.float64]:
            reduced = temperature / water.CRITICAL_TEMPERATURE
            return sum((c * np.power(reduced, t) for t, c in powers.items()), np.zeros_like(x))

        return shift


@dataclass(frozen=True)
class Conde(SoluteEquation):
    """Calcium chloride: a_w = pi_25(w) f(w, theta), f = A + B theta, theta = T / 647.26 K,
    A = 2 - (1 + (w/pi0)**pi1)**pi2, B = (1 + (w/pi3)**pi4)**pi5 - 1,
    pi_25 = 1 - (1 + (w/pi6)**pi7)**pi8 - pi9 exp(-(w - 0.1)**2 / 0.005)
    (M. R. Conde, Int. J. Thermal Sciences 43 (2004) 367-382, eqs. (8)-(10)). ``pi``: pi0 to pi9.

    The fit's pi_25 tends to 1 - pi9 e**-2 (0.998 for CaCl2) as w goes to zero; zero concentration is pure
    water exactly.
    """

    pi: tuple[float, ...]
    reducing_temperature: float = 647.26

    def activity(self, mass_fraction: ArrayLike) -> Activity:
        """a_w of a calcium chloride solution, pi_25 A + pi_25 B theta.

        >>> cacl2 = Conde((0.31, 3.698, 0.6, 0.231, 4.584, 0.49, 0.478, -5.2, -0.4, 0.018))
        >>> round(float(cacl2.water_activity(298.15, 0.3)), 3)  # 30 wt%, 25 degC (the equation's value)
        0.645
        """
        p = self.pi
        w = np.asarray(mass_fraction, dtype=float)
        with np.errstate(divide="ignore"):  # w = 0: (0/pi6)**pi7 is infinite, and its term vanishes
            pi25 = 1.0 - np.power(1.0 + np.power(w / p[6], p[7]), p[8]) - p[9] * np.exp(-np.square(w - 0.1) / 0.005)
        big_a = 2.0 - np.power(1.0 + np.power(w / p[0], p[1]), p[2])
        big_b = np.power(1.0 + np.power(w / p[3], p[4]), p[5]) - 1.0
        zero = w == 0.0
        constant = np.where(zero, 1.0, pi25 * big_a)
        per_kelvin = np.where(zero, 0.0, pi25 * big_b / self.reducing_temperature)
        return lambda temperature: constant + per_kelvin * temperature


@dataclass(frozen=True)
class Sparrow(SoluteEquation):
    """Sodium chloride: p [MPa] = A + B t + C t**2 + D t**3 + E t**4, t [degC], each of A to E a quartic
    in the mass fraction x (B. S. Sparrow, Desalination 159 (2003) 161-170, eq. (6), 0 to 150 degC).
    a_w is that over the same equation at x = 0, so that the fit's own pure-water error cancels.
    ``rows``: the five coefficients of each of A to E, lowest power of x first."""

    rows: tuple[tuple[float, ...], ...]

    def activity(self, mass_fraction: ArrayLike) -> Activity:
        """a_w of a sodium chloride solution.

        >>> salt = Sparrow(((0.9083e-3, -0.569e-3, 0.1945e-3, -3.736e-3, 2.82e-3),
        ...     (-0.0669e-3, 0.0582e-3, -0.1668e-3, 0.6761e-3, -2.091e-3),
        ...     (7.541e-6, -5.143e-6, 6.482e-6, -52.62e-6, 115.7e-6),
        ...     (-0.0922e-6, 0.0649e-6, -0.1313e-6, 0.8024e-6, -1.986e-6),
        ...     (1.237e-9, -0.753e-9, 0.1448e-9, -6.964e-9, 14.61e-9)))
        >>> round(float(salt.boiling_temperature(101_325.0, 0.282)) - 273.15, 1)  # saturated: about 108.7 degC
        108.7
        """
        w = np.asarray(mass_fraction, dtype=float)
        solution = [np.polynomial.polynomial.polyval(w, row) for row in self.rows]
        pure = [row[0] for row in self.rows]
        return lambda temperature: _horner(solution, temperature - 273.15) / _horner(pure, temperature - 273.15)


def _horner(coefficients: list[Any], t: NDArray[np.float64]) -> NDArray[np.float64]:
    """sum(c_k t**k), lowest power first."""
    total = np.zeros_like(t) + coefficients[-1]
    for c in reversed(coefficients[:-1]):
        total = total * t + c
    return total


@dataclass(frozen=True)
class Olsson(SoluteEquation):
    """Sodium hydroxide: ln(p / kPa) = (a1 + a2 t) / (t - a3), t [degC], each a_i a polynomial in ln(xi), xi the
    mass fraction of water (J. Olsson, A. Jernqvist and G. Aly, Int. J. Thermophysics 18 (1997) 779-793, eq. (6)).
    a_w is that over the same equation at xi = 1, so that the fit's own pure-water error cancels.
    ``k``, ``l``, ``m``: the coefficients of a1, a2, a3, lowest power first."""

    k: tuple[float, ...]
    l: tuple[float, ...]  # noqa: E741 (the paper's name)
    m: tuple[float, ...]

    def activity(self, mass_fraction: ArrayLike) -> Activity:
        """a_w of a sodium hydroxide solution.

        >>> naoh = Olsson((-113.93947, 209.82305, 494.77153, 6860.8330, 2676.6433, -21740.328, -34750.872,
        ...     -20122.157, -4102.9890), (16.240074, -11.864008, -223.47305, -1650.3997, -5997.3118, -12318.744,
        ...     -15303.153, -11707.480, -5364.9554, -1338.5412, -137.96889), (-226.80157, 293.17155, 5081.8791,
        ...     36752.126, 131262.00, 259399.54, 301696.22, 208617.90, 81774.024, 15648.526, 906.29769))
        >>> round(float(naoh.boiling_temperature(101_325.0, 0.5)) - 273.15, 1)  # 50 wt%: about 145 degC (Dow)
        146.3
        """
        polyval = np.polynomial.polynomial.polyval
        log_xi = np.log1p(-np.asarray(mass_fraction, dtype=float))
        a1, a2, a3 = (polyval(log_xi, c) for c in (self.k, self.l, self.m))
        k0, l0, m0 = self.k[0], self.l[0], self.m[0]

        def activity(temperature: NDArray[np.float64]) -> NDArray[np.float64]:
            t = temperature - 273.15
            return np.exp((a1 + a2 * t) / (t - a3) - (k0 + l0 * t) / (t - m0))

        return activity
