"""The vapor-pressure forms, their slopes and their Newton inverse."""

import math

import numpy as np
import pytest

from service.physics import water
from service.physics.vapor_pressure import ExtendedAntoine, Wagner
from tests.conftest import WATER_ANTOINE as HANDBOOK

# Water's handbook Antoine set (tests/conftest.py), converted here to ln(p/Pa) and K.
_MMHG = 133.322387415
WATER_ANTOINE = ExtendedAntoine(
    a=math.log(_MMHG) + math.log(10) * HANDBOOK["A"], b=-math.log(10) * HANDBOOK["B"], c=HANDBOOK["C"] - 273.15
)


def test_antoine_water_boils_at_760_mmhg_at_100_degc() -> None:
    assert WATER_ANTOINE.pressure(373.15) / _MMHG == pytest.approx(760.0, abs=0.5)


def test_antoine_agrees_with_iapws_within_its_range() -> None:
    t = np.linspace(275.0, 373.0, 50)
    np.testing.assert_allclose(WATER_ANTOINE.pressure(t), water.saturation_pressure(t), rtol=0.01)


def test_dippr101_water_from_perry() -> None:
    # Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8, water: A = 73.649,
    # B = -7258.2, C = -7.3037, D = 4.1653e-6, E = 2 (recalled from memory), valid
    # 273.16-647.1 K; it tracks IAPWS within about 0.3 %.
    dippr = ExtendedAntoine(a=73.649, b=-7258.2, e=-7.3037, f=4.1653e-6, g=2.0)
    t = np.linspace(280.0, 640.0, 50)
    np.testing.assert_allclose(dippr.pressure(t), water.saturation_pressure(t), rtol=3e-3)


def test_wagner_is_the_water_equation() -> None:
    plain = Wagner(
        water.CRITICAL_TEMPERATURE, water.CRITICAL_PRESSURE, water.SATURATION.coefficients, water.SATURATION.exponents
    )
    t = np.linspace(273.16, 647.096, 20)
    np.testing.assert_array_equal(plain.pressure(t), water.saturation_pressure(t))


@pytest.mark.parametrize("equation", [WATER_ANTOINE, water.SATURATION], ids=["antoine", "wagner"])
def test_slope_and_inverse(equation) -> None:
    t = np.linspace(280.0, 370.0, 91)
    h = 1e-4
    numeric = (equation.pressure(t + h) - equation.pressure(t - h)) / (2 * h)
    np.testing.assert_allclose(equation.slope(t), numeric, rtol=1e-6)
    back = equation.temperature(equation.pressure(t), 274.0, 646.0)
    np.testing.assert_allclose(back, t, rtol=1e-12)


def test_inverse_clamps_to_the_bracket() -> None:
    # Pressures beyond the bracket come back as its nearer end: callers check the range first.
    out = WATER_ANTOINE.temperature(np.array([1.0, 1e9]), 280.0, 370.0)
    np.testing.assert_allclose(out, [280.0, 370.0])


def test_wagner_horner_matches_the_plain_sum() -> None:
    eq = water.SATURATION
    t = np.linspace(273.16, 647.0, 1001)
    tau = 1 - t / eq.critical_temperature
    plain = np.log(eq.critical_pressure) + eq.critical_temperature / t * sum(
        a * tau**e for a, e in zip(eq.coefficients, eq.exponents, strict=True)
    )
    np.testing.assert_allclose(eq.ln_pressure(t), plain, rtol=1e-14, atol=1e-13)
    odd = Wagner(eq.critical_temperature, eq.critical_pressure, (-7.8, 1.8), (1.0, 1.7))  # not half-integral
    plain_odd = np.log(eq.critical_pressure) + eq.critical_temperature / t * (-7.8 * tau + 1.8 * tau**1.7)
    np.testing.assert_allclose(odd.ln_pressure(t), plain_odd, rtol=1e-14)


def test_wagner_with_a_repeated_exponent_adds_its_terms() -> None:
    # Two terms with one exponent are one term with the summed coefficient (this once recursed forever).
    eq = water.SATURATION
    twice = Wagner(eq.critical_temperature, eq.critical_pressure, (-3.9, -3.95951783, 1.84408259), (1.0, 1.0, 1.5))
    once = Wagner(eq.critical_temperature, eq.critical_pressure, (-7.85951783, 1.84408259), (1.0, 1.5))
    t = np.linspace(300.0, 640.0, 11)
    np.testing.assert_allclose(twice.ln_pressure(t), once.ln_pressure(t), rtol=1e-14)
    np.testing.assert_allclose(twice.slope(t), once.slope(t), rtol=1e-13)


def test_single_values_equal_array_elements_exactly() -> None:
    # A single value runs as a numpy scalar, an array in blocks: the same operations, the same floats.
    p = np.geomspace(float(water.TRIPLE_PRESSURE), water.CRITICAL_PRESSURE, 997)
    t = water.saturation_temperature(p)
    assert [water.saturation_temperature(float(v)) for v in p] == t.tolist()
    assert [water.saturation_pressure_slope(float(v)) for v in t] == water.saturation_pressure_slope(t).tolist()
    assert [WATER_ANTOINE.pressure(float(v)) for v in t] == WATER_ANTOINE.pressure(t).tolist()


def test_every_form_gives_single_values_the_floats_of_an_array() -> None:
    # Forms whose powers are not square roots: np.power on a scalar runs numpy's loops, where
    # Python's ** on a numpy scalar would call the C library's pow.
    odd_wagner = Wagner(647.096, 22.064e6, (-7.86, 1.84, -11.79, 22.68), (1.0, 1.7, 3.3, 3.9))
    dippr101 = ExtendedAntoine(a=73.649, b=-7258.2, e=-7.3037, f=4.1653e-6, g=2.0)
    t = np.random.default_rng(101).uniform(290.0, 500.0, 2000)
    for function in (odd_wagner.pressure, odd_wagner.slope, dippr101.pressure, dippr101.slope, WATER_ANTOINE.slope):
        assert [function(float(v)) for v in t] == function(t).tolist(), function
