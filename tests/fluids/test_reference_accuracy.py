"""Boiling points of the built-in catalog against reference equations of state.

Reference: CoolProp 8.0.0 (I.H. Bell, J. Wronski, S. Quoilin, V. Lemort, Ind. Eng. Chem. Res. 53
(2014) 2498-2508, doi:10.1021/ie4033999) and the reference-quality Helmholtz equations of state it
implements; the table printed by the test names each fluid's equation by its CoolProp BibTeX key.
Every catalog fluid that CoolProp covers (matched by CAS number) is compared at 12 log-spaced
pressures and at CoolProp's saturation pressures at 24 evenly spaced temperatures, over its stated
range within CoolProp's triple..critical range. The comparison itself
lives in tools/catalog_accuracy.py, shared with tools/check_catalog.py, which writes
docs/catalog-accuracy.md.
"""

from __future__ import annotations

import pytest

pytest.importorskip("CoolProp")

from service.fluids.catalog import load_catalog
from tools.catalog_accuracy import (
    MEDIAN_LIMIT,
    WORST_LIMIT,
    Comparison,
    compare_catalog,
    coolprop_names_by_cas,
    median_worst,
    summary,
    table,
)


@pytest.fixture(scope="module")
def comparisons() -> list[Comparison]:
    """One comparison per covered fluid; the CoolProp name map is built once for the module."""
    return compare_catalog(load_catalog(), coolprop_names_by_cas())


def test_coolprop_covers_most_of_the_catalog(comparisons: list[Comparison]) -> None:
    assert len(comparisons) >= 40


def test_boiling_points_match_the_reference_equations(
    comparisons: list[Comparison], capsys: pytest.CaptureFixture[str]
) -> None:
    with capsys.disabled():
        print(f"\n\nCatalog boiling points against CoolProp reference equations of state\n{table(comparisons)}")
        print(summary(comparisons))
    too_far = {r.fluid_id: round(r.worst_dt, 3) for r in comparisons if r.worst_dt > WORST_LIMIT}
    assert not too_far, f"worst |dT| above {WORST_LIMIT} K"
    assert median_worst(comparisons) <= MEDIAN_LIMIT
