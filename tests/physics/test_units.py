"""Unit conversions against their defining values."""

import re

import numpy as np
import pytest

from service.physics.units import DEFAULT_UNITS, UNITS, codes, resolve_unit, spellings

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
    # Conventional columns of water (density 1000 kg/m3, standard gravity) and the technical atmosphere:
    # NIST SP 811 (2008), appendix B.8, "centimeter of water, conventional" 98.0665 Pa and "kilogram-force
    # per square centimeter" 98066.5 Pa (recalled from memory); 1 in = 0.0254 m.
    ("mH2O", "pressure", 9806.65),
    ("inH2O", "pressure", 249.08891),
    ("kgf/cm2", "pressure", 98066.5),
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
        ("kpa", "pressure", "kPa"),
        ("PSI", "pressure", "psi"),
        ("MPa", "pressure", "MPa"),
        ("kgf/cm²", "pressure", "kgf/cm2"),
        ("millibar", "pressure", "mbar"),
        ("torr", "pressure", "Torr"),
        ("feet", "length", "ft"),
    ],
)
def test_aliases(alias: str, dimension: str, code: str) -> None:
    assert resolve_unit(alias, dimension).code == code


def test_unknown_and_wrong_dimension_are_refused() -> None:
    with pytest.raises(KeyError, match="unknown pressure unit 'furlong'"):
        resolve_unit("furlong", "pressure")
    with pytest.raises(KeyError, match="unknown length unit"):
        resolve_unit("kPa", "length")


@pytest.mark.parametrize(
    ("name", "dimension", "says"),
    [
        # Letter case carries meaning in SI prefixes: m is milli, M is mega (SI Brochure, 9th ed., table 7).
        ("mPa", "pressure", "mPa is the millipascal"),
        ("Mbar", "pressure", "Mbar is the megabar"),
        ("MPA", "pressure", "'MPA' could be MPa (megapascal) or mPa (the millipascal)"),
        ("mpa", "pressure", "'mpa' could be MPa (megapascal) or mPa (the millipascal)"),
        ("MBAR", "pressure", "'MBAR' could be Mbar (the megabar) or mbar (millibar)"),
        ("M", "length", "M is the nautical mile"),
    ],
)
def test_case_that_carries_meaning_is_kept(name: str, dimension: str, says: str) -> None:
    with pytest.raises(KeyError, match=re.escape(says)):
        resolve_unit(name, dimension)  # type: ignore[arg-type]


def test_gauge_and_absolute_spellings_fit_only_their_pressures() -> None:
    # psig, barg and kPag read a gauge; psia, bara and kPaA an absolute pressure (common practice, no source).
    for gauge in ("psig", "barg", "kPag", "PSIG"):
        assert resolve_unit(gauge, "pressure", "gauge").reference == "gauge"
        with pytest.raises(KeyError, match="marks a gauge reading"):
            resolve_unit(gauge, "pressure", "absolute")
        with pytest.raises(KeyError, match="marks a gauge reading"):
            resolve_unit(gauge, "pressure")  # the unit of every pressure of a request is not a gauge's
    for absolute in ("psia", "bara", "kPaA"):
        assert resolve_unit(absolute, "pressure", "absolute").reference == "absolute"
        with pytest.raises(KeyError, match="marks an absolute pressure"):
            resolve_unit(absolute, "pressure", "gauge")
    assert resolve_unit("psi", "pressure", "gauge") == resolve_unit("psi", "pressure")


def test_no_two_units_share_a_spelling_up_to_case() -> None:
    # Case never picks a unit silently: accepted spellings that differ only in letter case name one unit.
    by_fold: dict[tuple[str, str], set[str]] = {}
    for dimension in ("pressure", "temperature", "length"):
        for reference in (None, "gauge"):
            for name in spellings(dimension, reference):  # type: ignore[arg-type]
                code = resolve_unit(name, dimension, reference).code  # type: ignore[arg-type]
                by_fold.setdefault((dimension, name.casefold()), set()).add(code)
    assert all(len(found) == 1 for found in by_fold.values()), {k: v for k, v in by_fold.items() if len(v) > 1}
    assert {"MPA", "mpa", "MBAR"}.isdisjoint(spellings("pressure")) and "mbar" in spellings("pressure")


@pytest.mark.parametrize(
    ("spelled", "dimension", "code"),
    [
        ("°c", "temperature", "degC"),
        ("deg c", "temperature", "degC"),
        ("mm hg", "pressure", "mmHg"),
        ("mh2o", "pressure", "mH2O"),
        ("KGF/CM2", "pressure", "kgf/cm2"),
    ],
)
def test_spellings_with_signs_and_spaces_take_any_case_too(spelled: str, dimension: str, code: str) -> None:
    assert resolve_unit(spelled, dimension).code == code  # type: ignore[arg-type]


def test_every_code_round_trips_arrays() -> None:
    values = np.array([-3.5, 0.0, 1.0, 1234.5])
    for unit in UNITS.values():
        back = unit.from_si(unit.to_si(values))
        np.testing.assert_allclose(back, values, rtol=1e-14, atol=1e-12)


def test_defaults_and_codes_match_the_design() -> None:
    # DESIGN.md, "Aqueous solutions": concentration in wt% unless concentration_unit says otherwise.
    assert DEFAULT_UNITS == {"pressure": "kPa", "temperature": "degC", "length": "m", "concentration": "wt%"}
    assert codes("pressure")[:11] == ["Pa", "hPa", "kPa", "MPa", "bar", "mbar", "atm", "psi", "mmHg", "Torr", "inHg"]
    assert codes("pressure")[11:] == ["kgf/cm2", "mH2O", "inH2O"]
    assert codes("temperature") == ["K", "degC", "degF", "degR"]
    assert codes("length") == ["m", "km", "ft"]
    assert codes("concentration") == ["wt%", "g/kg", "mol/kg", "degBx"]
