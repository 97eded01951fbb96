"""The absolute pressure on a liquid [Pa], from the readings a request gives.

``pressure`` is absolute and stands alone. Otherwise the local atmosphere comes from a barometer
reading on site, or from the elevation through the U.S. Standard Atmosphere 1976 (scaled by a
weather station's sea-level pressure if given), and a gauge reading adds to it. Readings that do
not fit together, and numbers no site can have, are refused.
"""

from __future__ import annotations

from dataclasses import dataclass, fields

import numpy as np

from service.fluids.cautions import Caution, Shown
from service.fluids.limits import Refusal, refuse_outside
from service.physics import atmosphere, site
from service.physics.array_blocks import Numbers

WEATHER_SPREAD = 0.03
"""Typical departure of real barometric pressure from the standard atmosphere (common practice, no source)."""
SEA_LEVEL_PRESSURE_RANGE = (85e3, 110e3)
"""Plausible reduced sea-level pressures [Pa]: the recorded extremes, about 87 kPa and 108.4 kPa (WMO, recalled
from memory), lie inside it."""

STANDARD_ATMOSPHERE_WARNING = (
    "The local atmospheric pressure is the U.S. Standard Atmosphere 1976 value for the given "
    "elevation, not a measurement: real barometric pressure departs from it with the weather by a "
    "few percent (typically within 3 %). Send barometric_pressure for a measured value."
)
SCALED_ATMOSPHERE_WARNING = (
    "The local atmospheric pressure is the U.S. Standard Atmosphere 1976 at the given elevation, scaled to "
    "the station's sea-level pressure: closer to today's weather than a standard day, but not a measurement "
    "on site. Send barometric_pressure for a measured value."
)


@dataclass(frozen=True)
class PressureReadings:
    """The ways a request may give the pressure on a liquid [Pa, m]; each is None when not given."""

    pressure: Numbers | None = None
    gauge_pressure: Numbers | None = None
    barometric_pressure: Numbers | None = None
    elevation: Numbers | None = None
    sea_level_pressure: Numbers | None = None

    def given(self) -> list[str]:
        """The names of the readings given."""
        return [f.name for f in fields(self) if getattr(self, f.name) is not None]


@dataclass(frozen=True)
class LocalPressure:
    """The absolute pressure the readings describe [Pa], and the local atmosphere when it took part.

    ``note`` is the caution owed when a model stands in for a barometer; ``standard_day`` is true when
    that model is the unscaled standard atmosphere, which the weather moves by a few percent.
    ``source`` names the reading the pressure is, unchanged (``pressure`` or ``barometric_pressure``).
    """

    value: Numbers
    atmosphere: Numbers | None = None
    note: str | None = None
    standard_day: bool = False
    source: str | None = None


def sea_level_pressure(sea_level: Numbers | None) -> Numbers | float:
    """A weather station's sea-level pressure [Pa], checked for plausibility, or the standard 101 325 Pa."""
    if sea_level is None:
        return atmosphere.SEA_LEVEL_PRESSURE
    low, high = SEA_LEVEL_PRESSURE_RANGE
    refuse_outside(
        "sea_level_pressure",
        "pressure",
        sea_level,
        low,
        high,
        "the lowest plausible sea-level pressure, {limit}",
        "the highest plausible sea-level pressure, {limit}",
    )
    return sea_level


def local_atmosphere(readings: PressureReadings) -> Numbers | None:
    """Absolute air pressure on site [Pa] from ``barometric_pressure`` or ``elevation``, if given."""
    baro, elevation = readings.barometric_pressure, readings.elevation
    if baro is not None and elevation is not None:
        raise Refusal(
            "Give barometric_pressure or elevation for the local atmosphere, not both.",
            {"barometric_pressure": ["conflicts with elevation"], "elevation": ["conflicts with barometric_pressure"]},
            400,
        )
    if readings.sea_level_pressure is not None and elevation is None:
        raise Refusal(
            "sea_level_pressure scales the standard atmosphere and needs elevation.",
            {"sea_level_pressure": ["needs elevation"]},
            400,
        )
    if baro is not None:
        refuse_outside(
            "barometric_pressure",
            "pressure",
            baro,
            *site.AIR_PRESSURE_RANGE,
            "{limit}, the lowest air pressure where people work (the standard atmosphere about 7,000 m up)",
            "{limit}, above the air pressure at the bottom of the deepest mines",
            read_as_air_pressure=True,
        )
        return baro
    if elevation is None:
        return None
    refuse_outside(
        "elevation",
        "length",
        elevation,
        atmosphere.MIN_ELEVATION,
        atmosphere.MAX_ELEVATION,
        "the bottom of the standard atmosphere, {limit}",
        "the top of the standard atmosphere, {limit}",
    )
    return atmosphere.pressure_at_elevation(elevation, sea_level_pressure(readings.sea_level_pressure))


def local_pressure(readings: PressureReadings) -> LocalPressure:
    """The absolute pressure [Pa]: ``pressure``, or the local atmosphere plus ``gauge_pressure``.

    >>> local = local_pressure(PressureReadings(gauge_pressure=np.float64(950e3), barometric_pressure=np.float64(86e3)))
    >>> float(local.value), local.note
    (1036000.0, None)
    """
    if readings.pressure is not None:
        extra = [name for name in readings.given() if name != "pressure"]
        if extra:
            raise Refusal(
                f"pressure is absolute and stands alone; leave out {', '.join(extra)} "
                "(or send gauge_pressure instead of pressure).",
                {name: ["conflicts with pressure"] for name in extra},
                400,
            )
        refuse_outside(
            "pressure", "pressure", readings.pressure, 0.0, None, "zero ({limit}): an absolute pressure is positive"
        )
        return LocalPressure(readings.pressure, source="pressure")
    air = local_atmosphere(readings)
    gauge = readings.gauge_pressure
    if air is None:
        field = "gauge_pressure" if gauge is not None else "pressure"
        raise Refusal(
            "Give pressure (absolute), or elevation or barometric_pressure (open to the "
            "atmosphere), or gauge_pressure with barometric_pressure or elevation.",
            {field: ["missing" if field == "pressure" else "needs barometric_pressure or elevation"]},
            400,
        )
    note, standard_day = None, False
    if readings.barometric_pressure is None:
        standard_day = readings.sea_level_pressure is None
        note = STANDARD_ATMOSPHERE_WARNING if standard_day else SCALED_ATMOSPHERE_WARNING
    if gauge is None:
        source = "barometric_pressure" if readings.barometric_pressure is not None else None
        return LocalPressure(air, air, note, standard_day, source)
    refuse_outside(
        "gauge_pressure", "pressure", gauge, -air, None, "{limit}, the deepest vacuum the local atmosphere allows"
    )
    return LocalPressure(air + gauge, air, note, standard_day)


def atmosphere_caution(local: LocalPressure, slope: Numbers) -> str | Caution | None:
    """The caution owed for the local atmosphere; on a standard day, with how far the weather moves a
    boiling point of slope dT/dp ``slope`` [K/Pa]."""
    if not local.standard_day or local.atmosphere is None:
        return local.note
    spread = np.abs(slope) * WEATHER_SPREAD * local.atmosphere
    largest = float(spread.max(initial=0.0)) if isinstance(spread, np.ndarray) else float(spread)
    return Caution(
        f"{local.note} A {WEATHER_SPREAD:.0%} change in the air pressure moves this boiling point by about {{spread}}.",
        True,
        {"spread": Shown(largest, "temperature difference", 2)},
    )
