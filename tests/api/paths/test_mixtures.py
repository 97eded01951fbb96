"""/v1/bubble-point, /v1/dew-point and /v1/pairs through the client, which checks every answer against the
OpenAPI document (source beside each check)."""

from __future__ import annotations

import pytest

from tests.api.test_problems import problem
from tests.conftest import csv_answer

ETHANOL_WATER = "/v1/bubble-point?components=ethanol,water"


def test_ethanol_water_bubble_point_at_one_atmosphere(client) -> None:
    # Ethanol and water at 101.325 kPa, x = 0.097: about 86.7 degC with y = 0.438 (the published point,
    # the classic data of Perry's Chemical Engineers' Handbook, Table 13-1; recalled from memory).
    body = client.get(f"{ETHANOL_WATER}&fractions=0.097,0.903&pressure=101.325").get_json()
    assert body["bubble_point"]["value"] == pytest.approx(86.7, abs=0.5)
    assert body["vapor_composition"]["ethanol"]["value"] == pytest.approx(0.438, abs=0.02)
    k = body["k_values"]
    assert body["relative_volatility"]["value"] == pytest.approx(k["ethanol"]["value"] / k["water"]["value"])
    assert body["model"] == "nrtl" and "Renon and Prausnitz" in body["method"] and "DECHEMA" in body["source"]


def test_dew_point_of_that_vapor_is_that_bubble_point(client) -> None:
    # The dew point of the bubble point's vapor is the bubble temperature, and its first liquid the liquid.
    bubble = client.get(f"{ETHANOL_WATER}&fractions=0.3,0.7&elevation=1420").get_json()
    y = bubble["vapor_composition"]
    dew = client.get(
        f"/v1/dew-point?components=ethanol,water&fractions={y['ethanol']['value']!r},{y['water']['value']!r}"
        "&elevation=1420"
    ).get_json()
    assert dew["dew_point"]["value"] == pytest.approx(bubble["bubble_point"]["value"], abs=1e-6)
    assert dew["liquid_composition"]["ethanol"]["value"] == pytest.approx(0.3, abs=1e-6)


def test_at_a_temperature_the_answer_is_a_pressure(client) -> None:
    body = client.get(f"{ETHANOL_WATER}&fractions=0.5,0.5&temperature=78").get_json()
    assert set(body) >= {"temperature", "bubble_pressure"} and "bubble_point" not in body


def test_mass_basis_in_and_out(client) -> None:
    # 50 wt% ethanol is x = 0.2811 (molar masses 46.07 and 18.02 g/mol); the same liquid boils alike.
    mass = client.get(f"{ETHANOL_WATER}&fractions=0.5,0.5&basis=mass&pressure=101.325").get_json()
    mole = client.get(f"{ETHANOL_WATER}&fractions=0.28106,0.71894&pressure=101.325").get_json()
    assert mass["bubble_point"]["value"] == pytest.approx(mole["bubble_point"]["value"], abs=0.01)
    assert mass["vapor_composition"]["ethanol"]["unit"] == "mass fraction"


def test_compositions_broadcast_against_pressures(client) -> None:
    body = {"components": ["ethanol", "water"], "fractions": [[0.1, 0.9], [0.5, 0.5]], "pressure": [101.325, 50]}
    answer = client.post("/v1/bubble-point", json=body).get_json()
    assert len(answer["bubble_point"]["value"]) == 2
    one = client.post("/v1/bubble-point", json={**body, "fractions": [0.1, 0.9]}).get_json()
    assert one["bubble_point"]["value"][0] == answer["bubble_point"]["value"][0]
    problem(client.post("/v1/bubble-point", json={**body, "pressure": [101.325, 50, 20]}), 400)


def test_csv_answer_has_a_column_per_component(client) -> None:
    r = client.post(
        "/v1/bubble-point?format=csv",
        json={"components": "ethanol,water", "fractions": [[0.1, 0.9], [0.5, 0.5]], "pressure": 101.325},
    )
    notes, rows = csv_answer(r.get_data(as_text=True))
    assert "components: ethanol, water" in notes
    assert len(rows) == 2 and "vapor_composition.ethanol [mole fraction]" in rows[0]


def test_csv_body_gives_a_composition_per_row(client) -> None:
    # The columns fractions.<component> follow components in the query string; each row is one point and
    # answers as the same point sent as JSON does.
    table = "pressure,fractions.water,fractions.ethanol\n101.325,0.903,0.097\n85,0.5,0.5\n"
    r = client.post("/v1/bubble-point?components=ethanol,water", data=table, content_type="text/csv")
    as_json = client.post(
        "/v1/bubble-point",
        json={"components": ["ethanol", "water"], "fractions": [[0.097, 0.903], [0.5, 0.5]], "pressure": [101.325, 85]},
    )
    assert r.get_json()["bubble_point"] == as_json.get_json()["bubble_point"]


@pytest.mark.parametrize(
    ("query", "table", "field"),
    [
        ("", "pressure,fractions.ethanol,fractions.water\n101,0.5,0.5\n", "components"),
        ("?components=ethanol,water", "pressure,fractions.ethanol\n101,1\n", "fractions"),
        (
            "?components=ethanol,water",
            "pressure,fractions.ethanol,fractions.water,fractions.x\n101,0.5,0.5,0\n",
            "fractions",
        ),
        ("?components=ethanol,water", "pressure,fraction.ethanol,fraction.water\n101,0.5,0.5\n", "fraction.ethanol"),
        # A bare fractions column (one number per row: which component's?) is refused, not dropped.
        ("?components=ethanol,water&fractions=0.3,0.7", "pressure,fractions\n101,0.9\n", "fractions"),
        ("?components=ethanol,water", "pressure,fractions.,fractions.water\n101,0.5,0.5\n", "fractions."),
        # A unit on a fraction column would say nothing the basis does not, or contradict it: refused.
        (
            "?components=ethanol,water",
            "pressure,fractions.ethanol [mass fraction],fractions.water\n101,0.5,0.5\n",
            "fractions.ethanol",
        ),
        (
            "?components=ethanol,water&fractions=0.5,0.5",
            "pressure,fractions.ethanol,fractions.water\n101,0.5,0.5\n",
            "fractions",
        ),
    ],
)
def test_csv_body_fraction_columns_refused(client, query: str, table: str, field: str) -> None:
    r = client.post(f"/v1/bubble-point{query}", data=table, content_type="text/csv")
    assert field in problem(r, 400)["errors"]


@pytest.mark.parametrize(
    ("query", "status", "field"),
    [
        ("components=ethanol,water&fractions=0.5,0.6&pressure=100", 400, "fractions"),
        ("components=ethanol,water&fractions=0.5,0.3,0.2&pressure=100", 400, "fractions"),
        ("components=ethanol,water&fractions=-0.5,1.5&pressure=100", 400, "fractions"),
        ("components=ethanol,water&fractions=half,half&pressure=100", 400, "fractions"),
        ("components=ethanol,ethanol&fractions=0.5,0.5&pressure=100", 400, "components"),
        ("components=ethanol&fractions=1&pressure=100", 400, "components"),
        ("components=ethanol,unobtainium&fractions=0.5,0.5&pressure=100", 404, "fluid"),
        ("components=ethanol,water&fractions=0.5,0.5", 400, "temperature"),
        ("components=ethanol,water&fractions=0.5,0.5&pressure=100&temperature=80", 400, "temperature"),
        ("fractions=0.5,0.5&pressure=100", 400, "components"),
        ("components=ethanol,ammonia&fractions=0.5,0.5&pressure=100", 422, "components"),
        ("components=ethylene-glycol,water&fractions=0.5,0.5&pressure=100", 422, "components"),
        ("components=acetone,n-hexane&fractions=0.5,0.5&pressure=100&model=nrtl", 422, "components"),
        ("components=water,1-butanol&fractions=0.8,0.2&pressure=100", 422, "pressure"),
        ("components=benzene,toluene&fractions=0.5,0.5&pressure=1200", 422, "pressure"),
        ("components=methanol,water&fractions=0.5,0.5&temperature=250", 422, "temperature"),
        ("components=ethanol,water&fractions=0.5,0.5&pressure=100&model=margules", 400, "model"),
    ],
)
def test_refusals(client, query: str, status: int, field: str) -> None:
    body = problem(client.get(f"/v1/bubble-point?{query}"), status)
    assert field in body["errors"], body


@pytest.mark.parametrize("fractions", [[], [[0.5, 0.5], [1.0]], [[[0.5, 0.5]]], ["0.5", "0.5"]])
def test_malformed_fractions_in_a_body(client, fractions: list) -> None:
    body = {"components": ["ethanol", "water"], "fractions": fractions, "pressure": 100}
    problem(client.post("/v1/bubble-point", json=body), 400)


def test_pairs_are_listed_with_their_sources(client) -> None:
    body = client.get("/v1/pairs").get_json()
    assert body["count"] == len(body["pairs"]) == 101 + 100 + 85
    ethanol_water = {p["model"]: p for p in body["pairs"] if p["components"] == ["ethanol", "water"]}
    assert set(ethanol_water) == {"nrtl", "wilson", "uniquac"}
    assert ethanol_water["nrtl"]["parameters"]["alpha"] == 0.2937 and "DECHEMA" in ethanol_water["nrtl"]["source"]
    assert {"a12", "a21", "b12", "b21"} == set(ethanol_water["wilson"]["parameters"])
    # UNIQUAC's pairs carry the r and q they were fitted with (ChemSep: ethanol 2.11 and 1.97, water 0.92 and 1.4).
    assert ethanol_water["uniquac"]["parameters"] | {"b12": 0, "b21": 0} == {
        "b12": 0,
        "b21": 0,
        "r1": 2.11,
        "q1": 1.97,
        "r2": 0.92,
        "q2": 1.4,
    }


@pytest.mark.parametrize(("path", "key"), [("bubble-point", "bubble_point"), ("dew-point", "dew_point")])
def test_an_array_answers_each_point_as_a_single_request_does(client, path: str, key: str) -> None:
    # Each point's solver stops at its own convergence: the same floats alone and in an array (the design's rule).
    points = [(0.1, 101.325), (0.5, 50.0), (0.9, 20.0)]
    body = {
        "components": "ethanol,water",
        "fractions": [[x, 1 - x] for x, _ in points],
        "pressure": [p for _, p in points],
    }
    array = client.post(f"/v1/{path}", json=body).get_json()[key]["value"]
    singles = [
        client.get(f"/v1/{path}?components=ethanol,water&fractions={x!r},{1 - x!r}&pressure={p}").get_json()[key][
            "value"
        ]
        for x, p in points
    ]
    assert array == singles


def test_azeotrope_of_ethanol_and_water(client) -> None:
    # The published point: near 78.15 degC at x = 0.894.
    body = client.get("/v1/azeotrope?components=ethanol,water&pressure=101.325").get_json()
    assert body["azeotrope"]["temperature"]["value"] == pytest.approx(78.15, abs=0.5)
    assert body["azeotrope"]["composition"]["ethanol"]["value"] == pytest.approx(0.894, abs=0.02)
    assert body["reason"] is None


def test_no_azeotrope_is_null_with_a_reason(client) -> None:
    body = client.get("/v1/azeotrope?components=benzene,toluene&elevation=1420").get_json()
    assert body["azeotrope"] is None and body["reason"].startswith("none:")


@pytest.mark.parametrize(
    ("query", "field"),
    [
        ("components=ethanol,water,methanol&pressure=100", "components"),
        ("components=ethanol,water", "pressure"),
    ],
)
def test_azeotrope_refusals(client, query: str, field: str) -> None:
    assert field in problem(client.get(f"/v1/azeotrope?{query}"), 400)["errors"]


def test_azeotrope_takes_one_pressure_per_request(client) -> None:
    r = client.post("/v1/azeotrope", json={"components": ["ethanol", "water"], "pressure": [100, 50]})
    assert "pressure" in problem(r, 400)["errors"]


def test_modified_unifac_on_request(client) -> None:
    # The group methods near the fitted NRTL for ethanol-water at x = 0.097 (86.7 degC published, recalled).
    body = client.get(f"{ETHANOL_WATER}&fractions=0.097,0.903&pressure=101.325&model=unifac-dortmund").get_json()
    assert body["model"] == "unifac-dortmund" and "Dortmund" in body["method"]
    assert body["bubble_point"]["value"] == pytest.approx(86.7, abs=3.0)
    glycol = "/v1/bubble-point?components=ethylene-glycol,water&fractions=0.5,0.5&pressure=101.325"
    assert "102.7 degC" in problem(client.get(f"{glycol}&model=unifac-dortmund"), 422)["detail"]


@pytest.mark.parametrize(("model", "method"), [("wilson", "Wilson (1964)"), ("uniquac", "UNIQUAC")])
def test_fitted_models_on_request(client, model: str, method: str) -> None:
    # Ethanol-water at x = 0.097 and 1 atm boils near 86.7 degC with y = 0.438 (Perry's Table 13-1, recalled).
    body = client.get(f"{ETHANOL_WATER}&fractions=0.097,0.903&pressure=101.325&model={model}").get_json()
    assert body["model"] == model and method in body["method"] and "ChemSep IPD" in body["source"]
    assert body["bubble_point"]["value"] == pytest.approx(86.7, abs=0.5)
    assert body["vapor_composition"]["ethanol"]["value"] == pytest.approx(0.438, abs=0.02)
    two_liquids = client.get(
        f"/v1/bubble-point?components=water,1-butanol&fractions=0.8,0.2&pressure=101.325&model={model}"
    )
    assert "two liquid phases" in problem(two_liquids, 422)["detail"]


def test_the_readme_coolant_example(client) -> None:
    # README, the CIP heater's coolant loop: 50 wt% glycol under a 100 kPa gauge cap at 1,420 m.
    query = "components=ethylene-glycol,water&fractions=0.5,0.5&basis=mass&gauge_pressure=100&elevation=1420&digits=4"
    body = client.get(f"/v1/bubble-point?{query}&model=ideal").get_json()
    assert (body["pressure"]["value"], body["bubble_point"]["value"]) == (185.4, 125.7)
    assert any("as the request asked" in w for w in body["warnings"])
    assert "model=ideal" in problem(client.get(f"/v1/bubble-point?{query}"), 422)["detail"]
