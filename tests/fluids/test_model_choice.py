"""Which model answers a mixture: fitted pairs, the UNIFAC fallback said in the answer, ideal only when asked;
and the refusals of a mixture's make-up."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.limits import Refusal
from service.fluids.mixture import Model
from tests.conftest import MixtureOf

ATMOSPHERE = np.array([101_325.0])
EQUIMOLAR = np.array([[0.5, 0.5]])


def test_a_pair_without_parameters_falls_back_to_unifac_with_a_caution(mixture_of: MixtureOf) -> None:
    # Acetone and n-hexane have no DECHEMA set here: auto answers with UNIFAC and says so. Acetone and n-hexane
    # form a minimum-boiling azeotrope near 49.8 degC at 1 atm (CRC Handbook, azeotropic data; recalled), so an
    # equimolar liquid boils a little above it.
    mix = mixture_of("acetone", "n-hexane")
    assert mix.model == "unifac"
    found = mix.bubble_point(ATMOSPHERE, EQUIMOLAR)
    assert found.temperature[0] - 273.15 == pytest.approx(50.5, abs=1.5)
    assert any("UNIFAC" in str(w) for w in found.warnings)


def test_never_an_ideal_solution_unasked(mixture_of: MixtureOf) -> None:
    for model, name in (("nrtl", "NRTL"), ("wilson", "Wilson"), ("uniquac", "UNIQUAC")):
        with pytest.raises(Refusal, match=f"No built-in {name} parameters for acetone/n-hexane"):
            mixture_of("acetone", "n-hexane", model=model)
    with pytest.raises(Refusal, match="No UNIFAC groups are assigned to ammonia"):
        mixture_of("ethanol", "ammonia")
    # Original UNIFAC answers glycols with water badly (common practice, no source): refused, not predicted.
    with pytest.raises(Refusal, match="polyols with water"):
        mixture_of("ethylene-glycol", "water")


@pytest.mark.parametrize("model", ["wilson", "uniquac"])
def test_fitted_models_cite_their_sets(mixture_of: MixtureOf, model: Model) -> None:
    methods = [method for method, _ in mixture_of("ethanol", "water", model=model).citations]
    assert methods[0] == {"wilson": "Wilson (1964)", "uniquac": "UNIQUAC (Abrams and Prausnitz 1975)"}[model]
    assert ("UNIQUAC volume r and area q of each component" in methods) == (model == "uniquac")


def test_repeated_and_single_components_are_refused(mixture_of: MixtureOf) -> None:
    with pytest.raises(Refusal):
        mixture_of("ethanol", "ethanol")
    with pytest.raises(Refusal):
        mixture_of("ethanol")


def test_an_associating_acid_is_refused(mixture_of: MixtureOf) -> None:
    # Acetic acid dimerises in the vapor (common practice, no source): the DECHEMA ethanol/acetic acid set exists,
    # but modified Raoult's law with an ideal vapor does not hold, so the mixture is refused, ideal or not.
    for model in ("auto", "ideal"):
        with pytest.raises(Refusal, match="dimerises in the vapor"):
            mixture_of("ethanol", "acetic-acid", model=model)


@pytest.mark.parametrize("model", ["auto", "unifac", "unifac-dortmund"])
def test_glycol_with_water_is_refused_with_the_way_to_ask(mixture_of: MixtureOf, model: Model) -> None:
    with pytest.raises(Refusal, match="model=ideal"):
        mixture_of("ethylene-glycol", "water", model=model)


def test_an_ideal_solution_says_so(mixture_of: MixtureOf) -> None:
    mix = mixture_of("benzene", "toluene", model="ideal")
    assert any("as the request asked" in str(w) for w in mix.bubble_point(ATMOSPHERE, EQUIMOLAR).warnings)
    assert mix.citations[0][0] == "Raoult's law (an ideal solution)"
