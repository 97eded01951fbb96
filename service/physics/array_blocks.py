"""Evaluate long arrays in cache-sized blocks.

A chain of numpy operations over a million points streams every temporary through main
memory; over blocks of 16 384 points the temporaries stay in the CPU cache and the chain
runs several times faster. Results are identical: every element sees the same operations.

Single values go through as numpy scalars rather than 0-d arrays: the same ufunc loops give
the same floats, and scalar arithmetic skips most of numpy's per-call array machinery. That
holds for numpy's functions only: Python's ``**`` on a numpy scalar calls the C library's
``pow``, which may differ from numpy's loops in the last bit, so the physics writes
``np.power`` and ``np.square`` instead.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from functools import wraps

import numpy as np
from numpy.typing import ArrayLike, NDArray

Numbers = NDArray[np.float64] | float
"""An array of numbers, or a single number: a numpy scalar (a float, too) as it travels through the service."""

BLOCK = 16_384
"""Points per block: 128 KiB per float64 temporary, inside a typical L2 cache."""


def in_blocks(func: Callable[..., NDArray], *args: ArrayLike) -> NDArray[np.float64] | np.float64:
    """``func(*args)`` for an elementwise ``func``, run block by block when the arrays are long.

    >>> bool(np.array_equal(in_blocks(np.square, np.arange(50_000.0)), np.arange(50_000.0) ** 2))
    True
    >>> in_blocks(np.square, 3.0)
    np.float64(9.0)
    """
    if all(isinstance(a, float) for a in args):  # single values (numpy's float64 is a float too)
        return func(*map(np.float64, args))
    values = [_single_or_array(a) for a in args]
    arrays = [v for v in values if isinstance(v, np.ndarray)]
    if not arrays or max(a.size for a in arrays) <= BLOCK:
        return func(*values)  # small: numpy broadcasts inside, nothing to split
    shape = np.broadcast_shapes(*(a.shape for a in arrays))
    # Arrays are spread to the common shape; single values stay single and meet every block as they are.
    flat = [np.broadcast_to(v, shape).reshape(-1) if isinstance(v, np.ndarray) else v for v in values]
    out = np.empty(math.prod(shape))
    for start in range(0, out.size, BLOCK):
        out[start : start + BLOCK] = func(*(v[start : start + BLOCK] if isinstance(v, np.ndarray) else v for v in flat))
    return out.reshape(shape)


def _single_or_array(value: ArrayLike) -> NDArray[np.float64] | np.float64:
    """``value`` as a float array, or as a numpy scalar when it is a single number."""
    array = np.asarray(value, dtype=float)
    return array[()] if array.ndim == 0 else array


def blockwise(func: Callable[..., NDArray]) -> Callable[..., NDArray[np.float64] | np.float64]:
    """Decorate an elementwise function of array arguments so that long inputs run block by block."""

    @wraps(func)
    def wrapper(*args: ArrayLike) -> NDArray[np.float64] | np.float64:
        return in_blocks(func, *args)

    return wrapper
