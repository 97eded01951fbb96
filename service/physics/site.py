"""The air pressure on a site: the band a barometer can read where people work, and which unit a
number outside it was probably written in.

The band runs from 40 kPa to 140 kPa:

- 40 kPa is the U.S. Standard Atmosphere 1976 about 7,000 m up (41.1 kPa), below the air
  pressure at the highest mines, observatories and settlements (about 5,000 m to 6,000 m,
  47 kPa to 54 kPa on a standard day, a few percent lower in bad weather);
- 140 kPa lies above the air pressure at the bottom of the deepest mines, about 2.5 km below
  sea level (the standard atmosphere gives 135 kPa there; depths recalled from memory), and far
  above the highest sea-level pressure on record, 108.4 kPa (WMO, recalled from memory).

A barometric reading outside it is almost always a number in another unit than the one it was sent
in: 1013 (hPa) or 29.92 (inHg) read as kPa. Climbers above 7,000 m and pressurised spaces give
their absolute pressure as `pressure` instead.

>>> [u.code for u in units_read_as_air_pressure(1013.0)]
['hPa', 'mbar', 'Torr', 'mmHg']
>>> [u.code for u in units_read_as_air_pressure(29.92)]
['inHg']
"""

from __future__ import annotations

import math

from service.physics.atmosphere import SEA_LEVEL_PRESSURE
from service.physics.units import UNITS, Unit

AIR_PRESSURE_RANGE = (40e3, 140e3)
"""Absolute air pressure [Pa] a barometer can read anywhere people work; see the module's docstring."""


def units_read_as_air_pressure(number: float) -> list[Unit]:
    """The pressure units in which ``number`` is an air pressure inside :data:`AIR_PRESSURE_RANGE`,
    nearest to the standard sea-level pressure first."""
    low, high = AIR_PRESSURE_RANGE
    fits = [u for u in UNITS.values() if u.dimension == "pressure" and low <= number * u.scale <= high]
    return sorted(fits, key=lambda u: abs(math.log(number * u.scale / SEA_LEVEL_PRESSURE)))


def air_pressure_readings(number: float) -> list[tuple[float, list[Unit]]]:
    """The air pressures [Pa] that ``number`` would be in the units it fits, each with its units: units
    of one size (hPa and mbar, Torr and mmHg) share a reading.

    >>> [(round(p), [u.code for u in units]) for p, units in air_pressure_readings(853.9)]
    [(113844, ['Torr', 'mmHg']), (85390, ['hPa', 'mbar'])]
    """
    readings: list[tuple[float, list[Unit]]] = []
    for unit in units_read_as_air_pressure(number):
        alike = next((units for p, units in readings if math.isclose(p, number * unit.scale, rel_tol=1e-3)), None)
        if alike is None:
            readings.append((number * unit.scale, [unit]))
        else:
            alike.append(unit)
    return readings
