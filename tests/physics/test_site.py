"""The band of air pressure a barometer can read where people work, and the unit a number outside it meant."""

import pytest

from service.physics import atmosphere
from service.physics.site import AIR_PRESSURE_RANGE, units_read_as_air_pressure


def test_the_band_holds_every_working_site_of_the_standard_atmosphere() -> None:
    low, high = AIR_PRESSURE_RANGE
    # From the Dead Sea shore (about -430 m) to the highest mines and observatories (about 5,000 m to 6,000 m),
    # with the weather's few percent either way (elevations recalled from memory).
    for elevation in (-430.0, 0.0, 1420.0, 5100.0, 6000.0):
        p = float(atmosphere.pressure_at_elevation(elevation))
        assert low < 0.95 * p and 1.05 * p < high, elevation


@pytest.mark.parametrize(
    ("number", "first"),
    [(1013.0, "hPa"), (29.92, "inHg"), (14.7, "psi"), (760.0, "Torr"), (1.0, "atm"), (0.1, "MPa"), (85.4, "kPa")],
)
def test_a_sea_level_reading_is_traced_to_its_unit(number: float, first: str) -> None:
    # 1013 hPa, 29.92 inHg, 14.7 psi and 760 Torr are the usual ways to write one standard atmosphere
    # (common practice, no source).
    assert units_read_as_air_pressure(number)[0].code == first


def test_a_number_no_unit_makes_an_air_pressure_has_none() -> None:
    assert units_read_as_air_pressure(1e9) == [] and units_read_as_air_pressure(1e-9) == []
