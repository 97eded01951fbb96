"""Plain text for terminals and CSV for arrays: both parse back to the JSON values."""

import csv
import io


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
        rows = list(csv.DictReader(io.StringIO(r.get_data(as_text=True))))
        assert len(rows) == 3
        assert [float(row["saturation_temperature [degC]"]) for row in rows] == body["saturation_temperature"]["value"]
        assert [float(row["margin [K]"]) for row in rows] == body["margin"]["value"]
        assert [row["state"] for row in rows] == body["state"]
        assert all(float(row["pressure [kPa]"]) == 85.39 for row in rows)


def test_format_values_are_checked(client) -> None:
    assert client.get("/v1/boiling-point?pressure=100&format=xml").status_code == 400
    assert client.post("/v1/boiling-point?format=text", json={"pressure": 100}).status_code == 400
