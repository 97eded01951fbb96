#!/usr/bin/env python3
"""Check the built-in fluid catalog against CoolProp and regenerate docs/catalog-accuracy.md.

Every number on the catalog side comes from :func:`service.fluids.catalog.load_catalog` (the
service's own loader and equations); the CoolProp comparison is :mod:`tools.catalog_accuracy`,
which the test ``tests/fluids/test_reference_accuracy.py`` uses too. Besides the boiling-point
comparison the report lists, for every fluid, the equation's boiling point at 101325 Pa against
the entry's ``normal_boiling_point`` and the equation at min(t_max, Tc) against ``critical_pressure``,
and, for every fluid with a density table that CoolProp covers, the saturated-liquid density
``Fluid.liquid_density.density(T)`` against CoolProp's up to 0.9 Tc.

Run from the repository root with the project's environment (CoolProp is a test dependency):

    python -m tools.check_catalog [--points N] [--temperature-points N] [--out docs/catalog-accuracy.md]

Exit status 1 when a target is missed: worst |dT| above 0.5 K for a fluid, the median of the
per-fluid worst |dT| above 0.1 K, or a liquid density more than 3 % from CoolProp's.
"""

from __future__ import annotations

import argparse
import math
import sys
from pathlib import Path

if __package__ in (None, ""):  # run as a script: make the repository root importable
    sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from service.fluids.catalog import load_catalog
from service.fluids.fluid import Fluid
from tools.catalog_accuracy import (
    DENSITY_LIMIT,
    DENSITY_POINTS,
    DENSITY_TOP,
    MEDIAN_LIMIT,
    POINTS,
    TEMPERATURE_POINTS,
    WORST_LIMIT,
    compare_catalog,
    compare_density_catalog,
    coolprop_names_by_cas,
    coolprop_version,
    density_summary,
    density_table,
    median_worst,
    summary,
    table,
)

ROOT = Path(__file__).resolve().parents[1]
DEFAULT_OUT = ROOT / "docs" / "catalog-accuracy.md"
ATMOSPHERE = 101325.0  # Pa


def _fixed_point_row(fluid: Fluid) -> str:
    nbp = "-"
    if fluid.normal_boiling_point is not None:
        t_atm = float(fluid.saturation_temperature(ATMOSPHERE))
        nbp = f"{t_atm - fluid.normal_boiling_point:+.3f}"
    top = min(fluid.t_max, fluid.critical_temperature, fluid.temperature_limits[1])
    ratio = float(fluid.saturation_pressure(top)) / fluid.critical_pressure - 1.0
    reaches = math.isclose(top, fluid.critical_temperature, rel_tol=2e-3)
    crit = f"{100 * ratio:+.2f}" if reaches else f"n/a (equation ends at {top:.1f} K)"
    return (
        f"| {fluid.id} | {fluid.method} | {fluid.stated_range[0]:.2f}-{fluid.stated_range[1]:.2f} | {nbp} | {crit} "
        f"| {_density_cell(fluid)} |"
    )


def _density_cell(fluid: Fluid) -> str:
    """The saturated-liquid density at the normal boiling point (the equation's T at 101325 Pa) and its range."""
    density = fluid.liquid_density
    if density is None:
        return "no density table"
    if fluid.normal_boiling_point is None:
        return f"n/a (no normal boiling point; table {density.t_min:.2f}-{density.t_max:.2f} K)"
    t_atm = float(fluid.saturation_temperature(ATMOSPHERE))
    if not density.t_min <= t_atm <= density.t_max:
        return f"n/a (T(101325 Pa) = {t_atm:.2f} K outside {density.t_min:.2f}-{density.t_max:.2f} K)"
    return f"{float(density.density(t_atm)):.1f} ({density.t_min:.2f}-{density.t_max:.2f} K)"


def report(points: int, temperature_points: int = TEMPERATURE_POINTS) -> tuple[str, bool]:
    """The markdown report and whether every target is met."""
    catalog = load_catalog()
    names = coolprop_names_by_cas()
    results = compare_catalog(catalog, names, points, temperature_points)
    missing = [f.id for f in catalog.entries.values() if f.cas not in names]
    densities = compare_density_catalog(catalog, names)
    no_density = [f.id for f in catalog.entries.values() if f.liquid_density is None]
    fixed = [
        "| fluid | equation | stated range K | T(101325 Pa) - normal_boiling_point, K "
        "| p(min(t_max, Tc)) / pc - 1, % | liquid density at T(101325 Pa), kg/m3 (density table range) |",
        "|---|---|---|---:|---:|---:|",
        *(_fixed_point_row(f) for f in catalog.entries.values()),
    ]
    text = "\n".join(
        [
            "## Boiling points against CoolProp",
            "",
            table(results),
            "",
            f"- {summary(results)}",
            f"- not in CoolProp (not compared): {', '.join(missing) or 'none'}",
            "",
            "## Saturated-liquid densities against CoolProp",
            "",
            density_table(densities),
            "",
            f"- {density_summary(densities)}",
            f"- no density table: {', '.join(no_density) or 'none'}",
            "",
            "## Fixed points of each entry",
            "",
            *fixed,
            "",
        ]
    )
    ok = (
        max(r.worst_dt for r in results) <= WORST_LIMIT
        and median_worst(results) <= MEDIAN_LIMIT
        and max(abs(r.worst) for r in densities) <= DENSITY_LIMIT
    )
    return text, ok


HEADER = """# Built-in fluid catalog: accuracy against CoolProp

Generated by `python -m tools.check_catalog` from the built-in catalog as the service loads it
(`service.fluids.catalog.load_catalog()`); do not edit by hand. The reference is CoolProp {version}
and the reference equations of state it implements (named by CoolProp fluid and BibTeX key). Each
catalog fluid is matched to a CoolProp fluid by CAS number and its boiling point
`Fluid.saturation_temperature(p)` is compared with CoolProp's saturated-liquid temperature at {points}
log-spaced pressures spanning the fluid's stated range within CoolProp's triple-to-critical range
(pressures both reach), and at CoolProp's saturation pressures at {temperature_points} evenly spaced temperatures
over the same range (log-spaced pressures alone are sparse in temperature near the critical point). The
table gives the largest |dT| and the pressure where it occurs. Targets: every fluid within {worst} K,
median of the per-fluid worst within {median} K.

The saturated-liquid density of every fluid with a density table, `Fluid.liquid_density.density(T)`,
is compared with CoolProp's at {density_points} evenly spaced temperatures over the table's stated range
within CoolProp's triple point to {density_top} Tc (closer to the critical point the DIPPR 105 form drifts).
The table gives the relative deviation of largest magnitude and its temperature. Target: every fluid
within {density_limit:g} %.

"""


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--points", type=int, default=POINTS, help=f"log-spaced pressures per fluid (default {POINTS})")
    parser.add_argument(
        "--temperature-points",
        type=int,
        default=TEMPERATURE_POINTS,
        help=f"further pressures per fluid, at evenly spaced temperatures (default {TEMPERATURE_POINTS})",
    )
    parser.add_argument("--out", type=Path, default=DEFAULT_OUT, help="markdown file to write")
    args = parser.parse_args(argv)
    text, ok = report(args.points, args.temperature_points)
    print(text)
    header = HEADER.format(
        version=coolprop_version(),
        points=args.points,
        temperature_points=args.temperature_points,
        worst=WORST_LIMIT,
        median=MEDIAN_LIMIT,
        density_points=DENSITY_POINTS,
        density_top=DENSITY_TOP,
        density_limit=100 * DENSITY_LIMIT,
    )
    args.out.write_text(header + text, encoding="utf-8")
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
