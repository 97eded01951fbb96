"""Cautions an answer carries, which of its points each one concerns, and the numbers in their text."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Literal

import numpy as np
from numpy.typing import NDArray

Kind = Literal["pressure", "temperature", "length", "concentration", "temperature difference"]
"""What a number in a message measures; the API shows it in the request's unit of that kind."""


@dataclass(frozen=True)
class Shown:
    """A number in the text of a caution or a refusal [SI], to be shown in the caller's unit."""

    value: float
    kind: Kind
    digits: int = 6


@dataclass(frozen=True)
class Caution:
    """A warning about some points of an answer.

    ``points`` is a boolean mask that broadcasts to the answer's shape (a single answer: a single
    boolean); a plain string among an answer's warnings concerns every point. With ``shown``, ``text``
    is a template whose ``{name}`` fields take those numbers in the caller's units: any other text in
    it goes through :func:`literal`.
    """

    text: str
    points: NDArray[np.bool_] | np.bool_ | bool = True
    shown: Mapping[str, Shown] = field(default_factory=dict)


def literal(text: str) -> str:
    """``text`` as it reads inside a message template: braces doubled, so that a name holding them (a fluid a
    caller named ``{x}``, say) comes out as written when the template is filled.

    >>> literal("{x}").format()
    '{x}'
    """
    return text.replace("{", "{{").replace("}", "}}")


Warnings = list[str | Caution]
"""An answer's warnings: plain text concerns every point."""
