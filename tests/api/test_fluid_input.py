"""The ``fluid`` of a request (``service.api.fluid_input``): fluids defined in the request, an equation
as printed or one known boiling point, and definitions refused."""

import pytest
from CoolProp.CoolProp import PropsSI

from tests.conftest import WATER_ANTOINE as HANDBOOK_WATER

# Water's handbook Antoine set (tests/conftest.py) as a caller sends it.
WATER_ANTOINE = {"equation": "antoine", **HANDBOOK_WATER, "t_min": 1, "t_max": 100, "name": "water (Antoine)"}


def test_antoine_reproduces_the_builtin_answer(client) -> None:
    pressures = [5.0, 20.0, 50.0, 101.325]
    mine = client.post("/v1/boiling-point", json={"fluid": WATER_ANTOINE, "pressure": pressures}).get_json()
    builtin = client.post("/v1/boiling-point", json={"fluid": "water", "pressure": pressures}).get_json()
    assert mine["fluid"] == "water (Antoine)"
    # The classic constants stray from IAPWS by up to about 0.1 K over 1-100 degC.
    assert mine["boiling_point"]["value"] == pytest.approx(builtin["boiling_point"]["value"], abs=0.1)
    assert mine["method"] == "Antoine equation with caller-supplied coefficients"
    assert any("caller-defined" in w for w in mine["warnings"])


def test_antoine_in_kelvin_and_bar_matches_the_same_equation(client) -> None:
    # The same water constants converted by hand to log10(p/bar) = A' - B/(T + C'):
    # A' = 8.07131 - log10(750.0617) = 5.19621, C' = 233.426 - 273.15 = -39.724.
    converted = dict(
        WATER_ANTOINE, A=5.19621, C=-39.724, pressure_unit="bar", temperature_unit="K", t_min=274.15, t_max=373.15
    )
    a = client.post("/v1/vapor-pressure", json={"fluid": converted, "temperature": 60}).get_json()
    b = client.post("/v1/vapor-pressure", json={"fluid": WATER_ANTOINE, "temperature": 60}).get_json()
    assert a["vapor_pressure"]["value"] == pytest.approx(b["vapor_pressure"]["value"], rel=2e-5)


def test_trouton_estimate_for_toluene_at_reduced_pressure(client) -> None:
    # Toluene boils at 110.6 degC at 1 atm (CRC Handbook of Chemistry and Physics, 95th ed.,
    # Physical Constants of Organic Compounds; recalled from memory). Reference at 10 kPa:
    # the toluene equation of state of Lemmon and Span, J. Chem. Eng. Data 51, 785 (2006),
    # evaluated with CoolProp: 45.25 degC.
    reference = PropsSI("T", "P", 10_000.0, "Q", 0, "Toluene") - 273.15
    body = client.post(
        "/v1/boiling-point",
        json={
            "fluid": {"name": "toluene", "boiling_point": 110.6},
            "pressure": 10,
        },
    ).get_json()
    assert body["boiling_point"]["value"] == pytest.approx(reference, abs=4.0)
    assert "Trouton" in body["method"] and "Clausius-Clapeyron" in body["method"]
    assert any("Trouton's rule" in w for w in body["warnings"])


def test_known_enthalpy_needs_no_trouton(client) -> None:
    # Ethanol: normal boiling point 78.29 degC, enthalpy of vaporization 38.56 kJ/mol at the boiling
    # point (CRC Handbook, 95th ed.; recalled from memory). The catalog's ethanol (VDI Heat Atlas)
    # gives the pressure at which it boils at 50 degC; one-point Clausius-Clapeyron with a constant
    # enthalpy lands within a few kelvin of 50 degC there.
    p50 = client.get("/v1/vapor-pressure?fluid=ethanol&temperature=50").get_json()["vapor_pressure"]["value"]
    body = client.post(
        "/v1/boiling-point",
        json={
            "fluid": {"name": "ethanol", "boiling_point": 78.29, "enthalpy_of_vaporization": 38.56},
            "pressure": p50,
        },
    ).get_json()
    assert "Trouton" not in body["method"]
    assert not any("Trouton" in w for w in body["warnings"])
    assert body["boiling_point"]["value"] == pytest.approx(50.0, abs=2.5)


def test_one_point_fluid_in_other_units_and_its_range(client) -> None:
    body = client.post(
        "/v1/vapor-pressure?temperature_unit=degF",
        json={
            "fluid": {"boiling_point": 351.44, "temperature_unit": "K", "pressure": 1, "pressure_unit": "atm"},
            "temperature": 172.922,
        },
    ).get_json()
    assert body["vapor_pressure"]["value"] == pytest.approx(101.325, rel=1e-6)  # 172.922 degF = 351.44 K
    far = client.post("/v1/boiling-point", json={"fluid": {"boiling_point": 78.3}, "pressure": 0.01})
    assert far.status_code == 422 and "extrapolate" in far.get_json()["detail"]
    ok = client.post(
        "/v1/boiling-point", json={"fluid": {"boiling_point": 78.3}, "pressure": 0.05, "extrapolate": True}
    )
    assert ok.status_code == 200 and any("extrapolated" in w for w in ok.get_json()["warnings"])


@pytest.mark.parametrize(
    ("fluid", "field"),
    [
        (dict(WATER_ANTOINE, B=-1730.63), "fluid"),  # pressure falls with temperature
        (dict(WATER_ANTOINE, D=1.0), "fluid.equation"),
        ({k: v for k, v in WATER_ANTOINE.items() if k != "C"}, "fluid.equation"),
        (dict(WATER_ANTOINE, log_base=2), "fluid.log_base"),
        (dict(WATER_ANTOINE, t_min=200, t_max=100), "fluid"),
        (dict(WATER_ANTOINE, pressure_unit="furlong"), "fluid.pressure_unit"),
        (dict(WATER_ANTOINE, colour="blue"), "fluid.colour"),
        (
            {"equation": "wagner", "coefficients": [-7.0, 1.0], "exponents": [1.0], "t_min": 300, "t_max": 500},
            "fluid.exponents",
        ),
        (
            {"equation": "wagner", "coefficients": [-7.0], "exponents": [1.0], "t_min": 300, "t_max": 500},
            "fluid.equation",
        ),
        ({"boiling_point": "hot"}, "fluid.boiling_point"),
        ({"boiling_point": 50, "enthalpy_of_vaporization": -3}, "fluid.enthalpy_of_vaporization"),
        ({"boiling_point": 50, "pressure": 0}, "fluid.pressure"),
        ({"nothing": 1}, "fluid"),
        (["water"], "fluid"),
    ],
)
def test_bad_definitions_are_refused_clearly(client, fluid, field: str) -> None:
    r = client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": 50})
    assert r.status_code == 400, r.get_json()
    assert field in r.get_json()["errors"], r.get_json()


def test_wagner_definition_reproduces_the_builtin_water(client) -> None:
    # The IAPWS 1992 coefficients (see service/physics/water.py) given as a caller's Wagner equation.
    wagner = {
        "equation": "wagner",
        "coefficients": [-7.85951783, 1.84408259, -11.7866497, 22.6807411, -15.9618719, 1.80122502],
        "exponents": [1, 1.5, 3, 3.5, 4, 7.5],
        "critical_temperature": 647.096,
        "critical_pressure": 22.064,
        "temperature_unit": "K",
        "pressure_unit": "MPa",
        "t_min": 273.16,
        "t_max": 647.096,
    }
    mine = client.post("/v1/boiling-point", json={"fluid": wagner, "pressure": [1, 100, 1000]}).get_json()
    builtin = client.post("/v1/boiling-point", json={"pressure": [1, 100, 1000]}).get_json()
    assert mine["boiling_point"]["value"] == pytest.approx(builtin["boiling_point"]["value"], abs=1e-9)


@pytest.mark.parametrize(("point", "unit"), [(0.0, "K"), (-5.0, "K"), (-300.0, "degC"), (1e308, "K")])
def test_absurd_boiling_points_are_refused(client, point: float, unit: str) -> None:
    # Found by the fuzz test: these once divided by zero or overflowed.
    r = client.post(
        "/v1/vapor-pressure", json={"fluid": {"boiling_point": point, "temperature_unit": unit}, "temperature": 50}
    )
    assert r.status_code == 400 and "fluid" in r.get_json()["errors"]


@pytest.mark.parametrize(
    "fluid",
    [
        {
            "equation": "wagner",
            "coefficients": [-7.8],
            "exponents": [1e308],
            "critical_temperature": 373.946,
            "critical_pressure": 22064,
            "t_min": 0.01,
            "t_max": 373.946,
        },
        {"boiling_point": 1e300},
        {"boiling_point": 1e-300, "temperature_unit": "K"},
    ],
)
def test_absurd_definitions_are_refused(client, fluid: dict) -> None:
    assert client.post("/v1/boiling-point", json={"fluid": fluid, "pressure": [100]}).status_code == 400


def test_dippr101_with_unused_large_exponent(client) -> None:
    # D = 0 makes E irrelevant; a huge E must not turn the slope into NaN.
    water = {
        "equation": "dippr101",
        "A": 73.649,
        "B": -7258.2,
        "C": -7.3037,
        "D": 0.0,
        "E": 1e6,
        "temperature_unit": "K",
        "t_min": 300,
        "t_max": 400,
    }
    assert client.post("/v1/vapor-pressure", json={"fluid": water, "temperature": 50}).status_code == 200
