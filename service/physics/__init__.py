"""Physics: pure, vectorised numpy functions in SI units (Pa, K, m); no web framework here."""
