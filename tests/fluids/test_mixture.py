"""Liquid mixtures against published equilibrium data (source beside each check) and their refusals."""

from __future__ import annotations

import numpy as np
import pytest

from service.fluids.limits import OutOfRange
from service.fluids.mixture import Model, phase_point
from service.fluids.site_pressure import PressureReadings
from tests.conftest import MixtureOf

ATMOSPHERE = np.array([101_325.0])


def binary(x1: float) -> np.ndarray:
    return np.array([[x1, 1.0 - x1]])


@pytest.mark.parametrize(
    ("x1", "boils", "y1"),
    # Ethanol and water at 101.325 kPa, the published equilibrium points (recalled from memory;
    # the classic data set of Perry's Chemical Engineers' Handbook, Table 13-1): x, T [degC], y.
    [(0.097, 86.7, 0.438), (0.508, 79.8, 0.656), (0.894, 78.15, 0.894)],
)
@pytest.mark.parametrize("model", ["auto", "nrtl", "wilson", "uniquac"])
def test_ethanol_water_bubble_points(mixture_of: MixtureOf, model: Model, x1: float, boils: float, y1: float) -> None:
    found = mixture_of("ethanol", "water", model=model).bubble_point(ATMOSPHERE, binary(x1))
    assert found.temperature[0] - 273.15 == pytest.approx(boils, abs=0.5)
    assert found.other[0, 0] == pytest.approx(y1, abs=0.02)


def test_benzene_toluene_by_raoults_law(mixture_of: MixtureOf) -> None:
    # Raoult's law at x = 0.5 and 101.325 kPa: about 92.0 degC, y near 0.714 (the textbook values).
    found = mixture_of("benzene", "toluene", model="ideal").bubble_point(ATMOSPHERE, binary(0.5))
    assert found.temperature[0] - 273.15 == pytest.approx(92.0, abs=0.5)
    assert found.other[0, 0] == pytest.approx(0.714, abs=0.01)


def test_a_pure_component_boils_at_its_own_boiling_point(mixture_of: MixtureOf) -> None:
    water = mixture_of.catalog.get("water")
    found = mixture_of("ethanol", "water").bubble_point(ATMOSPHERE, binary(0.0))
    assert found.temperature[0] == water.saturation_temperature(ATMOSPHERE)[0]


def test_dew_point_of_the_bubble_vapor(mixture_of: MixtureOf) -> None:
    mix = mixture_of("methanol", "ethanol", "water")
    x = np.array([[0.2, 0.3, 0.5], [0.05, 0.05, 0.9]])
    p = np.full(2, 101_325.0)
    bubble = mix.bubble_point(p, x)
    dew = mix.dew_point(p, bubble.other)
    np.testing.assert_allclose(dew.temperature, bubble.temperature, atol=1e-8)
    np.testing.assert_allclose(dew.other, x, atol=1e-8)
    np.testing.assert_allclose(mix.bubble_pressure(bubble.temperature, x).pressure, p, rtol=1e-9)


def test_above_1_mpa_is_refused_and_above_half_warned(mixture_of: MixtureOf) -> None:
    mix = mixture_of("benzene", "toluene")
    with pytest.raises(OutOfRange):
        mix.bubble_point(np.array([1.2e6]), binary(0.5))
    assert mix.bubble_point(np.array([0.6e6]), binary(0.5)).warnings


def test_a_supercritical_component_is_refused(mixture_of: MixtureOf) -> None:
    # Methanol's critical temperature is 512.5 K: at 520 K it cannot be a liquid (CRC Handbook, recalled).
    with pytest.raises(OutOfRange, match="temperature"):
        mixture_of("methanol", "water").bubble_pressure(np.array([520.0]), binary(0.5))


def test_glycol_coolant_by_raoults_law(mixture_of: MixtureOf) -> None:
    # 50 wt% ethylene glycol in water boils near 107 degC at 1 atm (the value; coolant tables give about
    # 107 degC, recalled from memory). No fitted pair is at hand and the group methods are refused for glycols with
    # water; Raoult's law, asked for, lands on the published point: the pair is close to ideal there.
    mix = mixture_of("ethylene-glycol", "water", model="ideal")
    moles = np.array([0.5, 0.5]) / [fluid.molar_mass for fluid in mix.components]
    found = mix.bubble_point(ATMOSPHERE, (moles / moles.sum())[None, :])
    assert found.temperature[0] - 273.15 == pytest.approx(107.0, abs=1.0)


def test_components_sharing_an_equation_are_cited_once(mixture_of: MixtureOf) -> None:
    methods = [method for method, _ in mixture_of("methanol", "ethanol", "water").citations]
    assert [m for m in methods[1:] if not m.startswith("two liquid phases tested")] == [
        "Methanol, Ethanol: Wagner 2.5-5 equation (PPDS form)",
        "Water: IAPWS 1992 saturation-pressure equation (Wagner and Pruss)",
    ]


def test_relative_volatility_of_a_binary(mixture_of: MixtureOf) -> None:
    # alpha = (y1/x1) / (y2/x2), the definition; only for two components.
    x = np.array([[0.1, 0.9]])
    found = phase_point(mixture_of("ethanol", "water"), False, x, "mole", PressureReadings(pressure=ATMOSPHERE))
    y = found.other[0]
    assert found.relative_volatility[0] == pytest.approx((y[0] / x[0, 0]) / (y[1] / x[0, 1]), rel=1e-9)
    three = phase_point(
        mixture_of("methanol", "ethanol", "water"),
        False,
        np.array([[0.1, 0.1, 0.8]]),
        "mole",
        PressureReadings(pressure=ATMOSPHERE),
    )
    assert three.relative_volatility is None
