"""Two liquid phases: refused where every judge of a pair predicts them, inside the gap for two components;
answered with a caution where the judges disagree."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.limits import Refusal
from service.fluids.mixture import Model
from tests.conftest import MixtureOf

ATMOSPHERE = np.array([101_325.0])
EQUIMOLAR = np.array([[0.5, 0.5]])


def binary(x1: float) -> np.ndarray:
    return np.array([[x1, 1.0 - x1]])


@pytest.mark.parametrize(("model", "judge"), [("auto", "NRTL"), ("uniquac", "UNIQUAC"), ("wilson", "NRTL")])
def test_two_liquid_phases_are_refused(mixture_of: MixtureOf, model: Model, judge: str) -> None:
    # Water and 1-butanol split into two liquids near their boiling points, from about 2 mol% butanol to about
    # 60 mol% water (the measured mutual solubilities near 90 degC; a fact of the trade, recalled from memory).
    # Wilson's equation cannot show it (Wilson 1964, the form of its G^E): the pair's NRTL set judges instead; and
    # modified UNIFAC (Dortmund) must agree.
    with pytest.raises(Refusal, match=rf"two liquid phases.*mole fraction water \({judge} and modified UNIFAC"):
        mixture_of("water", "1-butanol", model=model).bubble_point(ATMOSPHERE, binary(0.8))


def test_a_liquid_outside_the_gap_is_answered(mixture_of: MixtureOf) -> None:
    # Half a mole percent of butanol in water, and the butanol-rich liquid, are one phase at their bubble points
    # (same solubilities): answered, and the array's split point is named by its index.
    mix = mixture_of("water", "1-butanol")
    found = mix.bubble_point(np.full(2, 101_325.0), np.array([[0.995, 0.005], [0.3, 0.7]]))
    assert np.all(found.temperature > 273.15 + 90.0)
    with pytest.raises(Refusal, match=r"point 1 of the request"):
        mix.bubble_point(np.full(2, 101_325.0), np.array([[0.995, 0.005], [0.8, 0.2]]))


def test_a_wilson_pair_without_another_set_is_judged_by_unifac(mixture_of: MixtureOf) -> None:
    # 1,2-dichloroethane and ethylbenzene have a Wilson set only: the UNIFACs test their liquid, and find one phase.
    mix = mixture_of("1-2-dichloroethane", "ethylbenzene", model="wilson")
    assert [j.name for j in mix.binaries[0].judges] == ["UNIFAC", "modified UNIFAC (Dortmund)"]
    assert mix.bubble_point(ATMOSPHERE, EQUIMOLAR).temperature[0] > 273.15 + 83.5  # above 1,2-DCE's own 83.5 degC


@pytest.mark.parametrize(
    ("first", "second", "x1", "model", "pressure"),
    [
        # 1-propanol and acetonitrile mix with water in every proportion near their boiling points (facts of the
        # trade, recalled: 1-propanol is miscible at all temperatures, acetonitrile's upper critical solution
        # temperature is about -1 degC). ChemSep's UNIQUAC sets, fitted to vapor-liquid data, predict splits there;
        # modified UNIFAC (Dortmund) does not, so they are answered, with a caution.
        ("1-propanol", "water", 0.2, "uniquac", 101_325.0),
        ("1-propanol", "water", 0.2, "wilson", 101_325.0),
        ("acetonitrile", "water", 0.3, "uniquac", 30_000.0),
    ],
)
def test_a_split_one_judge_alone_predicts_is_answered_with_a_caution(
    mixture_of: MixtureOf, first: str, second: str, x1: float, model: Model, pressure: float
) -> None:
    found = mixture_of(first, second, model=model).bubble_point(np.array([pressure]), np.array([[x1, 1 - x1]]))
    assert any("and another judge does not" in str(w) for w in found.warnings)


def test_an_ideal_solution_is_still_tested_for_two_liquids(mixture_of: MixtureOf) -> None:
    # Raoult's law cannot show two liquid phases; water and benzene barely mix (a fact of the trade): refused.
    with pytest.raises(Refusal, match="two liquid phases"):
        mixture_of("water", "benzene", model="ideal").bubble_point(ATMOSPHERE, EQUIMOLAR)


def test_the_judges_are_cited(mixture_of: MixtureOf) -> None:
    # A Wilson answer says which models tested its liquid, with their sources (the DECHEMA NRTL set, Dortmund's table).
    citations = dict(mixture_of("methanol", "ethanol", "water", model="wilson").citations)
    assert "DECHEMA" in citations["two liquid phases tested with NRTL"]
    assert citations["two liquid phases tested with modified UNIFAC (Dortmund)"]


def test_an_ideal_solution_is_judged_by_the_pairs_fitted_set(mixture_of: MixtureOf) -> None:
    # Methanol and n-butane have DECHEMA NRTL and UNIQUAC sets but no UNIFAC test of their own kind here: the
    # ideal answer is tested with the NRTL set, as a Wilson answer is.
    judges = [j.name for j in mixture_of("methanol", "n-butane", model="ideal").binaries[0].judges]
    assert judges[0] == "NRTL"


def test_three_components_need_the_judges_gaps_to_overlap(mixture_of: MixtureOf) -> None:
    # At 400 K NRTL splits methyl ethyl ketone/water between x_MEK 0.44 and 0.89 and Dortmund between 0.11 and 0.42:
    # both predict a gap but they do not agree where, so a ternary with them is answered with a caution.
    mix = mixture_of("methyl-ethyl-ketone", "water", "ethanol", model="nrtl")
    found = mix.bubble_pressure(np.array([400.0]), np.array([[0.05, 0.05, 0.9]]))
    assert any("and another judge does not" in str(w) for w in found.warnings)
