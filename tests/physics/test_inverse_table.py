"""The saturation-temperature table against the Newton inverse it is built from."""

import math

import numpy as np
import pytest

from service.physics import water
from service.physics.inverse_table import InverseTable
from service.physics.vapor_pressure import ExtendedAntoine

# The classic handbook Antoine set of water in ln(p/Pa) and K (see tests/physics/test_vapor_pressure.py):
# a second, different equation for the table to reproduce.
ANTOINE = ExtendedAntoine(a=math.log(133.322387415) + math.log(10) * 8.07131, b=-math.log(10) * 1730.63, c=-39.724)


@pytest.mark.parametrize("equation", [ANTOINE, water.SATURATION], ids=["antoine", "wagner"])
def test_inverse_table_reproduces_newton(equation) -> None:
    low, high = 274.0, 646.0
    table = InverseTable(equation, low, high)
    p = np.geomspace(float(equation.pressure(low)), float(equation.pressure(high)), 200_001)
    answers = table(p)
    assert np.max(np.abs(answers - equation.temperature(p, low, high))) < 1e-9
    assert np.all(np.diff(answers) >= 0) and answers.min() >= low and answers.max() <= high  # monotone, in range
    assert table(np.array([1e-9, 1e12])).tolist() == [low, high]
