"""The saturation-temperature table against the Newton inverse it is built from."""

import numpy as np
import pytest

from service.physics import water
from service.physics.inverse_table import InverseTable
from tests.physics.test_vapor_pressure import WATER_ANTOINE  # the handbook set: a second equation to reproduce


@pytest.mark.parametrize("equation", [WATER_ANTOINE, water.SATURATION], ids=["antoine", "wagner"])
def test_inverse_table_reproduces_newton(equation) -> None:
    low, high = 274.0, 646.0
    table = InverseTable(equation, low, high)
    p = np.geomspace(float(equation.pressure(low)), float(equation.pressure(high)), 200_001)
    answers = table(p)
    assert np.max(np.abs(answers - equation.temperature(p, low, high))) < 1e-9
    assert np.all(np.diff(answers) >= 0) and answers.min() >= low and answers.max() <= high  # monotone, in range
    assert table(np.array([1e-9, 1e12])).tolist() == [low, high]
