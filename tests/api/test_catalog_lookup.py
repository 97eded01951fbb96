"""A request's fluid looked up in the catalog (``service.api.catalog_lookup``), on /v1/fluids/<name> and
on the computing paths: aliases, CAS numbers and letter case; an unknown name is a 404 naming the
closest matches."""

import pytest


@pytest.mark.parametrize(
    ("name", "fluid_id"),
    [
        ("ethyl alcohol", "ethanol"),
        ("64-17-5", "ethanol"),
        ("R-134A", "r134a"),
        ("IPA", "2-propanol"),
        ("Toluene", "toluene"),
        ("N2", "nitrogen"),
    ],
)
def test_lookup_names(client, name: str, fluid_id: str) -> None:
    assert client.get(f"/v1/fluids/{name}").get_json()["id"] == fluid_id


def test_unknown_fluid_suggests_three(client) -> None:
    r = client.get("/v1/boiling-point?pressure=50&fluid=tolune")
    assert r.status_code == 404
    assert "toluene" in r.get_json()["detail"]
    assert r.get_json()["detail"].count(",") >= 2


def test_unknown_fluid_lists_close_matches(client) -> None:
    r = client.get("/v1/fluids/watter")
    assert r.status_code == 404
    assert "water" in r.get_json()["detail"]


def test_unknown_fluid_on_a_computing_path(client) -> None:
    r = client.get("/v1/boiling-point?pressure=100&fluid=unobtainium")
    assert r.status_code == 404
    assert r.get_json()["errors"] == {"fluid": ["unknown fluid 'unobtainium'"]}


def test_fluid_by_alias_and_cas(client) -> None:
    for name in ("H2O", "7732-18-5", "Steam"):
        assert client.get(f"/v1/boiling-point?pressure=100&fluid={name}").get_json()["fluid"] == "water"


@pytest.mark.parametrize("name", ["seawater", "brine", "50% glycol", "sugar solution", "ethanol/water", "salt water"])
def test_a_solution_or_a_mixture_is_never_answered_with_a_pure_component(client, name: str) -> None:
    # 'seawater' used to suggest water, '50% glycol' ethylene glycol: answers that would be wrong by the
    # boiling-point elevation or the mixture's boiling range (common practice, no source).
    responses = [client.get("/v1/boiling-point", query_string={"fluid": name, "pressure": 101.325})]
    if "/" not in name:  # a slash cannot stand in a path segment
        responses.append(client.get(f"/v1/fluids/{name}"))
    for response in responses:
        assert response.status_code == 404
        body = response.get_json()
        assert "not a pure fluid" in body["detail"] and "Closest matches" not in body["detail"]
        assert body["errors"] == {"fluid": ["a solution or a mixture, not a pure fluid"]}


@pytest.mark.parametrize("name", ["propylene glycol", "ammonia 99.98 %", "water/steam"])
def test_names_of_pure_fluids_outside_the_catalog_still_get_close_matches(client, name: str) -> None:
    detail = client.get("/v1/boiling-point", query_string={"fluid": name, "pressure": 101.325}).get_json()["detail"]
    assert "Closest matches" in detail and "not a pure fluid" not in detail
