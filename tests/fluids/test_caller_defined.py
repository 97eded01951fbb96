"""Fluids a caller defines: an equation as a handbook prints it, or one known boiling point."""

import pytest
from CoolProp.CoolProp import PropsSI

from service.fluids.caller_defined import fluid_from_boiling_point, fluid_from_equation
from tests.conftest import WATER_ANTOINE

# Water's handbook Antoine set (tests/conftest.py): 760.1 mmHg at 100 degC.
WATER = {"form": "antoine", **WATER_ANTOINE, "t_min": 274.15, "t_max": 373.15}


def test_an_equation_as_printed_answers_in_si() -> None:
    water = fluid_from_equation("still feed", WATER, None)
    assert float(water.saturation_pressure(373.15)) == pytest.approx(760.1 * 133.322387415, rel=1e-4)
    assert water.method == "Antoine equation with caller-supplied coefficients"
    assert water.notes and not water.tabulated


def test_an_equation_whose_pressure_falls_with_temperature_is_refused() -> None:
    with pytest.raises(ValueError, match="rise with temperature"):
        fluid_from_equation("wrong sign", WATER | {"B": -1730.63}, None)


def test_a_range_beyond_the_equation_is_refused() -> None:
    with pytest.raises(ValueError, match="range must lie inside"):
        fluid_from_equation("past the pole", WATER | {"t_min": 30.0}, None)  # C = 233.426: a pole at 39.7 K


def test_one_boiling_point_and_troutons_rule() -> None:
    # Ethanol boils at 351.44 K at 1 atm and has 38.56 kJ/mol there (CRC Handbook, recalled from memory); with its
    # own enthalpy the one-point fluid comes within 1.5 K of CoolProp's reference equation at 50 kPa (334.67 K).
    own = fluid_from_boiling_point("ethanol", 351.44, 101_325.0, 38_560.0)
    reference = PropsSI("T", "P", 50_000.0, "Q", 0, "Ethanol")
    assert float(own.saturation_temperature(50_000.0)) == pytest.approx(reference, abs=1.5)
    estimated = fluid_from_boiling_point("ethanol", 351.44, 101_325.0, None)
    assert "Trouton" in estimated.method and any("Trouton" in note for note in estimated.notes)
    with pytest.raises(ValueError):
        fluid_from_boiling_point("absurd", 0.5, 101_325.0, None)
