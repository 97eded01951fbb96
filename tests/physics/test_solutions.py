"""Water activity, vapor pressure and boiling point of aqueous solutions against published values and references."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI

from service.fluids.solutes import Solute, load_solutes
from service.physics import water
from service.physics.solutions import SoluteEquation

ATMOSPHERE = 101_325.0
SOLUTES = load_solutes()
IDS = sorted(SOLUTES.entries)


def equation(solute_id: str) -> SoluteEquation:
    return SOLUTES.entries[solute_id].equation


def boils_at_one_atmosphere(solute_id: str, mass_fraction: float) -> float:
    """The boiling point [degC] at 101 325 Pa."""
    return float(equation(solute_id).boiling_temperature(ATMOSPHERE, mass_fraction)) - 273.15


def test_sucrose_60_brix() -> None:
    # 60 degBx syrup boils at about 102.9 degC at 1 atm: commonly quoted in the sugar industry (recalled from memory).
    assert boils_at_one_atmosphere("sucrose", 0.60) == pytest.approx(102.9, abs=0.5)


def test_seawater_elevation_at_one_atmosphere() -> None:
    # Sharqawy, Lienhard and Zubair (2010), eq. (36), accuracy +-0.018 K: about 0.52 K at 35 g/kg near 100 degC.
    elevation = boils_at_one_atmosphere("sea-salt", 0.035) + 273.15 - water.saturation_temperature(ATMOSPHERE)
    assert elevation == pytest.approx(0.52, abs=0.02)


@pytest.mark.parametrize("celsius", [40.0, 60.0])
def test_seawater_water_activity_against_teos10(celsius: float) -> None:
    # Reference: TEOS-10 through the gsw package, a_w = exp((mu_w(SA) - mu_w(0)) / (R_w T)), mu_w [J/g] at sea
    # pressure 0 dbar; R_w = 0.461523 J/(g K) = 8.314472 / 18.015268, the TEOS-10 manual's specific gas constant
    # of water. 2 % of ln a_w (about 0.02 here) is under 0.01 K of boiling-point elevation at these temperatures,
    # inside Sharqawy's stated +-0.018 K (found: 1.5 % at 40 degC, 1.0 % at 60 degC).
    gsw = pytest.importorskip("gsw")
    t = celsius + 273.15
    mu = gsw.chem_potential_water_t_exact(35.0, celsius, 0.0) - gsw.chem_potential_water_t_exact(0.0, celsius, 0.0)
    reference = mu / (0.461523 * t)
    assert np.log(equation("sea-salt").water_activity(t, 0.035)) == pytest.approx(reference, rel=0.02)


def test_saturated_brine() -> None:
    # Saturated sodium chloride brine boils at about 108.7 degC at 1 atm (handbook value, recalled from memory);
    # halite's solubility there is about 28.2 wt% (Sparrow 2003, eq. (1), as in data/solutes/sodium-chloride.toml).
    assert boils_at_one_atmosphere("sodium-chloride", 0.282) == pytest.approx(108.7, abs=0.5)


def test_caustic_soda_50_percent() -> None:
    # Dow's caustic soda handbook: 50 % NaOH boils at "approximately 145 degC" at 1 atm (as quoted; recalled, not
    # rechecked). Olsson, Jernqvist and Aly's equation gives 146.3 degC: the handbook figure is a round number,
    # hence 1.5 K.
    assert boils_at_one_atmosphere("sodium-hydroxide", 0.50) == pytest.approx(145.0, abs=1.5)


def test_lithium_bromide_vapor_pressure() -> None:
    # Patek and Klomfar (2006): about 0.66 kPa at 60 wt%, 40 degC (value as quoted in the equation's docstring,
    # not rechecked against the paper's tables).
    assert equation("lithium-bromide").vapor_pressure(313.15, 0.60) == pytest.approx(660.0, rel=0.02)


def test_lithium_bromide_against_coolprop() -> None:
    # Reference: CoolProp 8.0.0's incompressible INCOMP::LiBr (a fit, itself based on Patek and Klomfar): 672 Pa.
    reference = PropsSI("P", "T", 313.15, "Q", 0, "INCOMP::LiBr[0.6]")
    assert equation("lithium-bromide").vapor_pressure(313.15, 0.60) == pytest.approx(reference, rel=0.02)


def test_calcium_chloride_activity_falls_with_concentration() -> None:
    # Conde (2004)'s equation puts 30 wt% at 1 atm near 109.0 degC; no independent value at hand, so a property:
    # a_w falls monotonically with concentration and stays between 0 and 1 (thermodynamics, no source needed).
    activity = equation("calcium-chloride").water_activity(298.15, np.linspace(0.05, 0.5, 46))
    assert np.all(np.diff(activity) < 0.0)
    assert np.all((activity > 0.0) & (activity < 1.0))


@pytest.mark.parametrize("solute_id", IDS)
def test_zero_concentration_is_pure_water_exactly(solute_id: str) -> None:
    # IAPWS 1992 (service.physics.water) is the pure-water limit of every solution, by construction.
    pressures = np.geomspace(5e3, 400e3, 25)
    temperatures = water.saturation_temperature(pressures)
    eq = equation(solute_id)
    assert np.all(eq.water_activity(temperatures, 0.0) == 1.0)
    np.testing.assert_array_equal(eq.vapor_pressure(temperatures, 0.0), water.saturation_pressure(temperatures))
    np.testing.assert_array_equal(eq.boiling_temperature(pressures, 0.0), temperatures)


def inside(solute: Solute) -> list[float]:
    """Two mass fractions within the solute's stated range at 350 K."""
    top = float(solute.stated_max.at(350.0))
    return [0.3 * top, 0.8 * top]


@pytest.mark.parametrize("solute_id", IDS)
def test_boiling_point_round_trip(solute_id: str) -> None:
    # Self-consistency: the boiling point found at p has vapor pressure p (Newton stops at 1e-10 K).
    solute = SOLUTES.entries[solute_id]
    pressures = np.linspace(20e3, 300e3, 15)
    for w in inside(solute):
        t = solute.equation.boiling_temperature(pressures, w)
        kept = (t >= solute.t_min) & (t <= solute.t_max)
        assert np.count_nonzero(kept) >= 5
        ratio = solute.equation.vapor_pressure(t[kept], w) / pressures[kept]
        np.testing.assert_allclose(ratio, 1.0, rtol=0.0, atol=1e-9)


@pytest.mark.parametrize("solute_id", IDS)
def test_vapor_pressure_slope_is_the_derivative(solute_id: str) -> None:
    # Self-consistency: dp/dT against a central difference of p itself, step 1 mK.
    solute = SOLUTES.entries[solute_id]
    t, step = np.array([300.0, 350.0, 400.0]), 1e-3
    for w in inside(solute):
        difference = (solute.equation.vapor_pressure(t + step, w) - solute.equation.vapor_pressure(t - step, w)) / (
            2 * step
        )
        np.testing.assert_allclose(solute.equation.vapor_pressure_slope(t, w), difference, rtol=1e-5)


@pytest.mark.parametrize("solute_id", IDS)
def test_arrays_broadcast_as_points(solute_id: str) -> None:
    # Self-consistency: an array of concentrations with an array of pressures answers as point by point.
    eq = equation(solute_id)
    w = np.array([0.0, *inside(SOLUTES.entries[solute_id])])
    p = np.array([50e3, 101_325.0, 200e3])
    t = eq.boiling_temperature(p, w)
    assert t.shape == (3,)
    one_by_one = [float(eq.boiling_temperature(pi, wi)) for pi, wi in zip(p, w, strict=True)]
    np.testing.assert_allclose(t, one_by_one, rtol=1e-12)
    np.testing.assert_allclose(
        eq.vapor_pressure(t, w), [float(eq.vapor_pressure(*pt)) for pt in zip(t, w, strict=True)], rtol=1e-12
    )
