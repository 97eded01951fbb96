"""Azeotropes of binaries at 1 atm against published data (source beside each check)."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.azeotrope import azeotrope
from service.fluids.limits import Refusal
from service.fluids.site_pressure import PressureReadings
from tests.conftest import MixtureOf

ONE_ATMOSPHERE = PressureReadings(pressure=np.float64(101_325.0))


@pytest.mark.parametrize(
    ("first", "second", "boils", "x1"),
    [
        # The published point: near 78.15 degC at x = 0.894 (95.6 wt% ethanol).
        ("ethanol", "water", 78.15, 0.894),
        # Maximum-boiling: CRC Handbook, azeotropic data, about 64.5 degC at 34 mol% acetone (recalled).
        ("acetone", "chloroform", 64.5, 0.34),
        # CRC Handbook, azeotropic data: about 67.9 degC at 44.8 mol% ethanol (recalled).
        ("ethanol", "benzene", 67.9, 0.448),
    ],
)
def test_published_azeotropes(mixture_of: MixtureOf, first: str, second: str, boils: float, x1: float) -> None:
    mix = mixture_of(first, second)
    found = azeotrope(mix, ONE_ATMOSPHERE)
    assert found.temperature - 273.15 == pytest.approx(boils, abs=0.5)
    assert found.composition[0] == pytest.approx(x1, abs=0.02)
    # At the azeotrope the vapor has the liquid's composition.
    vapor = mix.bubble_point(np.array([101_325.0]), found.composition[None, :]).other[0]
    np.testing.assert_allclose(vapor, found.composition, atol=1e-9)


def test_none_says_why(mixture_of: MixtureOf) -> None:
    # Benzene and toluene form no azeotrope: benzene is the lighter throughout (a fact of the trade, no source).
    mix = mixture_of("benzene", "toluene")
    found = azeotrope(mix, ONE_ATMOSPHERE)
    assert found.temperature is None and "Benzene is the more volatile" in found.reason


def test_a_search_across_two_liquids_is_refused_plainly(mixture_of: MixtureOf) -> None:
    # Water and benzene form a heterogeneous azeotrope (a fact of the trade): refused, without naming the
    # search's internal grid points as the request's.
    with pytest.raises(Refusal, match="single-liquid azeotrope is not looked for") as refused:
        azeotrope(mixture_of("water", "benzene", model="ideal"), ONE_ATMOSPHERE)
    assert "point" not in refused.value.message
