"""A liquid mixture of catalog fluids: its bubble and dew points by modified Raoult's law.

The activity model comes from the built-in binary pairs (:mod:`service.fluids.pairs`), or is an ideal
solution where the caller asks for one; a pair without parameters is refused, never answered as ideal.
The method's limits are data here: a low-pressure method (a warning above 0.5 MPa, a refusal above
1 MPa), every component below its critical temperature, and no pair that forms two liquid phases at the
temperature of the answer. SI throughout: temperature [K], pressure [Pa], mole fractions.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import cached_property
from typing import Literal

import numpy as np
from numpy.typing import NDArray

from service.fluids.cautions import Caution, Shown, Warnings, literal
from service.fluids.fluid import Fluid
from service.fluids.groups import GroupTable
from service.fluids.limits import Refusal, any_of, refuse_outside
from service.fluids.pairs import Activity, FittedPair, PairSet
from service.fluids.questions import Answer
from service.fluids.site_pressure import LocalPressure, PressureReadings, local_pressure
from service.fluids.two_liquids import Judge, check_two_liquids
from service.physics.activity.unifac import Unifac
from service.physics.equilibrium import ModifiedRaoult

Model = Literal["auto", "nrtl", "wilson", "uniquac", "unifac", "unifac-dortmund", "ideal"]
MODEL_NAMES = {
    "nrtl": "NRTL",
    "wilson": "Wilson",
    "uniquac": "UNIQUAC",
    "unifac": "UNIFAC",
    "unifac-dortmund": "modified UNIFAC (Dortmund)",
    "ideal": "Raoult's law",
}
WARN_PRESSURE = 0.5e6
"""Above this [Pa] an ideal vapor departs from real vapors by a few percent: a warning (common practice, no source)."""
MAX_PRESSURE = 1.0e6
"""Above this [Pa] modified Raoult's law is not answered (common practice, no source)."""

Array = NDArray[np.float64]


@dataclass(frozen=True)
class Equilibrium:
    """A bubble or dew point: the temperature [K] and pressure [Pa], the other phase's composition, gamma."""

    temperature: Array
    pressure: Array
    other: Array
    gamma: Array
    warnings: Warnings = field(default_factory=list)


@dataclass(frozen=True)
class Binary:
    """Two components of a mixture, the ``judges`` that test their liquid for two phases (a split is refused only
    where every judge predicts it, and cautioned where some do), and ``fitted``: the pair the answer uses, whose
    stated range [K] warns."""

    ids: tuple[str, str]
    judges: tuple[Judge, ...]
    fitted: FittedPair | None = None


@dataclass(frozen=True)
class Mixture:
    """Liquid mixtures of ``components`` (catalog fluids, in the request's order) under one activity model."""

    components: tuple[Fluid, ...]
    model: Literal["nrtl", "wilson", "uniquac", "unifac", "unifac-dortmund", "ideal"]
    activity: Activity | Unifac | None
    binaries: tuple[Binary, ...] = ()
    notes: tuple[str, ...] = ()
    """Cautions every answer of this mixture carries (a group prediction where fitted pairs were missing)."""
    group_table: GroupTable | None = None
    """The group-contribution table the model comes from, where it is a group method."""
    pair_set: PairSet | None = None
    """The fitted pairs the model comes from, where it is a fitted model."""

    def log_gamma(self, x: Array, temperature: Array) -> Array:
        """ln gamma (N, n) at mole fractions ``x`` (N, n) and ``temperature`` [K] (N,)."""
        return np.zeros_like(x) if self.activity is None else self.activity.log_gamma(x, temperature)

    @cached_property
    def equilibrium(self) -> ModifiedRaoult:
        lows, highs = zip(*(fluid.temperature_limits for fluid in self.components), strict=True)
        return ModifiedRaoult(
            lambda t: np.stack([fluid.saturation_pressure(t) for fluid in self.components], axis=-1),
            self._with_slopes,
            self.log_gamma,
            max(lows),
            min(highs),
        )

    def _with_slopes(self, temperature: Array) -> tuple[Array, Array]:
        pairs = [fluid.saturation_pressure_and_slope(temperature) for fluid in self.components]
        return np.stack([p for p, _ in pairs], axis=-1), np.stack([s for _, s in pairs], axis=-1)

    @property
    def citations(self) -> list[tuple[str, str]]:
        """(method, source) of the activity model and of each component's vapor-pressure equation."""
        model = []
        if self.pair_set:
            sources = "; ".join(f"{'/'.join(b.ids)}: {b.fitted.source}" for b in self.binaries if b.fitted)
            model.append((self.pair_set.method, sources))
            if self.pair_set.sizes:
                model.append(("UNIQUAC volume r and area q of each component", self.pair_set.sizes_source))
        elif self.group_table:
            model.append((self.group_table.method, self.group_table.source))
        else:
            model.append(("Raoult's law (an ideal solution)", "asked for by the request: no activity model"))
        tested: dict[str, dict[str, None]] = {}  # the judges of two liquid phases other than the model, their sources
        for binary in self.binaries:
            for judge in (j for j in binary.judges if j.name != MODEL_NAMES[self.model]):
                tested.setdefault(judge.name, {})[f"{'/'.join(binary.ids)}: {judge.source}"] = None
        model += [(f"two liquid phases tested with {name}", "; ".join(sources)) for name, sources in tested.items()]
        shared: dict[tuple[str, str], list[str]] = {}  # components citing the same equation and source, once
        for fluid in self.components:
            shared.setdefault((fluid.method, fluid.source), []).append(fluid.name)
        return [*model, *((f"{', '.join(names)}: {method}", source) for (method, source), names in shared.items())]

    def bubble_point(self, pressure: Array, x: Array) -> Equilibrium:
        """Where liquid ``x`` at ``pressure`` [Pa] starts to boil."""
        warnings = self._check_pressure(pressure)
        start = (x * np.stack([f.saturation_temperature(pressure) for f in self._boiling_at(pressure)], -1)).sum(-1)
        t, y, gamma = self.equilibrium.bubble_temperature(pressure, x, start)
        t = np.where(x.max(-1) == 1.0, start, t)  # a pure component boils exactly where its own equation says
        self._check_components(t, "pressure")
        return Equilibrium(t, pressure, y, gamma, warnings + self._check_pairs(t, x, "pressure"))

    def dew_point(self, pressure: Array, y: Array) -> Equilibrium:
        """Where vapor ``y`` at ``pressure`` [Pa] starts to condense."""
        warnings = self._check_pressure(pressure)
        start = (y * np.stack([f.saturation_temperature(pressure) for f in self._boiling_at(pressure)], -1)).sum(-1)
        t, x, gamma = self.equilibrium.dew_temperature(pressure, y, start)
        t = np.where(y.max(-1) == 1.0, start, t)
        self._check_components(t, "pressure")
        return Equilibrium(t, pressure, x, gamma, warnings + self._check_pairs(t, x, "pressure"))

    def bubble_pressure(self, temperature: Array, x: Array) -> Equilibrium:
        """The pressure [Pa] at which liquid ``x`` at ``temperature`` [K] starts to boil."""
        self._check_components(temperature, "temperature")
        warnings = self._check_pairs(temperature, x, "temperature")
        p, y, gamma = self.equilibrium.bubble_pressure(temperature, x)
        return Equilibrium(temperature, p, y, gamma, warnings + self._check_pressure(p))

    def dew_pressure(self, temperature: Array, y: Array) -> Equilibrium:
        """The pressure [Pa] at which vapor ``y`` at ``temperature`` [K] starts to condense."""
        self._check_components(temperature, "temperature")
        p, x, gamma = self.equilibrium.dew_pressure(temperature, y)
        return Equilibrium(
            temperature, p, x, gamma, self._check_pairs(temperature, x, "temperature") + self._check_pressure(p)
        )

    def _boiling_at(self, pressure: Array) -> tuple[Fluid, ...]:
        """The components, each refused where it does not boil at ``pressure`` (the start needs its boiling point)."""
        for fluid in self.components:
            low, high = fluid.pressure_limits
            name = literal(fluid.name)
            refuse_outside(
                "pressure",
                "pressure",
                pressure,
                low,
                high,
                f"{{limit}}, the lowest pressure at which {name} boils by its equation",
                f"{{limit}}, the highest pressure at which {name} boils by its equation",
            )
        return self.components

    def _check_pressure(self, pressure: Array) -> Warnings:
        """Refuse above 1 MPa; warn above 0.5 MPa."""
        refuse_outside(
            "pressure",
            "pressure",
            pressure,
            None,
            MAX_PRESSURE,
            "",
            "{limit}: modified Raoult's law (an ideal vapor) is a low-pressure method",
        )
        high = pressure > WARN_PRESSURE
        if not any_of(high):
            return []
        return [
            Caution(
                "Above 0.5 MPa the vapor departs from an ideal gas by a few percent: the answer is approximate.",
                high,
            )
        ]

    def _check_components(self, temperature: Array, field: str) -> None:
        """Refuse where a component is above its critical temperature or outside its equation's reach."""
        for fluid in self.components:
            low, high = fluid.temperature_limits
            name = literal(fluid.name)
            refuse_outside(
                field,
                "temperature",
                temperature,
                low,
                min(high, fluid.critical_temperature),
                f"{{limit}}, the lowest temperature at which the equation for {name} answers",
                f"{{limit}}, the critical temperature of {name} (or its equation's end): above it {name} is a gas "
                "that dissolves, and Raoult's law does not hold",
            )

    def _check_pairs(self, temperature: Array, liquid: Array, field: str) -> Warnings:
        """Refuse where the liquid (N, n) would be two liquid phases at ``temperature`` [K] (N,); warn where a pair's
        parameters are used outside their range."""
        warnings: Warnings = list(self.notes)
        ids = [fluid.id for fluid in self.components]
        for binary in self.binaries:
            names = " and ".join(literal(c) for c in binary.ids)
            warnings += check_two_liquids(binary.ids, binary.judges, ids, liquid, temperature, field)
            pair = binary.fitted
            if pair is None:
                continue
            outside = (temperature < pair.t_min) | (temperature > pair.t_max)
            if any_of(outside):
                warnings.append(
                    Caution(
                        f"The {MODEL_NAMES[pair.model]} parameters of {names} are used outside the temperatures they "
                        "were fitted at (about {low} to {high}): extrapolated, accuracy unknown.",
                        outside,
                        {"low": Shown(pair.t_min, "temperature"), "high": Shown(pair.t_max, "temperature")},
                    )
                )
        return warnings


Basis = Literal["mole", "mass"]


@dataclass
class PhasePoint(Answer):
    """A bubble or dew point, in the shape of the request's points: the temperature [K] and pressure [Pa], the
    other phase's composition and the K-values and activity coefficients (..., n)."""

    local: LocalPressure | None = None
    temperature: Array | None = None
    pressure: Array | None = None
    other: Array | None = None
    k_values: Array | None = None
    relative_volatility: Array | None = None
    """K1/K2, for two components."""
    gamma: Array | None = None


def phase_point(
    mix: Mixture,
    dew: bool,
    fractions: Array,
    basis: Basis,
    readings: PressureReadings | None = None,
    temperature: Array | None = None,
) -> PhasePoint:
    """Where a liquid of composition ``fractions`` (..., n) starts to boil (``dew`` False: its bubble point) or a
    vapor of that composition starts to condense (``dew`` True), at the pressure ``readings`` describe or at
    ``temperature`` [K]; compositions in ``basis``, the answer's in the same."""
    if (readings is None) == (temperature is None):
        raise Refusal(
            "Give a pressure (as /v1/boiling-point takes it) or a temperature, not both.",
            {"temperature": ["give a pressure or a temperature"]},
            400,
        )
    molar_masses = np.array([fluid.molar_mass or np.nan for fluid in mix.components])
    moles = _in_moles(_composition(fractions, len(mix.components)), basis, molar_masses)
    shape = moles.shape[:-1]
    flat = moles.reshape(-1, moles.shape[-1])
    answer = PhasePoint()
    if readings is not None:
        answer.local = local = local_pressure(readings)
        pressure = np.broadcast_to(local.value, shape).reshape(-1)
        found = (mix.dew_point if dew else mix.bubble_point)(pressure, flat)
    else:
        t = np.broadcast_to(temperature, shape).reshape(-1)
        found = (mix.dew_pressure if dew else mix.bubble_pressure)(t, flat)
    pure = np.stack([fluid.saturation_pressure(found.temperature) for fluid in mix.components], axis=-1)
    answer.temperature = found.temperature.reshape(shape)
    answer.pressure = found.pressure.reshape(shape)
    answer.gamma = found.gamma.reshape(moles.shape)
    answer.k_values = (found.gamma * pure / found.pressure[:, None]).reshape(moles.shape)
    if len(mix.components) == 2:
        answer.relative_volatility = answer.k_values[..., 0] / answer.k_values[..., 1]
    answer.other = _from_moles(found.other, basis, molar_masses).reshape(moles.shape)
    answer.warnings += found.warnings
    answer.citations += mix.citations
    answer.cite(None, air=None if answer.local is None else answer.local.note)
    return answer


def _composition(fractions: Array, count: int) -> Array:
    """The fractions, each row checked: ``count`` numbers, none negative, summing to 1 within 1e-6."""
    if fractions.shape[-1] != count:
        raise Refusal(
            f"fractions has {fractions.shape[-1]} numbers for {count} components: give one per component, in order.",
            {"fractions": ["one per component"]},
            400,
        )
    if np.any(fractions < 0.0):
        raise Refusal("A fraction is negative.", {"fractions": ["negative"]}, 400)
    sums = fractions.sum(axis=-1)
    off = np.abs(sums - 1.0) > 1e-6
    if any_of(off):
        first = float(np.ravel(sums)[np.flatnonzero(np.ravel(off))[0]])
        raise Refusal(f"fractions sum to {first:.9g}, not 1 (within 1e-6).", {"fractions": ["sum is not 1"]}, 400)
    return fractions / sums[..., None]


def _in_moles(fractions: Array, basis: Basis, molar_masses: Array) -> Array:
    if basis == "mole":
        return fractions
    moles = fractions / molar_masses
    return moles / moles.sum(axis=-1, keepdims=True)


def _from_moles(moles: Array, basis: Basis, molar_masses: Array) -> Array:
    if basis == "mole":
        return moles
    mass = moles * molar_masses
    return mass / mass.sum(axis=-1, keepdims=True)
