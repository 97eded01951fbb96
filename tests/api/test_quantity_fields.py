"""Quantities at the HTTP edge (``service.api.quantity_fields``): numbers, arrays and ``{value, unit}``
objects in a POST body, and unit spellings: letter case, and gauge or absolute marks."""

import pytest

from tests.api.test_problems import problem


@pytest.mark.parametrize(
    ("body", "field"),
    [
        ({"pressure": "100"}, "pressure"),
        ({"pressure": True}, "pressure"),
        ({"pressure": [1, None]}, "pressure"),
        ({"pressure": [[1, 2]]}, "pressure"),
        ({"pressure": {"value": 1, "unit": 5}}, "pressure"),
        ({"pressure": {"value": 1, "unit": "K"}}, "pressure"),
        ({"pressure": {"unit": "kPa"}}, "pressure"),
        ({"pressure": {"value": 1, "extra": 2}}, "pressure"),
        ({"pressure": 100, "fluid": 7}, "fluid"),
        ({"pressure": [1, 2, 3], "elevation": [1, 2]}, "pressure"),
    ],
)
def test_post_refusals(client, body: dict, field: str) -> None:
    assert field in problem(client.post("/v1/boiling-point", json=body), 400)["errors"]


@pytest.mark.parametrize(
    ("query", "field", "says"),
    [
        # 10 mPa would be 1e-8 of 10 MPa: letter case carries the SI prefix (SI Brochure, 9th ed., table 7).
        ("pressure=10&pressure_unit=mPa", "pressure_unit", "millipascal"),
        ("pressure=1&pressure_unit=Mbar", "pressure_unit", "megabar"),
        ("pressure=1&pressure_unit=MBAR", "pressure_unit", "could be Mbar (the megabar) or mbar (millibar)"),
        ("pressure=10&pressure_unit=mpa", "pressure_unit", "could be MPa (megapascal) or mPa (the millipascal)"),
        ("gauge_pressure=10&elevation=1420&pressure_unit=psia", "gauge_pressure", "is a gauge reading"),
        ("pressure=10&pressure_unit=psig", "pressure_unit", "marks a gauge reading"),
    ],
)
def test_units_whose_case_or_kind_is_wrong_are_refused(client, query: str, field: str, says: str) -> None:
    body = problem(client.get(f"/v1/boiling-point?{query}"), 400)
    assert says in body["errors"][field][0], body


def test_gauge_and_absolute_spellings_on_their_own_quantities(client) -> None:
    gauge = {"gauge_pressure": {"value": 10, "unit": "psig"}, "barometric_pressure": {"value": 0.854, "unit": "bara"}}
    body = client.post("/v1/boiling-point?pressure_unit=psi", json=gauge).get_json()
    assert body["gauge_pressure"] == {"value": 10.0, "unit": "psi"}
    assert body["pressure"]["value"] == pytest.approx(10 + 85_400 / 6894.757293168)
    wrong = {"gauge_pressure": {"value": 10, "unit": "psia"}, "elevation": 1420}
    assert "marks an absolute pressure" in problem(client.post("/v1/boiling-point", json=wrong), 400)["detail"]
    absolute = {"pressure": {"value": 2, "unit": "barg"}}
    assert "marks a gauge reading" in problem(client.post("/v1/boiling-point", json=absolute), 400)["detail"]
    # Water columns and the technical atmosphere (units module): 1 kgf/cm2 = 98.0665 kPa.
    kgf = client.get("/v1/boiling-point?pressure=1&pressure_unit=kgf/cm2").get_json()
    assert kgf["sensitivity"]["unit"] == "degC/(kgf/cm2)"


def test_absolute_spellings_fit_every_absolute_pressure_and_a_difference(client) -> None:
    # psia marks an absolute pressure: sea-level pressures, air pressures and uncertainties take it as psi.
    for query in (
        "/v1/atmosphere?elevation=1420&sea_level_pressure=14.7&pressure_unit=psia",
        "/v1/elevation?pressure=12.38&pressure_unit=psia",
        "/v1/boiling-point?barometric_pressure=12.38&pressure_unit=psia&pressure_uncertainty=0.01",
    ):
        assert client.get(query).status_code == 200, query
    posted = client.post("/v1/elevation", json={"pressure": {"value": 12.38, "unit": "PSIA"}})
    assert posted.status_code == 200
