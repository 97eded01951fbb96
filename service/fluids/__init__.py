"""The domain: what can boil, its limits and cautions as data, and the questions the paths ask of it."""
