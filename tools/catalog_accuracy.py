"""Boiling points of the built-in catalog against CoolProp's reference equations of state.

The reference is CoolProp 8.0.0 (I.H. Bell, J. Wronski, S. Quoilin, V. Lemort, Ind. Eng. Chem.
Res. 53 (2014) 2498-2508, doi:10.1021/ie4033999) and the reference-quality Helmholtz equations of
state it implements, one per fluid (named by CoolProp's BibTeX key). A catalog fluid is matched to
a CoolProp fluid by CAS number. Every evaluation on the catalog side goes through
:func:`service.fluids.catalog.load_catalog` and :meth:`~service.fluids.catalog.Fluid.saturation_temperature`;
nothing here re-implements a vapor-pressure equation.

Shared by ``tests/fluids/test_reference_accuracy.py`` and ``tools/check_catalog.py``.
"""

from __future__ import annotations

import statistics
from collections.abc import Iterable
from dataclasses import dataclass

import CoolProp
import numpy as np
from CoolProp.CoolProp import PropsSI, get_fluid_param_string, get_global_param_string

from service.fluids.catalog import Catalog, Fluid

POINTS = 12
"""Log-spaced pressures per fluid."""
WORST_LIMIT = 0.5
"""Largest |dT| [K] allowed for any fluid."""
MEDIAN_LIMIT = 0.1
"""Largest median over fluids of the per-fluid worst |dT| [K]."""

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


def compare(fluid: Fluid, coolprop_name: str, points: int = POINTS) -> Comparison:
    """Boiling points of ``fluid`` at ``points`` log-spaced pressures against CoolProp's."""
    t_triple = PropsSI("Ttriple", coolprop_name)
    t_crit = PropsSI("Tcrit", coolprop_name)
    low, high = fluid.stated_range
    low, high = max(low, t_triple), min(high, t_crit)
    top = high * (1 - _BELOW_TOP)
    # Pressures that both the catalog equation (within its stated range) and CoolProp reach.
    p_low = max(float(fluid.saturation_pressure(low)), PropsSI("P", "T", low, "Q", 0, coolprop_name))
    p_high = min(float(fluid.saturation_pressure(top)), PropsSI("P", "T", top, "Q", 0, coolprop_name))
    pressures = np.geomspace(p_low, p_high, points)
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
    catalog: Catalog, names_by_cas: dict[str, str] | None = None, points: int = POINTS
) -> list[Comparison]:
    """:func:`compare` for every catalog fluid that CoolProp covers, in catalog order."""
    names = coolprop_names_by_cas() if names_by_cas is None else names_by_cas
    return [compare(f, names[f.cas], points) for f in catalog.fluids.values() if f.cas in names]


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
