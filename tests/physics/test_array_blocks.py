"""Blocks and single values: the same floats whichever way a value arrives."""

import ast
from pathlib import Path

import numpy as np

from service.physics import array_blocks

PHYSICS = Path(array_blocks.__file__).parent


def test_long_arrays_run_in_blocks_with_single_values_alongside() -> None:
    x = np.linspace(0.0, 1.0, 3 * array_blocks.BLOCK + 5)
    assert np.array_equal(array_blocks.in_blocks(np.add, x, 2.0), x + 2.0)
    assert np.array_equal(array_blocks.in_blocks(np.add, x, np.full(x.shape, 2.0)), x + 2.0)
    assert array_blocks.in_blocks(np.add, np.asarray(1.0), 2.0) == 3.0


def test_no_python_power_operator_in_the_physics() -> None:
    # On a numpy scalar, ** calls the C library's pow, which can differ from numpy's array loops in
    # the last bit; single answers would then differ from array answers. np.power keeps them equal.
    uses = [
        f"{path.name}:{node.lineno}"
        for path in sorted(PHYSICS.glob("*.py"))
        for node in ast.walk(ast.parse(path.read_text(encoding="utf-8")))
        if isinstance(node, ast.BinOp | ast.AugAssign) and isinstance(node.op, ast.Pow)
    ]
    assert not uses, f"use np.power or np.square instead of ** at {', '.join(uses)}"
