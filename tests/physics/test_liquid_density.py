"""Saturated-liquid density forms: single values and arrays alike."""

import numpy as np

from service.physics import water
from service.physics.liquid_density import Dippr105


def test_single_values_get_the_floats_of_an_array() -> None:
    # np.power on a scalar runs numpy's loops, where Python's ** on a numpy scalar would call the C library's pow.
    methanol = Dippr105(a=2326.7, b=0.27073, c=512.5, d=0.24713)  # Perry's 8th ed., Table 2-32
    t = np.random.default_rng(101).uniform(290.0, 500.0, 2000)
    assert [methanol.molar_density(float(v)) for v in t] == methanol.molar_density(t).tolist()
    assert [water.saturated_liquid_density(float(v)) for v in t] == water.saturated_liquid_density(t).tolist()
