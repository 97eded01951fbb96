"""The questions the paths ask, answered below the API in SI: numbers, refusals, cautions and citations."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI

from service.fluids import questions
from service.fluids.caller_defined import fluid_from_boiling_point
from service.fluids.catalog import Catalog
from service.fluids.fluid import Fluid
from service.fluids.limits import OutOfRange, Refusal
from service.fluids.site_pressure import PressureReadings
from service.physics.units import STANDARD_GRAVITY

ATMOSPHERE = PressureReadings(pressure=np.float64(101_325.0))


@pytest.fixture(scope="module")
def water(catalog: Catalog) -> Fluid:
    return catalog.get("water")


def test_boiling_point_of_water_at_one_atmosphere(water: Fluid) -> None:
    # IAPWS: the normal boiling point on ITS-90 is 99.974 degC (IAPWS R6-95(2018), recalled from memory).
    found = questions.boiling_point(water, ATMOSPHERE)
    assert float(found.temperature) == pytest.approx(373.124, abs=1e-3)
    # dp/dT at the normal boiling point is 3.617 kPa/K (CoolProp, IAPWS-95, as reference).
    slope = PropsSI("d(P)/d(T)|sigma", "P", 101_325.0, "Q", 0, "Water")
    assert 1 / float(found.slope) == pytest.approx(slope, rel=1e-3)
    assert found.citations == [(water.method, water.source)]


def test_uncertainty_of_the_boiling_point_follows_the_slope(water: Fluid) -> None:
    found = questions.boiling_point(water, ATMOSPHERE, pressure_uncertainty=np.float64(100.0))
    assert float(found.uncertainty) == pytest.approx(100.0 * float(found.slope))
    with pytest.raises(OutOfRange):
        questions.boiling_point(water, ATMOSPHERE, pressure_uncertainty=np.float64(-1.0))


def test_below_the_surface_the_liquid_boils_under_its_own_head(water: Fluid) -> None:
    found = questions.boiling_point(water, ATMOSPHERE, depth=np.float64(2.0))
    density = water.liquid_density.density(found.temperature)
    # p = p_surface + rho(T_sat(p)) g depth, solved to well under a pascal.
    assert float(found.pressure) == pytest.approx(101_325.0 + float(density) * STANDARD_GRAVITY * 2.0, abs=0.01)
    assert found.citations[1] == (water.liquid_density.method, water.liquid_density.source)
    with pytest.raises(OutOfRange):
        questions.boiling_point(water, ATMOSPHERE, depth=np.float64(-1.0))


def test_a_liquid_without_a_density_has_no_head() -> None:
    caller = fluid_from_boiling_point("test liquid", 350.0, 101_325.0, 35e3)
    with pytest.raises(Refusal) as refused:
        questions.boiling_point(caller, ATMOSPHERE, depth=np.float64(1.0))
    assert refused.value.fields == {"fluid": ["no liquid density correlation"]}


def test_near_the_critical_point_a_caution_names_it(water: Fluid) -> None:
    found = questions.boiling_point(water, PressureReadings(pressure=np.array([1e5, 21e6])))
    [caution] = [w for w in found.warnings if not isinstance(w, str)]
    assert caution.points.tolist() == [False, True] and caution.shown["critical"].value == 647.096


def test_vapor_pressure_of_water(water: Fluid) -> None:
    # CoolProp's IAPWS-95 as the reference at 70 degC; the 1992 equation agrees with it to about 1e-4.
    found = questions.vapor_pressure(water, np.float64(343.15))
    assert float(found.pressure) == pytest.approx(PropsSI("P", "T", 343.15, "Q", 0, "Water"), rel=1e-4)
    with pytest.raises(OutOfRange) as refused:
        questions.vapor_pressure(water, np.float64(700.0))
    assert refused.value.field == "temperature" and refused.value.high == 647.096


def test_elevation_of_a_pressure_and_of_a_boiling_point(water: Fluid) -> None:
    # U.S. Standard Atmosphere 1976, Table I: 1,000 m has 8.9876e4 Pa (recalled from memory).
    assert float(questions.elevation(None, pressure=np.float64(89_876.0)).elevation) == pytest.approx(1000.0, abs=1.0)
    found = questions.elevation(water, boiling_point=water.saturation_temperature(89_876.0))
    assert float(found.elevation) == pytest.approx(1000.0, abs=1.0)
    assert found.citations[0] == (water.method, water.source)
    with pytest.raises(Refusal) as refused:
        questions.elevation(water)
    assert refused.value.status == 400


def test_saturation_margin_and_its_band(water: Fluid) -> None:
    measured = np.array([373.124 - 5.0, 373.124 - 0.05, 373.124 + 1.0])
    found = questions.saturation_margin(water, ATMOSPHERE, measured)
    assert found.state.tolist() == ["subcooled", "saturated", "superheated"]
    # A 1 kPa reading uncertainty widens the band by k = 2 times 0.28 K (GUM, k = 2): 1 K above is now saturated.
    widened = questions.saturation_margin(water, ATMOSPHERE, measured, pressure_uncertainty=np.float64(2_000.0))
    assert widened.state.tolist() == ["subcooled", "saturated", "saturated"]


def test_npsh_available_from_cold_water_open_to_one_atmosphere(water: Fluid) -> None:
    # (101.325 - 2.339) kPa / (998.2 kg/m3 g) = 10.11 m at 20 degC (IAPWS values recalled from memory).
    found = questions.npsh_available(water, ATMOSPHERE, np.float64(293.15), np.float64(0.0))
    assert float(found.npsh) == pytest.approx(10.11, abs=0.01)
    assert float(found.friction_loss) == 0.0 and found.warnings[-1] == questions.NPSH_CAUTION
    hot = questions.npsh_available(water, ATMOSPHERE, np.float64(372.0), np.float64(-1.0))
    assert any("negative" in getattr(w, "text", "") for w in hot.warnings)
    with pytest.raises(OutOfRange):
        questions.npsh_available(water, ATMOSPHERE, np.float64(293.15), np.float64(0.0), np.float64(-0.5))


def test_standard_air_at_one_kilometre() -> None:
    # U.S. Standard Atmosphere 1976, Table I: 1,000 m, 281.651 K, 8.9876e4 Pa, 1.1117 kg/m3 (recalled from memory).
    air = questions.standard_air(np.float64(1000.0))
    assert (float(air.temperature), float(air.pressure), float(air.density)) == pytest.approx(
        (281.651, 89_876.0, 1.1117), rel=1e-4
    )
    assert air.warnings == [questions.STANDARD_DAY_WARNING]
    assert questions.standard_air(np.float64(1000.0), np.float64(101_000.0)).warnings == []
