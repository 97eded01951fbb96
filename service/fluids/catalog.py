"""Load, validate and look up the fluid catalog.

The built-in entries live in ``data/*.toml`` beside this module; every entry is checked
by :class:`~service.fluids.schema.FluidEntrySchema` and turned into a :class:`Fluid`
whose vapor-pressure equation comes from :mod:`service.physics.correlations`.
"""

from __future__ import annotations

import difflib
import math
import tomllib
from collections.abc import Callable, Iterable, Mapping
from dataclasses import dataclass, field
from functools import cached_property
from pathlib import Path
from typing import Any

import numpy as np
from marshmallow import ValidationError
from numpy.typing import ArrayLike, NDArray

from service.fluids.schema import FluidEntrySchema
from service.physics import water
from service.physics.correlations import (
    Dippr105,
    ExtendedAntoine,
    InverseTable,
    VaporPressureEquation,
    Wagner,
    inverse_table,
)
from service.physics.units import ATMOSPHERE, resolve_unit

DATA_DIR = Path(__file__).with_name("data")


class CatalogError(ValueError):
    """A catalog file that cannot be loaded; the message names file, entry and field."""


@dataclass(frozen=True)
class LiquidDensity:
    """A saturated-liquid density correlation [kg/m3] with its stated range [K] and citation."""

    density: Callable[[ArrayLike], NDArray[np.float64]] = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str


def density_from_entry(table: Mapping[str, Any], molar_mass: float) -> LiquidDensity:
    """Build the density correlation of a validated ``liquid_density`` table."""
    if table["form"] == "iapws-1992":
        density = water.saturated_liquid_density
    else:
        # The catalog prints A in kmol/m3 as Perry's does; the physics takes mol/m3.
        equation = Dippr105(a=table["A"] * 1e3, b=table["B"], c=table["C"], d=table["D"])

        def density(temperature: ArrayLike) -> NDArray[np.float64]:
            return equation.molar_density(temperature) * molar_mass

    return LiquidDensity(density, table["t_min"], table["t_max"], table["method"], table["source"])


@dataclass(frozen=True)
class Fluid:
    """A fluid's vapor-pressure equation with its stated range [K], fixed points [K, Pa] and identity.

    A fluid that a caller defines in a request knows only its equation and range: its fixed
    points default to limits that never refuse (0 and infinity) and its identity to blanks.
    """

    id: str
    name: str
    equation: VaporPressureEquation = field(repr=False)
    t_min: float
    t_max: float
    method: str
    source: str
    critical_temperature: float = math.inf
    critical_pressure: float = math.inf
    triple_temperature: float = 0.0
    triple_pressure: float = 0.0
    formula: str = ""
    cas: str = ""
    aliases: tuple[str, ...] = ()
    molar_mass: float | None = None
    normal_boiling_point: float | None = None
    """The catalog's reference value [K] (see ``constants_source``); what the equation gives is
    :attr:`boiling_point_at_one_atmosphere`."""
    constants_source: str = ""
    lower_limit_note: str | None = None
    """Why the fluid does not boil below its triple point, where that is not sublimation."""
    notes: tuple[str, ...] = ()
    """Cautions that go into the warnings of every answer from this fluid."""
    liquid_density: LiquidDensity | None = None
    tabulated: bool = True
    """Answer saturation temperatures from a table (catalog fluids) or by Newton (a request's own)."""

    @cached_property
    def temperature_limits(self) -> tuple[float, float]:
        """Where the equation may answer at all [K], extrapolation included.

        From the triple point (or the equation's lower pole) to the critical temperature (or the
        reducing temperature a Wagner equation was fitted with, if lower), and never beyond half
        or twice the stated range's ends: that bounds a caller's fluid with no known fixed points.
        """
        low, high = self.equation.domain
        return max(self.triple_temperature, low, 0.5 * self.t_min), min(self.critical_temperature, high, 2 * self.t_max)

    @cached_property
    def stated_range(self) -> tuple[float, float]:
        """The equation's stated temperature range [K], within :attr:`temperature_limits`."""
        low, high = self.temperature_limits
        return max(self.t_min, low), min(self.t_max, high)

    @cached_property
    def p_min(self) -> float:
        """Saturation pressure at the lower end of the stated range [Pa].

        Where the range starts at the triple point, the catalog's triple-point pressure counts too:
        the equation may put it a rounding above the published figure (water: 611.65707 vs 611.657 Pa).
        """
        low = float(self.equation.pressure(self.stated_range[0]))
        return min(low, self.triple_pressure) if self.stated_range[0] == self.triple_temperature else low

    @cached_property
    def p_max(self) -> float:
        """Saturation pressure at the upper end of the stated range [Pa]."""
        return float(self.equation.pressure(self.stated_range[1]))

    @cached_property
    def boiling_point_at_one_atmosphere(self) -> float | None:
        """The boiling point [K] that this fluid's equation gives at 101 325 Pa, the normal boiling point as the
        service computes it; None where the fluid does not boil at 1 atm (below its triple-point pressure or
        above its critical pressure) or the equation does not reach it."""
        low, high = self.pressure_limits
        if not (self.triple_pressure < ATMOSPHERE < self.critical_pressure and low <= ATMOSPHERE <= high):
            return None
        return float(self.saturation_temperature(ATMOSPHERE))

    def saturation_pressure(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """Vapor pressure [Pa] at ``temperature`` [K]."""
        return self.equation.pressure(temperature)

    def saturation_pressure_slope(self, temperature: ArrayLike) -> NDArray[np.float64]:
        """dp/dT along saturation [Pa/K] at ``temperature`` [K]."""
        return self.equation.slope(temperature)

    def saturation_temperature(self, pressure: ArrayLike) -> NDArray[np.float64]:
        """Boiling point [K] at absolute ``pressure`` [Pa], within :attr:`temperature_limits`.

        Catalog fluids answer from an :class:`InverseTable` built on first use; a fluid
        defined in a request, used once, runs the Newton iteration directly.
        """
        if self.tabulated:
            return self._inverse_table(pressure)
        return self.equation.temperature(pressure, *self.temperature_limits)

    def prepare(self) -> None:
        """Compute the cached pressure limits and inverse table now instead of on first use."""
        names = ("p_min", "p_max", "pressure_limits", *(("_inverse_table",) if self.tabulated else ()))
        for name in (*names, "boiling_point_at_one_atmosphere"):
            getattr(self, name)

    @cached_property
    def _inverse_table(self) -> InverseTable:
        """The saturation-temperature table, shared with :mod:`service.physics.water` for the IAPWS equation."""
        return inverse_table(self.equation, *self.temperature_limits)

    @cached_property
    def pressure_limits(self) -> tuple[float, float]:
        """Saturation pressures at :attr:`temperature_limits` [Pa]: as far as extrapolation reaches."""
        low, high = self.equation.pressure(np.array(self.temperature_limits))
        return float(low), float(high)


def equation_from_entry(
    vp: Mapping[str, Any], critical_temperature: float, critical_pressure: float
) -> VaporPressureEquation:
    """Build the physics object for a validated ``vapor_pressure`` table (SI coefficients)."""
    form = vp["form"]
    if form == "iapws-1992":
        return water.SATURATION
    if form == "wagner":
        return Wagner(
            critical_temperature=vp.get("reducing_temperature", critical_temperature),
            critical_pressure=vp.get("reducing_pressure", critical_pressure),
            coefficients=tuple(vp["coefficients"]),
            exponents=tuple(vp["exponents"]),
        )
    if form == "dippr101":
        return ExtendedAntoine(a=vp["A"], b=vp["B"], e=vp["C"], f=vp["D"], g=vp["E"])
    # antoine: log_b(p / P_unit) = A - B / (t + C), t = (T - offset) / scale
    k = math.log(10.0) if vp["log_base"] == 10 else 1.0
    p_unit = resolve_unit(vp["pressure_unit"], "pressure")
    t_unit = resolve_unit(vp["temperature_unit"], "temperature")
    return ExtendedAntoine(
        a=math.log(p_unit.scale) + k * vp["A"],
        b=-k * vp["B"] * t_unit.scale,
        c=vp["C"] * t_unit.scale - t_unit.offset,
    )


def fluid_from_entry(entry: Mapping[str, Any]) -> Fluid:
    """Turn one validated catalog entry into a :class:`Fluid`."""
    vp = entry["vapor_pressure"]
    return Fluid(
        id=entry["id"],
        name=entry["name"],
        formula=entry["formula"],
        cas=entry["cas"],
        aliases=tuple(entry["aliases"]),
        molar_mass=entry["molar_mass"],
        critical_temperature=entry["critical_temperature"],
        critical_pressure=entry["critical_pressure"],
        triple_temperature=entry["triple_temperature"],
        triple_pressure=entry["triple_pressure"],
        normal_boiling_point=entry["normal_boiling_point"],
        constants_source=entry["constants_source"],
        lower_limit_note=entry["lower_limit_note"],
        notes=tuple(entry["notes"]),
        liquid_density=None
        if entry["liquid_density"] is None
        else density_from_entry(entry["liquid_density"], entry["molar_mass"]),
        equation=equation_from_entry(vp, entry["critical_temperature"], entry["critical_pressure"]),
        t_min=vp["t_min"],
        t_max=vp["t_max"],
        method=vp["method"],
        source=vp["source"],
    )


def _messages(errors: Mapping[str, Any], prefix: str = "") -> Iterable[str]:
    for key, value in errors.items():
        if isinstance(value, Mapping):
            yield from _messages(value, f"{prefix}{key}.")
        else:
            yield f"{prefix}{key}: {'; '.join(map(str, value))}"


def load_file(path: Path) -> list[Fluid]:
    """Read and validate one catalog file; raise :class:`CatalogError` naming what is wrong."""
    try:
        document = tomllib.loads(path.read_text(encoding="utf-8"))
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise CatalogError(f"{path}: cannot read catalog file: {exc}") from exc
    entries = document.get("fluid")
    if not isinstance(entries, list) or not entries:
        raise CatalogError(f"{path}: no [[fluid]] entries")
    fluids = []
    for number, raw in enumerate(entries, start=1):
        label = f"{path}: entry {number} ({raw.get('id', 'no id')!s})"
        try:
            fluids.append(fluid_from_entry(FluidEntrySchema().load(raw)))
        except ValidationError as exc:
            raise CatalogError(f"{label}: {' | '.join(_messages(exc.normalized_messages()))}") from exc
    return fluids


class Catalog:
    """The fluids, found by id, CAS number, name or alias, case-insensitively."""

    def __init__(self, fluids: Iterable[Fluid]) -> None:
        self.fluids: dict[str, Fluid] = {}
        self._keys: dict[str, str] = {}
        for fluid in fluids:
            if fluid.id in self.fluids:
                raise CatalogError(f"fluid id {fluid.id!r} is defined twice")
            self.fluids[fluid.id] = fluid
            for key in (fluid.id, fluid.cas, fluid.name, *fluid.aliases):
                owner = self._keys.setdefault(_fold(key), fluid.id)
                if owner != fluid.id:
                    raise CatalogError(f"{key!r} names both {owner!r} and {fluid.id!r}")

    def get(self, name: str) -> Fluid | None:
        """The fluid that ``name`` denotes, or None."""
        fluid_id = self._keys.get(_fold(name))
        return self.fluids[fluid_id] if fluid_id else None

    def close_matches(self, name: str, count: int = 3) -> list[str]:
        """Ids of up to ``count`` fluids whose names resemble ``name``, best first."""
        ids: list[str] = []
        for key in difflib.get_close_matches(_fold(name), self._keys, n=4 * count, cutoff=0.5):
            if self._keys[key] not in ids:
                ids.append(self._keys[key])
        return ids[:count]

    def search(self, query: str) -> list[Fluid]:
        """Fluids whose id, CAS number, formula, name or an alias contains ``query``."""
        q = _fold(query)
        return [
            f for f in self.fluids.values() if any(q in _fold(k) for k in (f.id, f.cas, f.formula, f.name, *f.aliases))
        ]


def _fold(text: str) -> str:
    return " ".join(text.casefold().split())


def builtin_files() -> list[Path]:
    """The built-in catalog files, in name order."""
    return sorted(DATA_DIR.glob("*.toml"))


def load_catalog(files: Iterable[Path] | None = None, extra_files: Iterable[Path] = ()) -> Catalog:
    """The catalog from ``files`` (default: the built-in ones) plus operator files, validated alike.

    Every fluid's pressure limits and saturation-temperature table are computed here (about 0.1 s
    for the built-in catalog), so that no request pays for them and gunicorn's workers, forked
    from a preloaded application, share them.
    """
    paths = [*(builtin_files() if files is None else files), *extra_files]
    catalog = Catalog(fluid for path in paths for fluid in load_file(Path(path)))
    for fluid in catalog.fluids.values():
        fluid.prepare()
    return catalog
