"""GET /v1/fluids and /v1/fluids/<name> (``service.api.paths.fluid_catalog``): the list, search and
details. How a name is looked up is ``test_catalog_lookup.py``'s."""

import pytest


def test_list_has_water_with_range_and_cas(client) -> None:
    body = client.get("/v1/fluids").get_json()
    assert body["count"] == len(body["fluids"]) >= 1
    water = next(f for f in body["fluids"] if f["id"] == "water")
    assert water["cas"] == "7732-18-5"
    assert water["range"]["pressure_min"] == {"value": pytest.approx(0.611657, abs=1e-6), "unit": "kPa"}
    assert water["normal_boiling_point"]["value"] == pytest.approx(99.974, abs=1e-3)


def test_search(client) -> None:
    assert [f["id"] for f in client.get("/v1/fluids?q=h2o").get_json()["fluids"]] == ["water"]
    assert client.get("/v1/fluids?q=no-such-thing").get_json() == {"count": 0, "fluids": []}


def test_detail_in_requested_units(client) -> None:
    body = client.get("/v1/fluids/steam?temperature_unit=K&pressure_unit=MPa").get_json()
    assert body["id"] == "water"
    assert body["critical_point"] == {
        "temperature": {"value": 647.096, "unit": "K"},
        "pressure": {"value": pytest.approx(22.064), "unit": "MPa"},
    }
    assert body["triple_point"]["temperature"] == {"value": 273.16, "unit": "K"}
    assert body["molar_mass"] == pytest.approx(0.018015268)
    assert "IAPWS" in body["method"] and "1993" in body["source"]


def test_bad_unit_on_the_catalog(client) -> None:
    assert client.get("/v1/fluids?temperature_unit=kelvins").status_code == 400


def test_one_normal_boiling_point_per_fluid_the_one_the_service_computes(client) -> None:
    # Ethanol's catalog lists 78.42 degC from its reference equation of state (constants_source); the
    # service's vapor-pressure equation gives 78.265 degC at 101.325 kPa. The catalog shows the second,
    # with the first beside it labelled by its source and the difference.
    listed = client.get("/v1/fluids").get_json()["fluids"]
    for fluid in listed:
        nbp = fluid["normal_boiling_point"]
        answer = client.get(f"/v1/boiling-point?pressure=101.325&fluid={fluid['id']}")
        if nbp is None:
            assert answer.status_code == 422, fluid["id"]
            continue
        assert answer.get_json()["boiling_point"]["value"] == nbp["value"], fluid["id"]
    ethanol = client.get("/v1/fluids/ethanol").get_json()
    reference = ethanol["reference_normal_boiling_point"]
    assert reference["temperature"]["value"] == pytest.approx(78.42)
    assert reference["difference"] == {
        "value": pytest.approx(ethanol["normal_boiling_point"]["value"] - 78.42),
        "unit": "K",
    }
    assert "Schroeder" in reference["source"]


def test_catalog_lists_forty_fluids_with_sources(client) -> None:
    body = client.get("/v1/fluids").get_json()
    assert body["count"] >= 40
    for fluid in body["fluids"]:
        assert fluid["cas"] and fluid["source"] and fluid["method"]
        assert fluid["range"]["temperature_min"]["value"] < fluid["range"]["temperature_max"]["value"]


def test_search_names_and_aliases(client) -> None:
    ids = [f["id"] for f in client.get("/v1/fluids?q=xylene").get_json()["fluids"]]
    assert {"o-xylene", "m-xylene", "p-xylene"} <= set(ids)
