"""Water saturation against IAPWS-IF97's verification tables and IAPWS-95."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI
from iapws import IAPWS95

from service.physics import water

# IAPWS-IF97 (Revised Release, 2007), Table 35: saturation pressure [MPa] at T [K], and
# Table 36: saturation temperature [K] at p [MPa]. IF97 region 4 differs from the 1992
# equation used here by up to about 0.01 K and a few hundredths of a percent in pressure,
# so these check the level of agreement, not the last digit.
IF97_TABLE_35 = [(300.0, 0.353658941e-2), (500.0, 0.263889776e1), (600.0, 0.123443146e2)]
IF97_TABLE_36 = [(0.1, 0.372755919e3), (1.0, 0.453035632e3), (10.0, 0.584149488e3)]


@pytest.mark.parametrize(("t", "p_mpa"), IF97_TABLE_35)
def test_if97_table_35(t: float, p_mpa: float) -> None:
    assert water.saturation_pressure(t) == pytest.approx(p_mpa * 1e6, rel=2.5e-4)


@pytest.mark.parametrize(("p_mpa", "t"), IF97_TABLE_36)
def test_if97_table_36(p_mpa: float, t: float) -> None:
    assert water.saturation_temperature(p_mpa * 1e6) == pytest.approx(t, abs=0.01)


@pytest.mark.parametrize(("p_mpa", "t"), IF97_TABLE_36)
def test_if97_backward_equation_starts_the_inverse(p_mpa: float, t: float) -> None:
    # The starting guess is IF97 eq. (31) itself, so it reproduces Table 36 to its digits.
    guess = water.SATURATION.initial_temperature(np.log(p_mpa * 1e6), 0.0, 0.0)
    assert guess == pytest.approx(t, abs=5e-7)


def test_normal_boiling_point_on_its90() -> None:
    # 99.974 degC at 101.325 kPa on ITS-90 (common practice, no source; IAPWS 1992 gives 373.1243 K).
    assert water.saturation_temperature(101_325.0) - 273.15 == pytest.approx(99.974, abs=5e-4)


def test_fixed_points_of_the_release() -> None:
    # The 1992 release: p = 611.657 Pa at the triple point, 22.064 MPa at Tc = 647.096 K.
    assert water.TRIPLE_PRESSURE == pytest.approx(611.657, abs=5e-4)
    assert water.saturation_pressure(water.CRITICAL_TEMPERATURE) == pytest.approx(22.064e6, rel=1e-12)
    assert water.saturation_temperature(water.TRIPLE_PRESSURE) == pytest.approx(273.16, abs=1e-9)


def test_against_iapws95_from_coolprop_over_the_whole_range() -> None:
    # Reference: CoolProp's IAPWS-95 (Wagner and Pruss 2002) saturation, triple to critical.
    t = np.linspace(273.16, 647.09, 400)
    p_ref = np.array([PropsSI("P", "T", v, "Q", 0, "Water") for v in t])
    np.testing.assert_allclose(water.saturation_pressure(t), p_ref, rtol=1e-4)  # 0.01 %
    assert np.max(np.abs(water.saturation_temperature(p_ref) - t)) < 0.003


def test_against_iapws95_from_the_iapws_package() -> None:
    # Reference: the iapws package's IAPWS-95 (J. M. Romera), saturated liquid at T.
    for t in (280.0, 373.15, 450.0, 600.0, 640.0):
        assert water.saturation_pressure(t) == pytest.approx(IAPWS95(T=t, x=0).P * 1e6, rel=1e-4)


def test_slopes_match_finite_differences_and_each_other() -> None:
    t = np.linspace(274.0, 646.0, 50)
    h = 1e-4
    numeric = (water.saturation_pressure(t + h) - water.saturation_pressure(t - h)) / (2 * h)
    np.testing.assert_allclose(water.saturation_pressure_slope(t), numeric, rtol=1e-7)
    p = water.saturation_pressure(t)
    np.testing.assert_allclose(water.saturation_temperature_slope(p) * water.saturation_pressure_slope(t), 1.0)


def test_inverse_converges_for_every_valid_pressure() -> None:
    p = np.geomspace(water.TRIPLE_PRESSURE, water.CRITICAL_PRESSURE, 1_000_001)
    t = water.saturation_temperature(p)
    assert np.all((t >= water.TRIPLE_TEMPERATURE) & (t <= water.CRITICAL_TEMPERATURE))
    np.testing.assert_allclose(water.saturation_pressure(t), p, rtol=1e-9)


def test_common_practice_high_elevation() -> None:
    # Common practice, no source: water boils near 70 degC at about 8,800 m (~31.5 kPa).
    assert water.saturation_temperature(31_500.0) - 273.15 == pytest.approx(70.0, abs=1.0)
