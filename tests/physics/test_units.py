"""Unit conversions against their defining values."""

import numpy as np
import pytest

from service.physics.units import DEFAULT_UNITS, UNITS, codes, resolve_unit

# Exact factors by definition: CGPM 1954 (atm), the 1959 international yard and pound
# (ft, psi), conventional mercury columns (NIST SP 811, appendix B.8: mmHg, inHg).
EXACT = [
    ("atm", "pressure", 101_325.0),
    ("psi", "pressure", 6894.757293168),
    ("mmHg", "pressure", 133.322387415),
    ("Torr", "pressure", 101_325.0 / 760),
    ("inHg", "pressure", 3386.389),
    ("bar", "pressure", 1e5),
    ("hPa", "pressure", 100.0),
    ("mbar", "pressure", 100.0),
    ("MPa", "pressure", 1e6),
    ("ft", "length", 0.3048),
    ("km", "length", 1000.0),
]


@pytest.mark.parametrize(("code", "dimension", "pascal"), EXACT)
def test_exact_factors(code: str, dimension: str, pascal: float) -> None:
    assert resolve_unit(code, dimension).to_si(1.0) == pytest.approx(pascal, rel=1e-15)


@pytest.mark.parametrize(
    ("value", "unit", "kelvin"),
    [(0.0, "degC", 273.15), (212.0, "degF", 373.15), (-40.0, "degF", 233.15), (491.67, "degR", 273.15)],
)
def test_temperature_scales(value: float, unit: str, kelvin: float) -> None:
    # ITS-90 scale definitions, common practice, no source.
    assert resolve_unit(unit, "temperature").to_si(value) == pytest.approx(kelvin, abs=1e-12)
    assert resolve_unit(unit, "temperature").from_si(kelvin) == pytest.approx(value, abs=1e-12)


@pytest.mark.parametrize(
    ("alias", "dimension", "code"),
    [
        ("C", "temperature", "degC"),
        ("°C", "temperature", "degC"),
        ("celsius", "temperature", "degC"),
        ("F", "temperature", "degF"),
        ("psia", "pressure", "psi"),
        ("HPA", "pressure", "hPa"),
        ("millibar", "pressure", "mbar"),
        ("torr", "pressure", "Torr"),
        ("feet", "length", "ft"),
    ],
)
def test_aliases(alias: str, dimension: str, code: str) -> None:
    assert resolve_unit(alias, dimension).code == code


def test_unknown_and_wrong_dimension_are_refused() -> None:
    with pytest.raises(KeyError, match="unknown pressure unit 'psig'"):
        resolve_unit("psig", "pressure")
    with pytest.raises(KeyError, match="unknown length unit"):
        resolve_unit("kPa", "length")


def test_every_code_round_trips_arrays() -> None:
    values = np.array([-3.5, 0.0, 1.0, 1234.5])
    for unit in UNITS.values():
        back = unit.from_si(unit.to_si(values))
        np.testing.assert_allclose(back, values, rtol=1e-14, atol=1e-12)


def test_defaults_and_codes_match_the_design() -> None:
    assert DEFAULT_UNITS == {"pressure": "kPa", "temperature": "degC", "length": "m"}
    assert codes("pressure") == ["Pa", "hPa", "kPa", "MPa", "bar", "mbar", "atm", "psi", "mmHg", "Torr", "inHg"]
    assert codes("temperature") == ["K", "degC", "degF", "degR"]
    assert codes("length") == ["m", "km", "ft"]
