"""GET and POST /v1/vapor-pressure (``service.api.paths.saturation``)."""

import pytest

from service.physics import water
from tests.api.test_problems import problem


def test_vapor_pressure_of_water(client) -> None:
    # IAPWS-IF97 Table 35: 3.53658941 kPa at 300 K (IF97 and the 1992 equation agree to 0.01 %).
    body = client.get("/v1/vapor-pressure?temperature=300&temperature_unit=K").get_json()
    assert body["vapor_pressure"] == {"value": pytest.approx(3.53659, rel=1e-4), "unit": "kPa"}
    assert body["temperature"] == {"value": 300.0, "unit": "K"}
    assert body["sensitivity"]["unit"] == "kPa/K"
    assert body["sensitivity"]["value"] == pytest.approx(float(water.saturation_pressure_slope(300.0)) / 1e3)


def test_boiling_point_and_vapor_pressure_invert_each_other(client) -> None:
    t = client.get("/v1/boiling-point?pressure=47.39").get_json()["boiling_point"]["value"]
    p = client.get(f"/v1/vapor-pressure?temperature={t!r}").get_json()["vapor_pressure"]["value"]
    assert p == pytest.approx(47.39, rel=1e-9)


def test_post_array(client) -> None:
    r = client.post("/v1/vapor-pressure?pressure_unit=mmHg", json={"temperature": [20, 50, 100]})
    values = r.get_json()["vapor_pressure"]["value"]
    # Common practice, no source: about 17.5 mmHg at 20 degC and 760 mmHg at 100 degC.
    assert values[0] == pytest.approx(17.5, abs=0.1)
    assert values[2] == pytest.approx(760.0, abs=1.0)  # 100 degC is 0.026 K above the 1-atm boiling point


def test_carbon_dioxide_boils_above_its_triple_point(client) -> None:
    # CO2 saturation at 20 degC: 5.73 MPa (common practice, no source; CoolProp gives 5.729 MPa).
    body = client.get("/v1/vapor-pressure?fluid=CO2&temperature=20&pressure_unit=MPa").get_json()
    assert body["vapor_pressure"]["value"] == pytest.approx(5.73, abs=0.02)


def test_vapor_pressure_refusals(client) -> None:
    problem(client.get("/v1/vapor-pressure?temperature=-1"), 422)
    problem(client.get("/v1/vapor-pressure?temperature=374"), 422)
    problem(client.get("/v1/vapor-pressure"), 400)
    problem(client.get("/v1/vapor-pressure?temperature=50&fluid=xyzzy"), 404)
