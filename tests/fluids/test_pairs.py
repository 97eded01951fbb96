"""The built-in pairs (service/fluids/data/pairs/*.toml): loaded, validated, in SI, and turned into models."""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from service.fluids.catalog import Catalog, CatalogError
from service.fluids.fluid import Fluid
from service.fluids.pairs import load_pair_set, load_pair_sets

thermo_ip = pytest.importorskip("thermo.interaction_parameters")
thermo_wilson = pytest.importorskip("thermo.wilson")
thermo_uniquac = pytest.importorskip("thermo.uniquac")

CAS = {"ethanol": "64-17-5", "water": "7732-18-5", "methanol": "67-56-1", "acetone": "67-64-1"}


def test_every_pair_is_of_catalog_fluids(catalog: Catalog[Fluid]) -> None:
    sets = load_pair_sets(catalog)
    assert {model: len(s.pairs) for model, s in sets.items()} == {"nrtl": 101, "wilson": 100, "uniquac": 85}
    for s in sets.values():
        assert all(p.t_min < p.t_max and len(p.source) > 10 for p in s.pairs.values())
    assert all(p.values["alpha"] > 0 for p in sets["nrtl"].pairs.values())
    uniquac = sets["uniquac"]
    assert all(c in uniquac.sizes for p in uniquac.pairs.values() for c in p.components)


def test_ethanol_water_in_kelvin(catalog: Catalog[Fluid]) -> None:
    # DECHEMA ethanol/water at 1 atm: A12 = -57.9601 and A21 = 1241.7396 cal/mol, alpha 0.2937 (ChemSep IPD);
    # ChemSep's own conversion to b = A/R gives -29.166654 K and 624.867622 K (thermo's nrtl.json).
    pair = load_pair_sets(catalog)["nrtl"].pairs[frozenset(("ethanol", "water"))]
    assert pair.components == ("ethanol", "water")
    assert pair.values["b12"] == pytest.approx(-29.166654483541816, rel=1e-8)
    assert pair.values["b21"] == pytest.approx(624.8676222389441, rel=1e-8)
    assert pair.values["alpha"] == 0.2937


@pytest.mark.parametrize("model", ["wilson", "uniquac"])
@pytest.mark.parametrize("ids", [("ethanol", "water"), ("water", "methanol"), ("acetone", "water", "methanol")])
def test_models_equal_the_databank_through_thermo(catalog: Catalog[Fluid], model: str, ids: tuple[str, ...]) -> None:
    # The same ChemSep sets as thermo 0.6 serves them (its IPDB, 'ChemSep Wilson' and 'ChemSep UNIQUAC'), put in
    # thermo's own models: our files, their conversion and our equations agree to 1e-6 (R differs in the 7th digit).
    chosen = load_pair_sets(catalog)[model]
    cas = [CAS[i] for i in ids]
    name = {"wilson": "ChemSep Wilson", "uniquac": "ChemSep UNIQUAC"}[model]
    b = thermo_ip.IPDB.get_ip_asymmetric_matrix(name=name, CASs=cas, ip="bij")
    x, t = [0.3, 0.7] if len(ids) == 2 else [0.2, 0.5, 0.3], 340.0
    if model == "wilson":
        a = thermo_ip.IPDB.get_ip_asymmetric_matrix(name=name, CASs=cas, ip="aij")
        reference = thermo_wilson.Wilson(T=t, xs=x, lambda_as=a, lambda_bs=b).gammas()
    else:
        r, q = zip(*(chosen.sizes[i] for i in ids), strict=True)
        reference = thermo_uniquac.UNIQUAC(T=t, xs=x, rs=list(r), qs=list(q), tau_bs=b).gammas()
    np.testing.assert_allclose(np.exp(chosen.activity(ids).log_gamma(x, t)), reference, rtol=1e-6)


def test_uniquac_sizes_are_chemsep_s(catalog: Catalog[Fluid]) -> None:
    # Water r = 0.92, q = 1.40 and ethanol r = 2.11, q = 1.97: ChemSep's values, the ones thermo's documentation
    # pairs with ChemSep's UNIQUAC set (thermo.uniquac, example 3).
    sizes = load_pair_sets(catalog)["uniquac"].sizes
    assert sizes["water"] == (0.92, 1.4)
    assert sizes["ethanol"] == (2.11, 1.97)


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
        load_pair_set(catalog, "nrtl", path)


def test_a_uniquac_pair_without_sizes_stops_start_up(catalog: Catalog[Fluid], tmp_path: Path) -> None:
    path = tmp_path / "uniquac.toml"
    path.write_text(
        '[[component]]\nid = "ethanol"\nr = 2.11\nq = 1.97\n\n[[pair]]\ncomponents = ["ethanol", "water"]\n'
        'A12 = 1.0\nA21 = 2.0\nt_min = 300.0\nt_max = 350.0\nsource = "a test entry, invented"\n'
    )
    with pytest.raises(CatalogError, match="r and q of both components"):
        load_pair_set(catalog, "uniquac", path)


def test_uniquac_sizes_without_their_source_stop_start_up(catalog: Catalog[Fluid], tmp_path: Path) -> None:
    path = tmp_path / "uniquac.toml"
    path.write_text('[[component]]\nid = "ethanol"\nr = 2.11\nq = 1.97\n')
    with pytest.raises(CatalogError, match="sizes_source"):
        load_pair_set(catalog, "uniquac", path)
