"""Every solute form is used by a built-in solute and builds from its file (service/fluids/solute_forms.py)."""

from __future__ import annotations

from service.fluids.solute_forms import SOLUTE_FORMS, SOLUTION_DENSITY_FORMS
from service.fluids.solutes import load_solutes


def test_every_form_has_a_solute() -> None:
    solutes = load_solutes().entries.values()
    used = {type(s.equation) for s in solutes} | {type(s.density.equation) for s in solutes if s.density}
    assert len(used) == len(SOLUTE_FORMS) + len(SOLUTION_DENSITY_FORMS), used
