"""Liquid mixtures against published equilibrium data (source beside each check) and their refusals."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid
from service.fluids.groups import load_group_tables
from service.fluids.limits import OutOfRange, Refusal
from service.fluids.mixture import Mixture, Model, mixture
from service.fluids.pairs import NrtlPair, load_nrtl_pairs

Pairs = dict[frozenset[str], NrtlPair]

ATMOSPHERE = np.array([101_325.0])


@pytest.fixture(scope="module")
def pairs(catalog: Catalog[Fluid]) -> Pairs:
    return load_nrtl_pairs(catalog)


def of(catalog: Catalog[Fluid], pairs: Pairs, *ids: str, model: Model = "auto") -> Mixture:
    return mixture([catalog.get(i) for i in ids], pairs, load_group_tables(catalog), model)


def binary(x1: float) -> np.ndarray:
    return np.array([[x1, 1.0 - x1]])


@pytest.mark.parametrize(
    ("x1", "boils", "y1"),
    # Ethanol and water at 101.325 kPa, the published equilibrium points (recalled from memory;
    # the classic data set of Perry's Chemical Engineers' Handbook, Table 13-1): x, T [degC], y.
    [(0.097, 86.7, 0.438), (0.508, 79.8, 0.656), (0.894, 78.15, 0.894)],
)
def test_ethanol_water_bubble_points(catalog: Catalog[Fluid], pairs: Pairs, x1: float, boils: float, y1: float) -> None:
    found = of(catalog, pairs, "ethanol", "water").bubble_point(ATMOSPHERE, binary(x1))
    assert found.temperature[0] - 273.15 == pytest.approx(boils, abs=0.5)
    assert found.other[0, 0] == pytest.approx(y1, abs=0.02)


def test_benzene_toluene_by_raoults_law(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    # Raoult's law at x = 0.5 and 101.325 kPa: about 92.0 degC, y near 0.714 (the textbook values).
    found = of(catalog, pairs, "benzene", "toluene", model="ideal").bubble_point(ATMOSPHERE, binary(0.5))
    assert found.temperature[0] - 273.15 == pytest.approx(92.0, abs=0.5)
    assert found.other[0, 0] == pytest.approx(0.714, abs=0.01)


def test_a_pure_component_boils_at_its_own_boiling_point(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    water = catalog.get("water")
    found = of(catalog, pairs, "ethanol", "water").bubble_point(ATMOSPHERE, binary(0.0))
    assert found.temperature[0] == water.saturation_temperature(ATMOSPHERE)[0]


def test_dew_point_of_the_bubble_vapor(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    mix = of(catalog, pairs, "methanol", "ethanol", "water")
    x = np.array([[0.2, 0.3, 0.5], [0.05, 0.05, 0.9]])
    p = np.full(2, 101_325.0)
    bubble = mix.bubble_point(p, x)
    dew = mix.dew_point(p, bubble.other)
    np.testing.assert_allclose(dew.temperature, bubble.temperature, atol=1e-8)
    np.testing.assert_allclose(dew.other, x, atol=1e-8)
    np.testing.assert_allclose(mix.bubble_pressure(bubble.temperature, x).pressure, p, rtol=1e-9)


def test_a_pair_without_parameters_falls_back_to_unifac_with_a_caution(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    # Acetone and n-hexane have no DECHEMA set here: auto answers with UNIFAC and says so. Acetone and n-hexane
    # form a minimum-boiling azeotrope near 49.8 degC at 1 atm (CRC Handbook, azeotropic data; recalled), so an
    # equimolar liquid boils a little above it.
    mix = of(catalog, pairs, "acetone", "n-hexane")
    assert mix.model == "unifac"
    found = mix.bubble_point(ATMOSPHERE, binary(0.5))
    assert found.temperature[0] - 273.15 == pytest.approx(50.5, abs=1.5)
    assert any("UNIFAC" in str(w) for w in found.warnings)


def test_never_an_ideal_solution_unasked(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    with pytest.raises(Refusal, match="No built-in NRTL parameters for acetone/n-hexane"):
        of(catalog, pairs, "acetone", "n-hexane", model="nrtl")
    with pytest.raises(Refusal, match="No UNIFAC groups are assigned to ammonia"):
        of(catalog, pairs, "ethanol", "ammonia")
    # Original UNIFAC answers glycols with water badly (common practice, no source): refused, not predicted.
    with pytest.raises(Refusal, match="polyols with water"):
        of(catalog, pairs, "ethylene-glycol", "water")


def test_two_liquid_phases_are_refused(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    # Water and 1-butanol split into two liquids near their boiling points (a fact of the trade, no source).
    with pytest.raises(Refusal, match="two liquid phases"):
        of(catalog, pairs, "water", "1-butanol").bubble_point(ATMOSPHERE, binary(0.5))


def test_above_1_mpa_is_refused_and_above_half_warned(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    mix = of(catalog, pairs, "benzene", "toluene")
    with pytest.raises(OutOfRange):
        mix.bubble_point(np.array([1.2e6]), binary(0.5))
    assert mix.bubble_point(np.array([0.6e6]), binary(0.5)).warnings


def test_a_supercritical_component_is_refused(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    # Methanol's critical temperature is 512.5 K: at 520 K it cannot be a liquid (CRC Handbook, recalled).
    with pytest.raises(OutOfRange, match="temperature"):
        of(catalog, pairs, "methanol", "water").bubble_pressure(np.array([520.0]), binary(0.5))


def test_repeated_and_single_components_are_refused(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    with pytest.raises(Refusal):
        of(catalog, pairs, "ethanol", "ethanol")
    with pytest.raises(Refusal):
        of(catalog, pairs, "ethanol")


def test_an_associating_acid_is_refused(catalog: Catalog[Fluid], pairs: Pairs) -> None:
    # Acetic acid dimerises in the vapor (common practice, no source): the DECHEMA ethanol/acetic acid set exists,
    # but modified Raoult's law with an ideal vapor does not hold, so the mixture is refused, ideal or not.
    for model in ("auto", "ideal"):
        with pytest.raises(Refusal, match="dimerises in the vapor"):
            of(catalog, pairs, "ethanol", "acetic-acid", model=model)
