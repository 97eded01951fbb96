"""Boiling points and liquid densities of the built-in catalog against CoolProp's reference equations of state.

The reference is CoolProp 8.0.0 (I.H. Bell, J. Wronski, S. Quoilin, V. Lemort, Ind. Eng. Chem.
Res. 53 (2014) 2498-2508, doi:10.1021/ie4033999) and the reference-quality Helmholtz equations of
state it implements, one per fluid (named by CoolProp's BibTeX key). A catalog fluid is matched to
a CoolProp fluid by CAS number. Every evaluation on the catalog side goes through
:func:`service.fluids.catalog.load_catalog` and :meth:`~service.fluids.catalog.Fluid.saturation_temperature`;
nothing here re-implements a vapor-pressure equation. Saturated-liquid densities likewise go through
:attr:`~service.fluids.catalog.Fluid.liquid_density` and its ``density`` callable.

Shared by ``tests/fluids/test_reference_accuracy.py``, ``tests/fluids/test_liquid_density.py`` and
``tools/check_catalog.py``.
"""

from __future__ import annotations

import statistics
from collections.abc import Iterable
from dataclasses import dataclass

import CoolProp
import numpy as np
from CoolProp.CoolProp import PropsSI, get_fluid_param_string, get_global_param_string

from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid

POINTS = 12
"""Log-spaced pressures per fluid."""
TEMPERATURE_POINTS = 24
"""Further pressures per fluid: CoolProp's saturation pressures at evenly spaced temperatures. Log-spaced
pressures alone leave wide gaps in temperature near the critical point (n-dodecane's former DIPPR 101 set
was 0.62 K off at 0.97 Tc, between two of its 12 log-spaced pressures, while the table said 0.31 K)."""
WORST_LIMIT = 0.5
"""Largest |dT| [K] allowed for any fluid."""
MEDIAN_LIMIT = 0.1
"""Largest median over fluids of the per-fluid worst |dT| [K]."""
DENSITY_POINTS = 60
"""Evenly spaced temperatures per fluid for the liquid-density comparison."""
DENSITY_TOP = 0.9
"""The density comparison ends at this fraction of CoolProp's critical temperature: closer to the
critical point the DIPPR 105 form cannot follow the steep fall of the saturated-liquid density."""
DENSITY_LIMIT = 0.03
"""Largest relative deviation of a fluid's saturated-liquid density from CoolProp allowed."""

# The highest pressure compared is taken this far (relative) below the upper end of the range: CoolProp's
# saturation solver is unreliable at its critical point, and the catalog's own inverse should not be asked
# for the very end of its bracket, where 1/(1/T) can round above a Wagner equation's reducing temperature.
_BELOW_TOP = 1e-6


@dataclass(frozen=True)
class Comparison:
    """The worst boiling-point deviation of one catalog fluid from its CoolProp reference."""

    fluid_id: str
    coolprop_name: str
    reference: str
    """CoolProp's BibTeX key of the reference equation of state."""
    t_low: float
    t_high: float
    """The compared temperature range [K]: the stated range within CoolProp's triple..critical range."""
    worst_dt: float
    """max |T_catalog - T_CoolProp| [K] over the pressures."""
    at_pressure: float
    """The pressure [Pa] of the worst deviation."""


@dataclass(frozen=True)
class DensityComparison:
    """The worst saturated-liquid density deviation of one catalog fluid from its CoolProp reference."""

    fluid_id: str
    coolprop_name: str
    method: str
    """The catalog's density correlation (its ``method``)."""
    t_low: float
    t_high: float
    """The compared range [K]: the density table's stated range within CoolProp's triple point..DENSITY_TOP Tc."""
    worst: float
    """The relative deviation rho_catalog / rho_CoolProp - 1 of largest magnitude."""
    at_temperature: float
    """The temperature [K] of the worst deviation."""


def coolprop_version() -> str:
    """The CoolProp version in use."""
    return CoolProp.__version__


def coolprop_names_by_cas() -> dict[str, str]:
    """CoolProp fluid name for every CAS number CoolProp knows."""
    names: dict[str, str] = {}
    for name in get_global_param_string("FluidsList").split(","):
        names.setdefault(get_fluid_param_string(name, "CAS"), name)
    return names


def coolprop_boiling_point(name: str, pressure: float) -> float:
    """CoolProp's saturated-liquid temperature [K] at ``pressure`` [Pa]."""
    return float(PropsSI("T", "P", pressure, "Q", 0, name))


def compare(
    fluid: Fluid, coolprop_name: str, points: int = POINTS, temperature_points: int = TEMPERATURE_POINTS
) -> Comparison:
    """Boiling points of ``fluid`` against CoolProp's at ``points`` log-spaced pressures and at the saturation
    pressures of ``temperature_points`` evenly spaced temperatures (those within the common pressure range)."""
    t_triple = PropsSI("Ttriple", coolprop_name)
    t_crit = PropsSI("Tcrit", coolprop_name)
    low, high = fluid.stated_range
    low, high = max(low, t_triple), min(high, t_crit)
    top = high * (1 - _BELOW_TOP)
    # Pressures that both the catalog equation (within its stated range) and CoolProp reach.
    p_low = max(float(fluid.saturation_pressure(low)), PropsSI("P", "T", low, "Q", 0, coolprop_name))
    p_high = min(float(fluid.saturation_pressure(top)), PropsSI("P", "T", top, "Q", 0, coolprop_name))
    at_temperatures = np.array(
        [PropsSI("P", "T", t, "Q", 0, coolprop_name) for t in np.linspace(low, top, temperature_points)]
    )
    at_temperatures = at_temperatures[(at_temperatures >= p_low) & (at_temperatures <= p_high)]
    pressures = np.unique(np.concatenate([np.geomspace(p_low, p_high, points), at_temperatures]))
    ours = fluid.saturation_temperature(pressures)
    theirs = np.array([coolprop_boiling_point(coolprop_name, float(p)) for p in pressures])
    deviation = np.abs(ours - theirs)
    worst = int(np.argmax(deviation))
    return Comparison(
        fluid_id=fluid.id,
        coolprop_name=coolprop_name,
        reference=get_fluid_param_string(coolprop_name, "BibTeX-EOS"),
        t_low=low,
        t_high=high,
        worst_dt=float(deviation[worst]),
        at_pressure=float(pressures[worst]),
    )


def compare_catalog(
    catalog: Catalog,
    names_by_cas: dict[str, str] | None = None,
    points: int = POINTS,
    temperature_points: int = TEMPERATURE_POINTS,
) -> list[Comparison]:
    """:func:`compare` for every catalog fluid that CoolProp covers, in catalog order."""
    names = coolprop_names_by_cas() if names_by_cas is None else names_by_cas
    return [compare(f, names[f.cas], points, temperature_points) for f in catalog.entries.values() if f.cas in names]


def coolprop_liquid_density(name: str, temperature: float) -> float:
    """CoolProp's saturated-liquid density [kg/m3] at ``temperature`` [K]."""
    return float(PropsSI("D", "T", temperature, "Q", 0, name))


def compare_density(fluid: Fluid, coolprop_name: str, points: int = DENSITY_POINTS) -> DensityComparison:
    """Saturated-liquid density of ``fluid`` at ``points`` evenly spaced temperatures against CoolProp's.

    The range is [max(t_min, Ttriple), min(t_max, DENSITY_TOP * Tc)], Ttriple and Tc of the CoolProp
    equation of state. ``fluid`` must have a density table.
    """
    density = fluid.liquid_density
    if density is None:
        raise ValueError(f"{fluid.id} has no liquid density table")
    low = max(density.t_min, PropsSI("Ttriple", coolprop_name))
    high = min(density.t_max, DENSITY_TOP * PropsSI("Tcrit", coolprop_name))
    temperatures = np.linspace(low, high, points)
    ours = density.density(temperatures)
    theirs = np.array([coolprop_liquid_density(coolprop_name, float(t)) for t in temperatures])
    deviation = ours / theirs - 1.0
    worst = int(np.argmax(np.abs(deviation)))
    return DensityComparison(
        fluid_id=fluid.id,
        coolprop_name=coolprop_name,
        method=density.method,
        t_low=low,
        t_high=high,
        worst=float(deviation[worst]),
        at_temperature=float(temperatures[worst]),
    )


def compare_density_catalog(
    catalog: Catalog, names_by_cas: dict[str, str] | None = None, points: int = DENSITY_POINTS
) -> list[DensityComparison]:
    """:func:`compare_density` for every catalog fluid with a density table that CoolProp covers."""
    names = coolprop_names_by_cas() if names_by_cas is None else names_by_cas
    return [
        compare_density(f, names[f.cas], points)
        for f in catalog.entries.values()
        if f.cas in names and f.liquid_density is not None
    ]


def density_table(results: Iterable[DensityComparison]) -> str:
    """A markdown table: fluid | worst deviation % | at T K | compared range | correlation."""
    lines = [
        "| fluid | worst rho/rho_ref - 1, % | at T K | compared range K | density correlation | CoolProp name |",
        "|---|---:|---:|---|---|---|",
    ]
    lines += [
        f"| {r.fluid_id} | {100 * r.worst:+.2f} | {r.at_temperature:.2f} | {r.t_low:.2f}-{r.t_high:.2f} "
        f"| {r.method} | {r.coolprop_name} |"
        for r in results
    ]
    return "\n".join(lines)


def density_summary(results: list[DensityComparison]) -> str:
    """One line: how many fluids, the median and the worst of the per-fluid worst |deviation|."""
    worst = max(results, key=lambda r: abs(r.worst))
    within = sum(abs(r.worst) <= DENSITY_LIMIT for r in results)
    median = statistics.median(abs(r.worst) for r in results)
    return (
        f"{len(results)} liquid densities compared with CoolProp {coolprop_version()} up to {DENSITY_TOP} Tc: "
        f"median of the per-fluid worst |deviation| {100 * median:.2f} %, maximum {100 * abs(worst.worst):.2f} % "
        f"({worst.fluid_id}); {within}/{len(results)} within {100 * DENSITY_LIMIT:g} %"
    )


def median_worst(results: Iterable[Comparison]) -> float:
    """Median over fluids of the per-fluid worst |dT| [K]."""
    return statistics.median(r.worst_dt for r in results)


def table(results: Iterable[Comparison]) -> str:
    """A markdown table: fluid | worst |dT| K | at p Pa | reference EOS."""
    lines = [
        "| fluid | worst \\|dT\\| K | at p Pa | compared range K | reference EOS (CoolProp name, BibTeX key) |",
        "|---|---:|---:|---|---|",
    ]
    lines += [
        f"| {r.fluid_id} | {r.worst_dt:.3f} | {r.at_pressure:.4g} | {r.t_low:.2f}-{r.t_high:.2f} "
        f"| {r.coolprop_name}, {r.reference} |"
        for r in results
    ]
    return "\n".join(lines)


def summary(results: list[Comparison]) -> str:
    """One line: how many fluids, the median and the worst of the per-fluid worst |dT|."""
    worst = max(results, key=lambda r: r.worst_dt)
    within = sum(r.worst_dt <= WORST_LIMIT for r in results)
    return (
        f"{len(results)} fluids compared with CoolProp {coolprop_version()}: median of the per-fluid worst "
        f"|dT| {median_worst(results):.3f} K (target <= {MEDIAN_LIMIT} K), maximum {worst.worst_dt:.3f} K "
        f"({worst.fluid_id}); {within}/{len(results)} within {WORST_LIMIT} K"
    )
