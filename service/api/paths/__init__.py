"""The endpoints, one module per group of paths; each module's ``blueprint`` is registered by walking this
package, so a new module needs no entry in a second list."""

from __future__ import annotations

import importlib
import pkgutil

from flask import Blueprint


def blueprints() -> list[Blueprint]:
    """The blueprint of every module in this package, in module-name order."""
    return [importlib.import_module(f"{__name__}.{module.name}").blueprint for module in pkgutil.iter_modules(__path__)]
