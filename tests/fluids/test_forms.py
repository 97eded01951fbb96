"""The registry of equation forms: each form's builder against a published value, and the catalog and caller
schemas that read their coefficients, checks and names from it."""

from __future__ import annotations

import math
from typing import Any

import pytest
from marshmallow import ValidationError

from service.api.fluid_input import EquationFluid
from service.fluids.caller_defined import fluid_from_equation
from service.fluids.forms import DENSITY_FORMS, VAPOR_PRESSURE_FORMS, Form, equation_from_entry
from service.fluids.schema import FluidEntrySchema
from service.physics import water
from service.physics.units import ATMOSPHERE, resolve_unit
from tests.conftest import WATER_ANTOINE

_MMHG = resolve_unit("mmHg", "pressure").scale
"""1 mmHg [Pa], the conventional value (see service/physics/units.py)."""

# Per form: a valid table (SI where the form says nothing else) and a published value it must meet,
# (T [K], p [Pa], relative tolerance). A new form needs its entry here: the tests below run over the registry.
VAPOR_PRESSURE: dict[str, tuple[dict[str, Any], tuple[float, float, float]]] = {
    # Water's handbook Antoine set (tests/conftest.py): 760.1 mmHg at 100 degC.
    "antoine": (
        WATER_ANTOINE | {"t_min": 274.15, "t_max": 373.15},
        (373.15, 760.1 * _MMHG, 1e-4),
    ),
    # IAPWS 1992 eq. (1) coefficients as a caller's Wagner table: water boils at 373.124 K at 1 atm
    # (W. Wagner and A. Pruss, J. Phys. Chem. Ref. Data 22, 783, 1993, normal boiling point on ITS-90).
    "wagner": (
        {"coefficients": list(water.SATURATION.coefficients), "exponents": list(water.SATURATION.exponents)}
        | {"t_min": 273.16, "t_max": 647.096},
        (373.1243, ATMOSPHERE, 1e-5),
    ),
    # Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8, water (recalled from memory): tracks
    # IAPWS within about 0.3 %, so 1 atm at 100 degC within that.
    "dippr101": (
        {"A": 73.649, "B": -7258.2, "C": -7.3037, "D": 4.1653e-6, "E": 2.0, "t_min": 273.16, "t_max": 647.0},
        (373.15, ATMOSPHERE, 3e-3),
    ),
    # IAPWS 1992 check value of eq. (1): 611.657 Pa at the triple point, 273.16 K (recalled from memory).
    "iapws-1992": ({"t_min": 273.16, "t_max": 647.096}, (273.16, 611.657, 1e-6)),
}

# Per form: a valid table and a published density (T [K], rho [kg/m3], relative tolerance) for molar mass [kg/mol].
DENSITY: dict[str, tuple[dict[str, Any], float, tuple[float, float, float]]] = {
    # Methanol, Perry's 8th ed., Table 2-32 (A in kmol/m3 as printed; as in the Dippr105 doctest); the CRC
    # Handbook gives 786.6 kg/m3 at 25 degC (recalled from memory), which the correlation meets within 0.5 %.
    "dippr105": (
        {"A": 2.3267, "B": 0.27073, "C": 512.5, "D": 0.24713, "t_min": 175.47, "t_max": 512.5},
        0.03204216,
        (298.15, 786.6, 5e-3),
    ),
    # IAPWS 1992 check value of eq. (2): 958.365 kg/m3 at 373.1243 K (recalled from memory).
    "iapws-1992": ({"t_min": 273.16, "t_max": 647.096}, 0.018015268, (373.1243, 958.365, 1e-6)),
}

CALLER_FORMS = {key: form for key, form in VAPOR_PRESSURE_FORMS.items() if form.caller_definable}


def _table(kind: str, key: str) -> dict[str, Any]:
    """A fresh, valid catalog table of form ``key``, with method and source."""
    tables = {"vapor_pressure": VAPOR_PRESSURE, "liquid_density": DENSITY}[kind]
    return {"form": key, "method": f"{key} for a test", "source": "tests/fluids/test_forms.py", **tables[key][0]}


def _entry(kind: str, table: dict[str, Any]) -> dict[str, Any]:
    """A water-like catalog entry (IAPWS 1992 constants) around ``table``."""
    entry = {
        "id": "test-fluid",
        "name": "Test fluid",
        "formula": "H2O",
        "cas": "7732-18-5",
        "molar_mass": 0.018015268,
        "critical_temperature": water.CRITICAL_TEMPERATURE,
        "critical_pressure": water.CRITICAL_PRESSURE,
        "triple_temperature": 273.16,
        "triple_pressure": 611.657,
        "constants_source": "IAPWS 1992, for a test entry",
        "vapor_pressure": _table("vapor_pressure", "iapws-1992"),
    }
    return entry | {kind: table}


def _request(key: str) -> dict[str, Any]:
    """A request's definition of a fluid by form ``key``: the table's coefficients and units, and the critical point."""
    table = VAPOR_PRESSURE[key][0]
    coefficients = {c.name: table[c.name] for c in VAPOR_PRESSURE_FORMS[key].coefficients}
    return {"equation": key, **coefficients, "t_min": table["t_min"], "t_max": table["t_max"]} | {
        "critical_temperature": water.CRITICAL_TEMPERATURE,
        "critical_pressure": water.CRITICAL_PRESSURE,
    }


def _coefficients(forms: dict[str, Form], kind: str) -> list[tuple[str, str, str]]:
    return [(kind, key, c.name) for key, form in forms.items() for c in form.coefficients]


@pytest.mark.parametrize("key", VAPOR_PRESSURE_FORMS)
def test_every_vapor_pressure_form_meets_its_published_value(key: str) -> None:
    table, (t, p, rel) = VAPOR_PRESSURE[key]
    equation = VAPOR_PRESSURE_FORMS[key].build(table, water.CRITICAL_TEMPERATURE, water.CRITICAL_PRESSURE)
    assert float(equation.pressure(t)) == pytest.approx(p, rel=rel)


@pytest.mark.parametrize("key", DENSITY_FORMS)
def test_every_density_form_meets_its_published_value(key: str) -> None:
    table, molar_mass, (t, rho, rel) = DENSITY[key]
    assert float(DENSITY_FORMS[key].build(table, molar_mass)(t)) == pytest.approx(rho, rel=rel)


def test_antoine_in_another_base_and_other_units_is_the_same_equation() -> None:
    # The water set of VAPOR_PRESSURE rewritten by hand as ln(p/Pa) = A' - B'/(T/K + C').
    table = VAPOR_PRESSURE["antoine"][0]
    converted = table | {
        "A": table["A"] * math.log(10) + math.log(_MMHG),
        "B": table["B"] * math.log(10),
        "C": table["C"] - 273.15,
        "log_base": "e",
        "pressure_unit": "Pa",
        "temperature_unit": "K",
    }
    printed, rewritten = (equation_from_entry({"form": "antoine"} | v, math.inf, math.inf) for v in (table, converted))
    assert float(rewritten.pressure(330.0)) == pytest.approx(float(printed.pressure(330.0)), rel=1e-12)


def test_a_wagner_table_reduces_by_its_own_point_where_it_gives_one() -> None:
    table = VAPOR_PRESSURE["wagner"][0] | {
        "reducing_temperature": water.CRITICAL_TEMPERATURE,
        "reducing_pressure": water.CRITICAL_PRESSURE,
    }
    equation = VAPOR_PRESSURE_FORMS["wagner"].build(table, 700.0, 30e6)
    assert float(equation.pressure(373.1243)) == pytest.approx(ATMOSPHERE, rel=1e-5)


@pytest.mark.parametrize(
    ("kind", "key"),
    [("vapor_pressure", k) for k in VAPOR_PRESSURE_FORMS] + [("liquid_density", k) for k in DENSITY_FORMS],
)
def test_the_catalog_schema_loads_every_form(kind: str, key: str) -> None:
    assert FluidEntrySchema().load(_entry(kind, _table(kind, key)))[kind]["form"] == key


@pytest.mark.parametrize(
    ("kind", "key", "name"),
    _coefficients(VAPOR_PRESSURE_FORMS, "vapor_pressure") + _coefficients(DENSITY_FORMS, "liquid_density"),
)
def test_the_catalog_schema_asks_for_every_coefficient(kind: str, key: str, name: str) -> None:
    table = _table(kind, key)
    del table[name]
    with pytest.raises(ValidationError) as error:
        FluidEntrySchema().load(_entry(kind, table))
    assert error.value.messages == {kind: {"form": [f"form {key!r} needs {name}"]}}


@pytest.mark.parametrize(
    ("key", "name"),
    [(key, c.name) for key, form in CALLER_FORMS.items() for c in form.coefficients if c.in_request],
)
def test_the_caller_schema_asks_for_every_coefficient(key: str, name: str) -> None:
    body = _request(key)
    assert EquationFluid().load(body)["equation"] == key
    del body[name]
    with pytest.raises(ValidationError) as error:
        EquationFluid().load(body)
    assert error.value.messages == {"equation": [f"{key} needs {name}"]}


def test_both_schemas_check_the_forms_across_fields() -> None:
    short = _table("vapor_pressure", "wagner") | {"exponents": [1.0, 1.5]}
    with pytest.raises(ValidationError) as error:
        FluidEntrySchema().load(_entry("vapor_pressure", short))
    assert error.value.messages == {"vapor_pressure": {"exponents": ["needs as many exponents as coefficients"]}}
    with pytest.raises(ValidationError) as error:
        EquationFluid().load(_request("wagner") | {"exponents": [1.0, 1.5]})
    assert error.value.messages == {"exponents": ["needs as many exponents as coefficients"]}
    past_c = _table("liquid_density", "dippr105") | {"t_max": 513.0}
    with pytest.raises(ValidationError) as error:
        FluidEntrySchema().load(_entry("liquid_density", past_c))
    assert error.value.messages == {
        "liquid_density": {"t_max": ["t_max is above C, where the DIPPR 105 equation ends"]}
    }
    bad_base = _table("vapor_pressure", "antoine") | {"log_base": 2}
    with pytest.raises(ValidationError) as error:
        FluidEntrySchema().load(_entry("vapor_pressure", bad_base))
    assert error.value.messages == {"vapor_pressure": {"log_base": ['must be 10 or "e"']}}
    with pytest.raises(ValidationError) as error:
        EquationFluid().load(_request("antoine") | {"log_base": 2})
    assert error.value.messages == {"log_base": ['must be 10 or "e"']}


def test_a_request_states_the_critical_point_whole() -> None:
    wagner = {k: v for k, v in _request("wagner").items() if k != "critical_pressure"}
    with pytest.raises(ValidationError) as error:
        EquationFluid().load(wagner)
    assert error.value.messages == {"equation": ["wagner needs critical_temperature and critical_pressure"]}
    antoine = {k: v for k, v in _request("antoine").items() if k != "critical_pressure"}
    with pytest.raises(ValidationError) as error:
        EquationFluid().load(antoine)
    assert error.value.messages == {"critical_pressure": ["critical_temperature and critical_pressure go together"]}


def test_the_caller_schema_is_the_registry_s_caller_definable_forms() -> None:
    fields = EquationFluid().fields
    (choices,) = fields["equation"].validators
    assert list(choices.choices) == sorted(CALLER_FORMS)
    description = fields["equation"].metadata["description"]
    assert all(f"{key}: {form.equation}" in description for key, form in CALLER_FORMS.items())
    coefficients = {c.name for form in CALLER_FORMS.values() for c in form.coefficients if c.in_request}
    general = {"name", "equation", "critical_temperature", "critical_pressure", "t_min", "t_max"}
    assert set(fields) - general - {"temperature_unit", "pressure_unit"} == coefficients


def test_a_coefficient_name_means_one_thing_in_every_caller_form() -> None:
    # A request has one field per name, so every caller-definable form must declare a shared name alike.
    for name in {c.name for form in CALLER_FORMS.values() for c in form.coefficients}:
        assert len({c for form in CALLER_FORMS.values() for c in form.coefficients if c.name == name}) == 1, name


def test_the_catalog_schema_takes_the_registry_s_forms() -> None:
    with pytest.raises(ValidationError) as error:
        FluidEntrySchema().load(_entry("vapor_pressure", _table("vapor_pressure", "antoine") | {"form": "clapeyron"}))
    assert error.value.messages == {"vapor_pressure": {"form": [f"must be one of {', '.join(VAPOR_PRESSURE_FORMS)}"]}}


@pytest.mark.parametrize("key", CALLER_FORMS)
def test_a_caller_defined_fluid_is_named_by_its_form(key: str) -> None:
    table = {"form": key} | VAPOR_PRESSURE[key][0]
    fluid = fluid_from_equation("test", table, (water.CRITICAL_TEMPERATURE, water.CRITICAL_PRESSURE))
    assert fluid.method == f"{VAPOR_PRESSURE_FORMS[key].name} with caller-supplied coefficients"
