"""Caching of answers (``service.api.answer_cache``): strong ETags, 304 Not Modified, and each worker's
bounded cache of recent GET answers."""

from service import create_app


def test_etag_and_not_modified(client) -> None:
    first = client.get("/v1/boiling-point?pressure=101.325")
    etag = first.headers["ETag"]
    assert not etag.startswith("W/") and "max-age" in first.headers["Cache-Control"]
    again = client.get("/v1/boiling-point?pressure=101.325", headers={"If-None-Match": etag})
    assert again.status_code == 304 and again.data == b""
    other = client.get("/v1/boiling-point?pressure=101.3", headers={"If-None-Match": etag})
    assert other.status_code == 200 and other.headers["ETag"] != etag
    text = client.get("/v1/boiling-point?pressure=101.325&format=text")
    assert text.headers["ETag"] != etag  # another representation, another tag


def test_answer_cache_gives_the_same_answer_and_stays_bounded() -> None:
    cached, uncached = create_app({"ANSWER_CACHE_SIZE": 2}).test_client(), create_app({"ANSWER_CACHE_SIZE": 0})
    fresh = uncached.test_client()
    for q in ("pressure=50", "pressure=60", "pressure=70", "pressure=50", "pressure=50&format=text"):
        a, b = cached.get(f"/v1/boiling-point?{q}"), fresh.get(f"/v1/boiling-point?{q}")
        assert a.data == b.data and a.headers["ETag"] == b.headers["ETag"] and a.mimetype == b.mimetype
    assert len(cached.application.extensions["answers"]._answers) == 2
    assert cached.get("/v1/boiling-point?pressure=0.1").status_code == 422  # refusals are not kept
    assert len(cached.application.extensions["answers"]._answers) == 2


def test_weak_etag_matches(client) -> None:
    etag = client.get("/v1/boiling-point?pressure=100").headers["ETag"]
    assert client.get("/v1/boiling-point?pressure=100", headers={"If-None-Match": f"W/{etag}"}).status_code == 304
