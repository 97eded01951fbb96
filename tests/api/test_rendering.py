"""Answers as JSON, plain text for terminals and CSV for arrays (``service.api.rendering``): both parse
back to the JSON values; array warnings name the points they concern."""

import numpy as np

from service.api import rendering
from service.fluids.cautions import Caution, Shown
from service.physics.units import resolve_unit
from tests.conftest import csv_answer


def parse_text(text: str) -> dict:
    out = {}
    for line in text.strip().splitlines():
        name, _, rest = line.partition(": ")
        out.setdefault(name, []).append(rest)
    return out


def test_text_answer_parses_back(client) -> None:
    query = "/v1/boiling-point?gauge_pressure=950&elevation=1420"
    body = client.get(query).get_json()
    for r in (client.get(query + "&format=text"), client.get(query, headers={"Accept": "text/plain"})):
        assert r.mimetype == "text/plain"
        lines = parse_text(r.get_data(as_text=True))
        for name in ("pressure", "boiling_point", "sensitivity"):
            value, unit = lines[name][0].split(" ")
            assert float(value) == body[name]["value"] and unit == body[name]["unit"]
        assert lines["fluid"] == ["water"]
        assert lines["warning"] == body["warnings"]


def test_json_stays_the_default(client) -> None:
    for accept in (None, "*/*", "application/json, text/plain;q=0.5"):
        headers = {"Accept": accept} if accept else {}
        assert client.get("/v1/vapor-pressure?temperature=50", headers=headers).mimetype == "application/json"


def test_csv_answer_parses_back(client) -> None:
    payload = {"temperature": [20.0, 95.25, 99.0], "barometric_pressure": 85.39}
    body = client.post("/v1/saturation-margin", json=payload).get_json()
    for r in (
        client.post("/v1/saturation-margin?format=csv", json=payload),
        client.post("/v1/saturation-margin", json=payload, headers={"Accept": "text/csv"}),
    ):
        assert r.mimetype == "text/csv"
        _, rows = csv_answer(r.get_data(as_text=True))
        assert len(rows) == 3
        assert [float(row["saturation_temperature [degC]"]) for row in rows] == body["saturation_temperature"]["value"]
        assert [float(row["margin [K]"]) for row in rows] == body["margin"]["value"]
        assert [row["state"] for row in rows] == body["state"]
        assert all(float(row["pressure [kPa]"]) == 85.39 for row in rows)


def test_format_values_are_checked(client) -> None:
    assert client.get("/v1/boiling-point?pressure=100&format=xml").status_code == 400
    assert client.post("/v1/boiling-point?format=text", json={"pressure": 100}).status_code == 400


def test_array_warnings_name_the_points_they_concern(client) -> None:
    # r134a: Tc = 101.06 degC; 99.5 degC lies within 2 % of it, 10 degC does not (the catalog entry).
    body = client.post("/v1/vapor-pressure", json={"fluid": "r134a", "temperature": [10, 99.5, 20, 99.8]}).get_json()
    near = [w for w in body["warnings"] if "critical temperature" in w]
    assert near == [next(w for w in near if w.startswith("points 1, 3: "))]
    # n-dodecane's equation is stated from 295 K (21.85 degC); its triple point is at 263.57 K (the catalog entry).
    extrapolated = client.post(
        "/v1/vapor-pressure?extrapolate=true", json={"fluid": "n-dodecane", "temperature": [0, 5, 30, 10]}
    ).get_json()
    assert any(w.startswith("points 0-1, 3: temperature lies outside") for w in extrapolated["warnings"])
    atmosphere = client.post("/v1/boiling-point", json={"elevation": [0, 1420]}).get_json()
    assert any(w.startswith("all points: The local atmospheric pressure") for w in atmosphere["warnings"])
    single = client.get("/v1/vapor-pressure?fluid=r134a&temperature=99.5").get_json()
    assert any(w.startswith("Within 2 %") for w in single["warnings"])


def test_csv_answers_keep_method_source_and_warnings_per_row(client) -> None:
    payload = {"fluid": "r134a", "temperature": [10, 99.5, 20], "tag": ["TI-1", "TI-2", "TI-3"]}
    body = client.post("/v1/vapor-pressure", json=payload).get_json()
    notes, rows = csv_answer(client.post("/v1/vapor-pressure?format=csv", json=payload).get_data(as_text=True))
    assert f"method: {body['method']}" in notes and f"source: {body['source']}" in notes
    numbered = {n.split(": ", 1)[0]: n.split(": ", 1)[1] for n in notes if n.startswith("warning ")}
    near = next(k for k, text in numbered.items() if "critical temperature" in text)
    assert [row["tag"] for row in rows] == ["TI-1", "TI-2", "TI-3"]
    assert [near.removeprefix("warning ") in row["warnings"].split() for row in rows] == [False, True, False]
    assert [float(row["vapor_pressure [kPa]"]) for row in rows] == body["vapor_pressure"]["value"]


def test_a_tag_starting_with_a_hash_stays_a_row(client) -> None:
    payload = {"pressure": [90, 100], "tag": ["#1 drum", "#2 drum"]}
    notes, rows = csv_answer(client.post("/v1/boiling-point?format=csv", json=payload).get_data(as_text=True))
    assert [row["tag"] for row in rows] == ["#1 drum", "#2 drum"] and len(notes) == 3


def test_numbers_in_cautions_read_in_the_request_units() -> None:
    # A temperature difference of 0.5 K reads 0.9 degR in a Fahrenheit request (1 K = 1.8 degR, by definition).
    units = {"temperature": resolve_unit("degF", "temperature"), "pressure": resolve_unit("kPa", "pressure")}
    cautions = [
        Caution("moves it by {spread}", True, {"spread": Shown(0.5, "temperature difference", 2)}),
        Caution("below {p}", np.array([True, False]), {"p": Shown(611.657, "pressure")}),
        "plain text",
    ]
    shown = rendering.in_units(cautions, units)
    assert [getattr(c, "text", c) for c in shown] == ["moves it by 0.9 degR", "below 0.611657 kPa", "plain text"]
    assert shown[1].points.tolist() == [True, False]
