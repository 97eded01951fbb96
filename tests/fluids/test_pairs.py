"""The built-in NRTL pairs (service/fluids/data/pairs/nrtl.toml): loaded, validated, in SI."""

from __future__ import annotations

from pathlib import Path

import pytest

from service.fluids.catalog import Catalog, CatalogError
from service.fluids.fluid import Fluid
from service.fluids.pairs import load_nrtl_pairs


def test_every_pair_is_of_catalog_fluids(catalog: Catalog[Fluid]) -> None:
    pairs = load_nrtl_pairs(catalog)
    assert len(pairs) == 101
    assert all(p.t_min < p.t_max and p.alpha > 0 and len(p.source) > 10 for p in pairs.values())


def test_ethanol_water_in_kelvin(catalog: Catalog[Fluid]) -> None:
    # DECHEMA ethanol/water at 1 atm: A12 = -57.9601 and A21 = 1241.7396 cal/mol, alpha 0.2937 (ChemSep IPD);
    # ChemSep's own conversion to b = A/R gives -29.166654 K and 624.867622 K (thermo's nrtl.json).
    pair = load_nrtl_pairs(catalog)[frozenset(("ethanol", "water"))]
    assert pair.components == ("ethanol", "water")
    assert pair.b_ij == pytest.approx(-29.166654483541816, rel=1e-8)
    assert pair.b_ji == pytest.approx(624.8676222389441, rel=1e-8)
    assert pair.alpha == 0.2937


@pytest.mark.parametrize(
    ("entry", "message"),
    [
        ('components = ["ethanol", "nothing"]', "nothing not in the catalog"),
        ('components = ["ethanol", "ethanol"]', "two different components"),
        ('components = ["ethanol"]', "components"),
    ],
)
def test_a_bad_pair_stops_start_up(catalog: Catalog[Fluid], tmp_path: Path, entry: str, message: str) -> None:
    path = tmp_path / "nrtl.toml"
    path.write_text(
        f"[[pair]]\n{entry}\nA12 = 1.0\nA21 = 2.0\nalpha = 0.3\nt_min = 300.0\nt_max = 350.0\n"
        'source = "a test entry, invented"\n'
    )
    with pytest.raises(CatalogError, match=message):
        load_nrtl_pairs(catalog, path)
