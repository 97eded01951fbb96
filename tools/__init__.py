"""Maintainer tools for the fluid catalog (not part of the service)."""
