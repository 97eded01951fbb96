"""Water with a dissolved solute: GET /v1/solutes (``service.api.paths.solutes``) and the ``solute`` and
``concentration`` inputs of the computing paths (``service.api.fluid_input``)."""

import pytest

from tests.api.test_problems import problem
from tests.conftest import csv_answer

SOLUTE_IDS = ["calcium-chloride", "lithium-bromide", "sea-salt", "sodium-chloride", "sodium-hydroxide", "sucrose"]
NACL_SERIES = {"solute": "sodium-chloride", "concentration": [0, 10, 20], "pressure": [101.325, 101.325, 50]}


def test_the_list_names_six_solutes_with_their_sources(client) -> None:
    body = client.get("/v1/solutes").get_json()
    assert body["count"] == 6
    assert sorted(s["id"] for s in body["solutes"]) == SOLUTE_IDS
    for s in body["solutes"]:
        assert s["method"] and s["source"], s["id"]
        assert (s["solubility"] is None) == (s["id"] == "sea-salt"), s["id"]
        assert ("degBx" in s["concentration_units"]) == (s["id"] == "sucrose"), s["id"]


def test_one_solute_by_alias_and_in_fahrenheit(client) -> None:
    assert client.get("/v1/solutes/brine").get_json()["id"] == "sodium-chloride"
    body = client.get("/v1/solutes/NaOH?temperature_unit=degF").get_json()
    assert body["id"] == "sodium-hydroxide"
    # 0 degC is 32 degF (definition of the Fahrenheit scale).
    assert body["range"]["temperature_min"] == {"value": pytest.approx(32.0), "unit": "degF"}
    assert {p["temperature"]["unit"] for p in body["solubility"]["points"]} == {"degF"}


def test_an_unknown_solute_is_not_found_with_close_matches(client) -> None:
    problem(client.get("/v1/solutes/xyz"), 404)
    detail = problem(client.get("/v1/solutes/salty"), 404)["detail"]
    assert "Closest matches" in detail and "sodium-chloride" in detail, detail


def test_sucrose_syrup_at_one_atmosphere(client) -> None:
    r = client.get("/v1/boiling-point?solute=sucrose&concentration=60&concentration_unit=degBx&pressure=101.325")
    assert r.status_code == 200
    body = r.get_json()
    # A 60 degBx syrup boils near 102.9 degC at 1 atm, 2.94 K above water (sugar-industry value, recalled from memory).
    assert body["boiling_point"] == {"value": pytest.approx(102.9, abs=0.5), "unit": "degC"}
    assert body["boiling_point_elevation"] == {"value": pytest.approx(2.94, abs=0.05), "unit": "K"}
    assert body["water_activity"]["unit"] == "1"
    assert body["solute"] == "sucrose" and body["fluid"] == "water"
    assert body["concentration"] == {"value": 60, "unit": "degBx"}


def test_seawater_boiling_point_elevation(client) -> None:
    body = client.get(
        "/v1/boiling-point?solute=sea-salt&concentration=35&concentration_unit=g/kg&elevation=0"
    ).get_json()
    # 0.52 K at 35 g/kg and 100 degC (Sharqawy, Lienhard and Zubair 2010).
    assert body["boiling_point_elevation"]["value"] == pytest.approx(0.52, abs=0.02)


def test_lithium_bromide_vapor_pressure(client) -> None:
    body = client.get("/v1/vapor-pressure?solute=LiBr&concentration=60&temperature=40").get_json()
    # 0.66 kPa over 60 wt% LiBr at 40 degC (Patek and Klomfar 2006).
    assert body["vapor_pressure"] == {"value": pytest.approx(0.66, rel=0.02), "unit": "kPa"}
    assert body["solute"] == "lithium-bromide"


def test_elevation_and_saturation_margin_answer_with_solute_fields(client) -> None:
    body = client.get("/v1/elevation?solute=sucrose&concentration=50&boiling_point=97").get_json()
    assert body["solute"] == "sucrose" and body["concentration"] == {"value": 50, "unit": "wt%"}
    assert {"boiling_point_elevation", "water_activity"} <= body.keys()
    r = client.get("/v1/saturation-margin?solute=caustic&concentration=2&temperature=90&pressure=101.325")
    assert r.status_code == 200
    assert r.get_json()["solute"] == "sodium-hydroxide"


def test_npsh_of_a_solution_needs_the_liquid_density(client) -> None:
    query = "/v1/npsh-available?solute=sodium-chloride&concentration=3&temperature=40&pressure=101.325&static_head=2"
    body = problem(client.get(query), 422)
    assert "liquid_density" in body["errors"] and "liquid_density" in body["detail"]
    r = client.get(query + "&liquid_density=1020")
    assert r.status_code == 200
    assert r.get_json()["liquid_density"] == {"value": 1020, "unit": "kg/m3"}


def test_zero_concentration_is_pure_water_exactly(client) -> None:
    salted = client.get("/v1/boiling-point?solute=sodium-chloride&concentration=0&pressure=85").get_json()
    plain = client.get("/v1/boiling-point?pressure=85").get_json()
    assert salted["boiling_point"]["value"] == plain["boiling_point"]["value"]
    assert salted["boiling_point_elevation"]["value"] == 0
    assert salted["water_activity"]["value"] == 1


def test_post_arrays_broadcast(client) -> None:
    r = client.post("/v1/boiling-point", json=NACL_SERIES)
    assert r.status_code == 200
    t = r.get_json()["boiling_point"]["value"]
    assert len(t) == 3 and t[0] < t[1]  # more salt at the same pressure boils hotter
    mismatched = {**NACL_SERIES, "concentration": [0, 10]}
    problem(client.post("/v1/boiling-point", json=mismatched), 400)


def test_csv_names_the_solute_and_its_columns(client) -> None:
    r = client.post("/v1/boiling-point?format=csv", json=NACL_SERIES)
    notes, rows = csv_answer(r.get_data(as_text=True))
    assert "solute: sodium-chloride" in notes
    assert len(rows) == 3
    assert {"boiling_point_elevation [K]", "water_activity [1]"} <= rows[0].keys()


@pytest.mark.parametrize(
    ("query", "status", "field"),
    [
        ("solute=sodium-chloride&concentration=-1", 422, "concentration"),
        ("solute=sodium-chloride&concentration=101", 422, "concentration"),
        ("solute=sodium-chloride&concentration=10&concentration_unit=degBx", 400, "concentration_unit"),
        ("fluid=ethanol&solute=sodium-chloride&concentration=10", 400, "fluid"),
        ("concentration=10", 400, "concentration"),
        ("solute=sodium-chloride", 400, "concentration"),
        ("solute=xyz&concentration=10", 404, "solute"),
        ("solute=sodium-chloride&concentration=10&concentration_unit=kPa", 400, "concentration_unit"),
        ("solute=sodium-chloride&concentration=10&concentration_unit=wt", 400, "concentration_unit"),
        ("solute=sodium-chloride&concentration=nan", 400, "concentration"),
    ],
)
def test_refusals(client, query: str, status: int, field: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?pressure=101.325&{query}"), status)
    assert field in body["errors"], body


def test_above_the_solubility_is_refused_naming_it(client) -> None:
    body = problem(client.get("/v1/boiling-point?solute=sodium-chloride&concentration=30&pressure=101.325"), 422)
    assert "solubility" in body["detail"], body["detail"]


def test_caustic_beyond_the_equation_range(client) -> None:
    # The Olsson-Jernqvist-Aly equation holds to 200 degC; 50 wt% NaOH boils there near 500 kPa, and the service
    # extrapolates at most 10 K beyond, so 3000 kPa is refused even with extrapolate=true.
    base = "/v1/boiling-point?solute=NaOH&concentration=50"
    problem(client.get(f"{base}&pressure=3000"), 422)
    problem(client.get(f"{base}&pressure=3000&extrapolate=true"), 422)
    problem(client.get(f"{base}&pressure=1600&extrapolate=true"), 422)  # beyond the 10 K reach too
    r = client.get(f"{base}&pressure=500&extrapolate=true")
    assert r.status_code == 200
    assert any("extrapolated" in w for w in r.get_json()["warnings"])


def test_brine_as_a_fluid_points_to_the_solute(client) -> None:
    detail = problem(client.get("/v1/boiling-point?fluid=brine&pressure=101.325"), 404)["detail"]
    assert "solute=sodium-chloride" in detail


def test_percent_is_read_as_mass_percent(client) -> None:
    query = "/v1/boiling-point?solute=sodium-chloride&concentration=10&pressure=101.325&concentration_unit="
    percent = client.get(query + "%25").get_json()
    assert percent["concentration"] == {"value": 10, "unit": "wt%"}
    assert percent["boiling_point"] == client.get(query + "wt%25").get_json()["boiling_point"]


def test_arrays_of_mixed_validity_name_the_points_refused(client) -> None:
    # 40 wt% NaCl is above its solubility at any temperature (about 28 wt% near 100 degC; Sparrow 2003), so
    # the one bad point is refused by its index and no answer is given for the others.
    r = client.post("/v1/boiling-point", json={"solute": "NaCl", "concentration": [10, 40, 5], "pressure": 101.325})
    body = problem(r, 422)
    assert body["errors"]["concentration"][0].startswith("index 1: 40 wt% is above"), body


def test_concentration_units_are_read_in_any_case(client) -> None:
    # Unit spellings fold case where no other unit folds alike (service/physics/units.py).
    upper = client.get("/v1/boiling-point?solute=sucrose&concentration=60&concentration_unit=BRIX&pressure=101.325")
    exact = client.get("/v1/boiling-point?solute=sucrose&concentration=60&concentration_unit=degBx&pressure=101.325")
    assert upper.get_json()["boiling_point"] == exact.get_json()["boiling_point"]


def test_npsh_of_caustic_uses_its_density_unless_given_one(client) -> None:
    # Olsson, Jernqvist and Aly (1997) give the density of NaOH solutions; a caller's measured one replaces it.
    query = "/v1/npsh-available?solute=NaOH&concentration=50&temperature=20&pressure=101.325&static_head=2"
    found = client.get(query).get_json()
    assert found["liquid_density"]["value"] == pytest.approx(1520.0, rel=0.005)  # Dow: specific gravity 1.52
    assert "Olsson-Jernqvist-Aly density equation" in found["method"]
    given = client.get(query + "&liquid_density=1530").get_json()
    assert given["liquid_density"] == {"value": 1530, "unit": "kg/m3"}


@pytest.mark.parametrize(
    ("solute", "concentrations"),
    [("sodium-chloride", [5, 25]), ("lithium-bromide", [5, 50]), ("sea-salt", [1, 10]), ("sucrose", [5, 60])],
)
def test_an_array_answers_each_point_as_a_single_request_does(client, solute: str, concentrations: list) -> None:
    # Each point's solver stops at its own convergence: the same floats alone and in an array (the design's rule).
    pressures = [20, 101.325]
    array = client.post(
        "/v1/boiling-point", json={"solute": solute, "concentration": concentrations, "pressure": pressures}
    )
    singles = [
        client.get(f"/v1/boiling-point?solute={solute}&concentration={c}&pressure={p}").get_json()["boiling_point"]
        for c, p in zip(concentrations, pressures, strict=True)
    ]
    assert array.get_json()["boiling_point"]["value"] == [s["value"] for s in singles]
