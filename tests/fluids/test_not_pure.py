"""Names that mean a solution or a mixture (the trade's words; common practice, no source)."""

import pytest

from service.fluids.catalog import Catalog
from service.fluids.not_pure import GLYCOL, SOLUTIONS, solution_or_mixture

PURE = {"water": "water", "steam": "water", "ethanol": "ethanol", "ethylene glycol": "ethylene-glycol"}


@pytest.mark.parametrize("name", sorted(SOLUTIONS))
def test_every_listed_word_reads_as_what_it_usually_is(name: str) -> None:
    assert solution_or_mixture(name.upper(), PURE.get) == SOLUTIONS[name]


@pytest.mark.parametrize(
    ("name", "meaning"),
    [
        ("50% glycol", GLYCOL),
        ("glycol 30", GLYCOL),
        ("water-glycol", GLYCOL),
        ("ethanol 10 %", "a solution or a mixture"),
        ("ethanol 95", "a solution or a mixture"),
        ("ethanol-water", "a mixture of ethanol and water"),
        ("R-410A", "a refrigerant blend: a mixture"),
        ("CIP caustic", SOLUTIONS["caustic"]),
        ("sugar syrup", SOLUTIONS["syrup"]),
        ("30 wt ethanol", "a solution or a mixture"),
        ("sodium chloride solution", "a solution or a mixture"),
        ("ethanol in water", "a solution or a mixture"),
        ("ethanol/water", "a mixture of ethanol and water"),
        ("Water + Ethanol", "a mixture of water and ethanol"),
        ("glycol/water 40/60", GLYCOL),
        ("water with salt", "a solution or a mixture"),
    ],
)
def test_shares_words_and_joined_names(name: str, meaning: str) -> None:
    assert solution_or_mixture(name, PURE.get) == meaning


@pytest.mark.parametrize(
    "name",
    [
        "propylene glycol",
        "diethylene glycol",
        "glycol ether",
        "1,3-butadiene",
        "64-17-5",
        "R-40",
        "R-1234ze",
        "water/steam",  # one fluid named twice
        "ethanol 99.9 %",  # a purity grade
        "99.999% ethanol",
    ],
)
def test_names_of_pure_fluids_are_left_to_the_catalog(name: str) -> None:
    assert solution_or_mixture(name, PURE.get) is None


def test_no_name_of_the_catalog_reads_as_a_solution(catalog: Catalog) -> None:
    def fluid_id(name: str) -> str | None:
        fluid = catalog.get(name)
        return fluid.id if fluid else None

    keys = [key for fluid in catalog.entries.values() for key in (fluid.id, fluid.name, fluid.cas, *fluid.aliases)]
    assert [key for key in keys if solution_or_mixture(key, fluid_id)] == []
