"""The absolute pressure on a liquid from a request's readings: what each combination means, and what is refused."""

import numpy as np
import pytest

from service.fluids.limits import OutOfRange, Refusal
from service.fluids.site_pressure import (
    SCALED_ATMOSPHERE_WARNING,
    STANDARD_ATMOSPHERE_WARNING,
    PressureReadings,
    atmosphere_caution,
    local_pressure,
)

ONE_KM = 89_876.0
"""U.S. Standard Atmosphere 1976, Table I: 1,000 m, 8.9876e4 Pa (recalled from memory; see tests/physics)."""


def test_absolute_pressure_stands_alone() -> None:
    local = local_pressure(PressureReadings(pressure=np.float64(250e3)))
    assert (float(local.value), local.atmosphere, local.note, local.source) == (250e3, None, None, "pressure")
    with pytest.raises(Refusal) as refused:
        local_pressure(PressureReadings(pressure=np.float64(250e3), elevation=np.float64(10.0)))
    assert refused.value.status == 400 and set(refused.value.fields) == {"elevation"}


def test_a_gauge_reads_above_the_local_atmosphere() -> None:
    # Absolute = gauge + local atmospheric pressure (the definition of gauge pressure; common practice, no source).
    local = local_pressure(PressureReadings(gauge_pressure=np.float64(950e3), barometric_pressure=np.float64(86e3)))
    assert float(local.value) == 1_036e3 and local.note is None and not local.standard_day


def test_elevation_gives_the_standard_atmosphere_with_its_caution() -> None:
    local = local_pressure(PressureReadings(elevation=np.float64(1000.0)))
    assert float(local.value) == pytest.approx(ONE_KM, rel=1e-4)
    assert local.standard_day and local.note == STANDARD_ATMOSPHERE_WARNING
    scaled = local_pressure(PressureReadings(elevation=np.float64(1000.0), sea_level_pressure=np.float64(102_000.0)))
    assert float(scaled.value) == pytest.approx(ONE_KM * 102_000 / 101_325, rel=1e-4)
    assert scaled.note == SCALED_ATMOSPHERE_WARNING and not scaled.standard_day


def test_a_vacuum_cannot_be_deeper_than_the_local_atmosphere() -> None:
    with pytest.raises(OutOfRange) as refused:
        local_pressure(PressureReadings(gauge_pressure=np.array([-50e3, -90e3]), barometric_pressure=np.float64(86e3)))
    assert refused.value.field == "gauge_pressure" and refused.value.too_low.tolist() == [False, True]


@pytest.mark.parametrize(
    ("readings", "fields"),
    [
        (PressureReadings(), {"pressure"}),
        (PressureReadings(gauge_pressure=np.float64(1.0)), {"gauge_pressure"}),
        (
            PressureReadings(barometric_pressure=np.float64(86e3), elevation=np.float64(1.0)),
            {"barometric_pressure", "elevation"},
        ),
        (
            PressureReadings(barometric_pressure=np.float64(86e3), sea_level_pressure=np.float64(1e5)),
            {"sea_level_pressure"},
        ),
    ],
)
def test_readings_that_do_not_fit_together_are_refused(readings: PressureReadings, fields: set[str]) -> None:
    with pytest.raises(Refusal) as refused:
        local_pressure(readings)
    assert refused.value.status == 400 and set(refused.value.fields) == fields


def test_a_barometer_reading_outside_the_air_pressure_band_is_refused_with_a_unit_hint() -> None:
    with pytest.raises(OutOfRange) as refused:
        local_pressure(PressureReadings(barometric_pressure=np.float64(1013.0)))  # hPa sent as Pa
    assert refused.value.read_as_air_pressure and refused.value.low == 40e3


def test_sea_level_pressure_must_be_plausible() -> None:
    with pytest.raises(OutOfRange) as refused:
        local_pressure(PressureReadings(elevation=np.float64(0.0), sea_level_pressure=np.float64(1013.0)))
    assert refused.value.field == "sea_level_pressure"


def test_a_standard_day_says_how_far_the_weather_moves_the_answer() -> None:
    local = local_pressure(PressureReadings(elevation=np.float64(1000.0)))
    slope = np.array([2.5e-4, 3e-4])  # dT/dp [K/Pa]
    caution = atmosphere_caution(local, slope)
    assert caution.shown["spread"].value == pytest.approx(3e-4 * 0.03 * float(local.value))
    measured = local_pressure(PressureReadings(barometric_pressure=np.float64(86e3)))
    assert atmosphere_caution(measured, slope) is None
