"""Catalog loading, validation and lookup."""

from pathlib import Path

import numpy as np
import pytest

from service import create_app
from service.fluids.catalog import DATA_DIR, CatalogError, load_catalog, load_file
from service.fluids.forms import equation_from_entry
from service.fluids.schema import cas_check_digit_ok
from service.physics import water

WATER_FILE = DATA_DIR / "water.toml"

GOOD_ENTRY = """
[[fluid]]
id = "test-water"
name = "Test water"
formula = "H2O"
cas = "7732-18-5"
aliases = ["tw"]
molar_mass = 0.018015
critical_temperature = 647.096
critical_pressure = 22.064e6
triple_temperature = 273.16
triple_pressure = 611.657
normal_boiling_point = 373.124
constants_source = "IAPWS 1992, for a test entry"

[fluid.vapor_pressure]
form = "antoine"
method = "Antoine equation"
source = "classic handbook constants for water, 1-100 degC"
t_min = 274.15
t_max = 373.15
A = 8.07131
B = 1730.63
C = 233.426
log_base = 10
pressure_unit = "mmHg"
temperature_unit = "degC"
"""


def test_builtin_water_entry_uses_the_iapws_equation() -> None:
    (fluid,) = load_file(WATER_FILE)
    assert fluid.id == "water"
    assert fluid.equation is water.SATURATION
    assert fluid.p_min == pytest.approx(611.657, abs=1e-3)
    assert fluid.p_max == pytest.approx(22.064e6)


def test_every_builtin_entry_is_well_formed() -> None:
    catalog = load_catalog()
    assert "water" in catalog.entries
    for fluid in catalog.entries.values():
        assert cas_check_digit_ok(fluid.cas), fluid.id
        low, high = fluid.stated_range
        assert fluid.triple_temperature <= low < high <= fluid.critical_temperature, fluid.id
        # A stated range far below the triple point means the triple point is not the real one.
        assert fluid.t_min > fluid.triple_temperature - 5.0, fluid.id
        # The pressure rises with temperature everywhere the equation may answer.
        t = np.linspace(*fluid.temperature_limits, 500)
        slope = fluid.saturation_pressure_slope(t[:-1])
        assert np.all(np.isfinite(slope)) and np.all(slope > 0), fluid.id
        assert fluid.p_min < fluid.p_max
        assert len(fluid.source) > 10 and len(fluid.constants_source) > 10


@pytest.mark.parametrize("name", ["water", "WATER", "h2o", "7732-18-5", "Steam", "  ordinary   water "])
def test_lookup_by_id_cas_and_alias(name: str) -> None:
    assert load_catalog([WATER_FILE]).get(name).id == "water"


def test_close_matches_and_search() -> None:
    catalog = load_catalog([WATER_FILE])
    assert catalog.get("watr") is None
    assert catalog.close_matches("watr") == ["water"]
    assert [f.id for f in catalog.search("H2")] == ["water"]
    assert catalog.search("xenon") == []


def test_cas_check_digit() -> None:
    # CAS check digits (common practice, no source): water 7732-18-5, ethanol 64-17-5.
    assert cas_check_digit_ok("64-17-5")
    assert not cas_check_digit_ok("64-17-6")
    assert not cas_check_digit_ok("64175")


def test_antoine_entry_in_handbook_units(tmp_path: Path) -> None:
    path = tmp_path / "extra.toml"
    path.write_text(GOOD_ENTRY)
    (fluid,) = load_file(path)
    # log10(p/mmHg) = 8.07131 - 1730.63/(100 + 233.426) gives 760.1 mmHg at 100 degC.
    assert fluid.saturation_pressure(373.15) / 133.322387415 == pytest.approx(760.1, abs=0.1)
    assert fluid.saturation_temperature(101_325.0) == pytest.approx(373.15, abs=0.01)


@pytest.mark.parametrize(
    ("change", "message"),
    [
        (('cas = "7732-18-5"', 'cas = "7732-18-4"'), "entry 1 (test-water): cas:"),
        (("t_max = 373.15", "t_max = 700.0"), "vapor_pressure"),
        (("log_base = 10", "log_base = 2"), "vapor_pressure.log_base"),
        (('form = "antoine"', 'form = "wagner"'), "needs coefficients, exponents"),
        (("molar_mass = 0.018015", 'molar_mass = "heavy"'), "molar_mass: Not a valid number"),
        (('pressure_unit = "mmHg"', 'pressure_unit = "furlong"'), "pressure_unit"),
    ],
)
def test_bad_files_name_file_entry_and_field(tmp_path: Path, change: tuple[str, str], message: str) -> None:
    path = tmp_path / "operator.toml"
    path.write_text(GOOD_ENTRY.replace(*change))
    with pytest.raises(CatalogError) as error:
        load_file(path)
    assert str(path) in str(error.value)
    assert message in str(error.value)


def test_unreadable_and_empty_files(tmp_path: Path) -> None:
    broken = tmp_path / "broken.toml"
    broken.write_text("[[fluid]\nid=")
    with pytest.raises(CatalogError, match="cannot read catalog file"):
        load_file(broken)
    empty = tmp_path / "empty.toml"
    empty.write_text("# nothing\n")
    with pytest.raises(CatalogError, match="no \\[\\[fluid\\]\\] entries"):
        load_file(empty)


def test_duplicate_names_are_refused(tmp_path: Path) -> None:
    path = tmp_path / "clash.toml"
    path.write_text(GOOD_ENTRY)
    with pytest.raises(CatalogError, match="'7732-18-5' names both 'water' and 'test-water'"):
        load_catalog([WATER_FILE], [path])
    path.write_text(GOOD_ENTRY.replace('aliases = ["tw"]', 'aliases = ["steam"]').replace("7732-18-5", "64-17-5"))
    with pytest.raises(CatalogError, match="'steam' names both 'water' and 'test-water'"):
        load_catalog([WATER_FILE], [path])


def test_equation_from_entry_dippr101() -> None:
    # Perry's 8th ed. Table 2-8 water (recalled from memory), ln(p/Pa) = A + B/T + C ln T + D T**E.
    eq = equation_from_entry(
        {"form": "dippr101", "A": 73.649, "B": -7258.2, "C": -7.3037, "D": 4.1653e-6, "E": 2.0}, 647.096, 22.064e6
    )
    assert eq.pressure(373.15) == pytest.approx(101_325.0, rel=3e-3)


def test_operator_files_from_the_environment_join_the_catalog(tmp_path: Path, monkeypatch) -> None:
    path = tmp_path / "site.toml"
    entry = GOOD_ENTRY.replace("7732-18-5", "123-91-1").replace('id = "test-water"', 'id = "site-solvent"')
    path.write_text(entry)
    monkeypatch.setenv("BOILING_EXTRA_CATALOGS", str(path))
    app = create_app()
    body = app.test_client().get("/v1/boiling-point?fluid=site-solvent&pressure=101.325").get_json()
    assert body["fluid"] == "site-solvent"
    assert body["boiling_point"]["value"] == pytest.approx(100.0, abs=0.01)


def test_a_bad_operator_file_stops_start_up(tmp_path: Path, monkeypatch) -> None:
    path = tmp_path / "broken-site.toml"
    path.write_text(GOOD_ENTRY.replace("t_min = 274.15", "t_min = -4"))
    monkeypatch.setenv("BOILING_EXTRA_CATALOGS", str(path))
    with pytest.raises(CatalogError) as error:
        create_app()
    assert str(path) in str(error.value)
    assert "entry 1 (test-water)" in str(error.value)
    assert "vapor_pressure.t_min" in str(error.value)


def test_every_fluid_table_reproduces_the_newton_inverse() -> None:
    for fluid in load_catalog().entries.values():
        low, high = fluid.pressure_limits
        p = np.geomspace(low, high, 2001)
        exact = fluid.equation.temperature(p, *fluid.temperature_limits)
        assert np.max(np.abs(fluid.saturation_temperature(p) - exact)) < 1e-8, fluid.id


def test_every_fluid_gives_single_values_the_floats_of_an_array() -> None:
    # A single value and the same value inside an array must answer alike, to the bit, for every
    # catalog equation: saturation pressure, its slope, the inverse table, the liquid density.
    rng = np.random.default_rng(58)
    for fluid in load_catalog().entries.values():
        t = rng.uniform(*fluid.stated_range, 60)
        p = fluid.saturation_pressure(t)
        checks = [
            (fluid.saturation_pressure, t),
            (fluid.saturation_pressure_slope, t),
            (fluid.saturation_temperature, p),
        ]
        if fluid.liquid_density is not None:
            low, high = fluid.liquid_density.t_min, fluid.liquid_density.t_max
            checks.append((fluid.liquid_density.density, rng.uniform(low, high, 60)))
        for function, values in checks:
            assert [function(float(v)) for v in values] == function(values).tolist(), (fluid.id, function)
