"""Caching of answers: strong ETags, Cache-Control, and each worker's cache of recent GET answers."""

from __future__ import annotations

import hashlib
from collections import OrderedDict
from collections.abc import Callable
from typing import Any

from flask import Response, request

from service.api.json_provider import encode
from service.api.rendering import MEDIA_TYPES

CACHE_CONTROL = "public, max-age=3600"
"""Answers follow from the request and the built-in tables alone: an hour is safe for any cache."""


def cacheable(body: dict[str, Any]) -> Response:
    """The JSON answer ``body`` with a strong ETag, cacheable; 304 when If-None-Match matches it."""
    content = encode(body)
    return _tagged(content, MEDIA_TYPES["json"], _etag(content))


def _etag(body: bytes) -> str:
    return hashlib.blake2b(body, digest_size=16).hexdigest()


def _tagged(body: bytes, mimetype: str, etag: str) -> Response:
    headers = [("ETag", f'"{etag}"'), ("Cache-Control", CACHE_CONTROL), ("Vary", "Accept")]
    # If-None-Match compares weakly (RFC 9110); most requests carry none, and skip parsing it.
    if "HTTP_IF_NONE_MATCH" in request.environ and request.if_none_match.contains_weak(etag):
        return Response(status=304, headers=headers)
    return Response(body, mimetype=mimetype, headers=headers)


class AnswerCache:
    """The last answers to identical GETs, per worker: an answer depends only on the request.

    Keyed by path, query string and Accept header; holds ``size`` answers, least recently
    used out first. Refusals are not kept: they raise before anything is stored. Every
    answer, cached or not, carries its ETag and Cache-Control (:func:`_tagged`).
    """

    def __init__(self, size: int) -> None:
        self.size = size
        self._answers: OrderedDict[tuple[str, bytes, str], tuple[bytes, str, str]] = OrderedDict()

    def answer(self, compute: Callable[[], tuple[bytes, str]]) -> Response:
        """The response to this GET: ``compute()`` gives its body and media type, unless a recent answer stands."""
        key = (request.path, request.query_string, request.environ.get("HTTP_ACCEPT", ""))
        hit = self._answers.get(key)
        if hit is None:
            content, mimetype = compute()
            hit = (content, mimetype, _etag(content))
            if self.size:
                self._answers[key] = hit
                if len(self._answers) > self.size:
                    self._answers.popitem(last=False)
        else:
            self._answers.move_to_end(key)
        return _tagged(*hit)
