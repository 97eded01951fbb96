"""Refusals and limits as data: what is refused, what is only cautioned, and the numbers kept in SI."""

import numpy as np
import pytest

from service.fluids.catalog import Catalog
from service.fluids.limits import Limit, Limits, OutOfRange, check_limits, refuse_outside

LIMITS = Limits(
    (Limit(273.16, 647.096, "the triple point, {limit}", "the critical point, {limit}"),),
    stated=(280.0, 600.0),
    reach=(275.0, 640.0),
    equation="the test equation",
)


def test_a_value_a_rounding_error_past_its_limit_counts_as_on_it() -> None:
    # 0.01 degC typed in Celsius comes back as 273.15999999999997 K (common practice, no source).
    refuse_outside("temperature", "temperature", 0.01 + 273.15, 273.16, None)
    with pytest.raises(OutOfRange):
        refuse_outside("temperature", "temperature", 273.15, 273.16, None)


def test_out_of_range_keeps_field_kind_limits_and_which_points() -> None:
    with pytest.raises(OutOfRange) as refused:
        refuse_outside("depth", "length", np.array([1.0, -2.0, 3.0]), 0.0, None, "the surface, {limit}")
    error = refused.value
    assert (error.field, error.kind, error.low, error.high, error.status) == ("depth", "length", 0.0, None, 422)
    assert error.too_low.tolist() == [False, True, False]
    assert error.below == "the surface, {limit}"


def test_outside_where_it_exists_is_refused_even_when_extrapolating() -> None:
    with pytest.raises(OutOfRange) as refused:
        check_limits(LIMITS, "temperature", "temperature", np.array([300.0, 700.0]), extrapolate=True)
    assert refused.value.above == "the critical point, {limit}"


def test_outside_the_stated_range_is_refused_unless_extrapolating() -> None:
    with pytest.raises(OutOfRange) as refused:
        check_limits(LIMITS, "temperature", "temperature", np.array([300.0, 620.0]), extrapolate=False)
    assert "send extrapolate=true" in refused.value.above
    [caution] = check_limits(LIMITS, "temperature", "temperature", np.array([300.0, 620.0]), extrapolate=True)
    assert caution.points.tolist() == [False, True]
    assert (caution.shown["low"].value, caution.shown["high"].value) == (280.0, 600.0)


def test_extrapolation_stops_at_its_reach() -> None:
    with pytest.raises(OutOfRange) as refused:
        check_limits(LIMITS, "temperature", "temperature", 645.0, extrapolate=True)
    assert "as far as the test equation can be extrapolated" in refused.value.above


def test_water_boils_between_its_triple_and_critical_pressures(catalog: Catalog) -> None:
    # IAPWS R6-95(2018): triple point 611.657 Pa, critical point 22.064 MPa and 647.096 K.
    water = catalog.get("water")
    [exists] = water.boiling_pressure_limits.exists
    assert (exists.low, exists.high) == pytest.approx((611.657, 22.064e6))
    [liquid] = water.liquid_temperature_limits.exists
    assert (liquid.low, liquid.high) == pytest.approx((273.16, 647.096))
    assert "sublimes" in exists.below and "freezes" in liquid.below
