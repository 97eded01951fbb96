"""Cautions an answer carries, and which of its points each one concerns."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from numpy.typing import NDArray


@dataclass(frozen=True)
class Caution:
    """A warning about some points of an answer.

    ``points`` is a boolean mask that broadcasts to the answer's shape (a single answer: a single
    boolean); a plain string among an answer's warnings concerns every point.
    """

    text: str
    points: NDArray[np.bool_] | np.bool_ | bool


Warnings = list[str | Caution]
"""An answer's warnings: plain text concerns every point."""
