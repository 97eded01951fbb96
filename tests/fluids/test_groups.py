"""The UNIFAC group table (service/fluids/data/groups/unifac.toml): loaded and checked against the catalog."""

from __future__ import annotations

from pathlib import Path

import pytest

from service.fluids.catalog import Catalog, CatalogError
from service.fluids.fluid import Fluid
from service.fluids.groups import GROUP_FILE, load_group_tables, load_groups
from service.fluids.limits import Refusal


def test_every_assigned_fluid_builds_a_model_with_water_or_ethanol(catalog: Catalog[Fluid]) -> None:
    table = load_groups(catalog)
    # Ethanol's groups, the standard assignment (common practice, no source).
    assert table.fluids["ethanol"] == {"CH3": 1, "CH2": 1, "OH": 1}
    built = 0
    for fluid_id in table.fluids:
        for partner in ("water", "ethanol"):
            if partner == fluid_id:
                continue
            try:
                table.model([catalog.get(fluid_id), catalog.get(partner)])
                built += 1
            except Refusal:
                pass  # a missing interaction or an unreliable pair, refused with its reason
    assert built > 50


def test_missing_interactions_are_refused(catalog: Catalog[Fluid]) -> None:
    # The published table has no DMSO/nitrile parameter (main groups 35 and 19).
    with pytest.raises(Refusal, match="no interaction parameters"):
        load_groups(catalog).model([catalog.get("dimethyl-sulfoxide"), catalog.get("acetonitrile")])


@pytest.mark.parametrize(
    ("change", "message"),
    [(("ethanol = {", "unobtainium = {"), "not in the catalog"), (("OH = 1 }", "XY = 1 }"), "undeclared subgroups")],
)
def test_a_bad_table_stops_start_up(
    catalog: Catalog[Fluid], tmp_path: Path, change: tuple[str, str], message: str
) -> None:
    path = tmp_path / "unifac.toml"
    path.write_text(GROUP_FILE.read_text(encoding="utf-8").replace(*change, 1), encoding="utf-8")
    with pytest.raises(CatalogError, match=message):
        load_groups(catalog, path)


def test_both_group_methods_load(catalog: Catalog[Fluid]) -> None:
    tables = load_group_tables(catalog)
    assert set(tables) == {"unifac", "unifac-dortmund"}
    # Modified UNIFAC counts a secondary OH apart (Weidlich and Gmehling 1987): 2-propanol has one.
    assert tables["unifac-dortmund"].fluids["2-propanol"] == {"CH3": 2, "CH": 1, "OH_S": 1}
