"""Activity-coefficient models of liquid mixtures: ln gamma per component, vectorised over points.

Every model takes mole fractions ``x`` of shape (..., n) and temperatures [K] of shape (...) and
returns ln gamma of shape (..., n). Binary interaction parameters are n x n arrays, zero on the diagonal.
"""
