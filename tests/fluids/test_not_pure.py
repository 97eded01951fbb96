"""Names that mean a solution or a mixture (the trade's words; common practice, no source)."""

import pytest

from service.fluids.not_pure import SOLUTIONS, solution_or_mixture

PURE = {"water", "ethanol", "ethylene glycol", "2-propanol"}


@pytest.mark.parametrize("name", sorted(SOLUTIONS))
def test_every_listed_word_reads_as_what_it_usually_is(name: str) -> None:
    assert solution_or_mixture(name.upper(), PURE.__contains__) == SOLUTIONS[name]


@pytest.mark.parametrize(
    ("name", "meaning"),
    [
        ("50% glycol", "a solution or a mixture"),
        ("30 wt ethanol", "a solution or a mixture"),
        ("sodium chloride solution", "a solution or a mixture"),
        ("ethanol in water", "a solution or a mixture"),
        ("ethanol/water", "a mixture of ethanol and water"),
        ("Water + Ethanol", "a mixture of water and ethanol"),
        ("water with salt", "a solution or a mixture"),
    ],
)
def test_shares_words_and_joined_names(name: str, meaning: str) -> None:
    assert solution_or_mixture(name, PURE.__contains__) == meaning


@pytest.mark.parametrize("name", ["propylene glycol", "2-propanol", "1,3-butadiene", "64-17-5", "R-134a", "n-dodecane"])
def test_names_of_pure_fluids_are_left_to_the_catalog(name: str) -> None:
    assert solution_or_mixture(name, PURE.__contains__) is None
