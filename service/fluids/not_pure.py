"""Names that mean a solution or a mixture, not a pure fluid.

A plant calls its liquids by what they are for: brine, syrup, seawater, the stripper's wash, a
coolant at 50 %. None of them boils where a pure component does (a dissolved solid raises the
boiling point; a liquid mixture boils over a range), so a name like these must never be answered
with the nearest pure component's name. The words below are the trade's (common practice, no
source).
"""

from __future__ import annotations

import re
from collections.abc import Callable

SOLUTIONS = {
    "brine": "a salt dissolved in water",
    "salt water": "a salt dissolved in water",
    "saltwater": "a salt dissolved in water",
    "seawater": "water with sea salt (about 35 g/kg)",
    "sea water": "water with sea salt (about 35 g/kg)",
    "syrup": "sugar dissolved in water",
    "sugar solution": "sugar dissolved in water",
    "juice": "sugars and acids dissolved in water",
    "milk": "water with lactose, salts, proteins and fat",
    "whey": "water with lactose and salts",
    "caustic": "sodium hydroxide dissolved in water",
    "lye": "sodium hydroxide dissolved in water",
    "wash": "a fermented mash: a few percent ethanol in water",
    "mash": "a fermented mash: a few percent ethanol in water",
    "beer": "a few percent ethanol in water, with sugars",
    "wine": "ethanol in water, with sugars and acids",
    "antifreeze": "a glycol in water",
    "coolant": "a glycol in water",
    "glycol": "a glycol in water, as plants use the word (the pure fluid is ethylene-glycol)",
}
"""Names a plant gives its solutions and mixtures, and what each usually is."""

_MARKS = re.compile(r"\d\s*(%|percent|wt|vol|mass|mol)|\b(solution|mixture|blend|aqueous|diluted?)\b|\bin water\b")
"""A share (50 %, 30 wt), or a word that says the liquid is a solution or a mixture."""
_JOINS = re.compile(r"\s*(?:/|\+|&|\band\b|\bwith\b)\s*")


def solution_or_mixture(name: str, is_pure: Callable[[str], bool]) -> str | None:
    """What ``name`` means when it names a solution or a mixture (None when it may name a pure fluid).

    ``is_pure`` says whether a name is a pure fluid of the catalog, so that two of them joined
    (``ethanol/water``, ``water + ethanol``) read as their mixture.

    >>> solution_or_mixture("Brine", lambda n: False)
    'a salt dissolved in water'
    >>> solution_or_mixture("ethanol/water", lambda n: n in {"ethanol", "water"})
    'a mixture of ethanol and water'
    >>> solution_or_mixture("ethylene glycol", lambda n: True) is None
    True
    """
    folded = " ".join(name.casefold().split())
    if folded in SOLUTIONS:
        return SOLUTIONS[folded]
    parts = [p for p in _JOINS.split(folded) if p]
    if len(parts) > 1 and all(is_pure(p) for p in parts):
        return f"a mixture of {' and '.join(parts)}"
    if len(parts) > 1 and any(is_pure(p) for p in parts):  # water with salt, ethanol + sugar
        return "a solution or a mixture"
    if _MARKS.search(folded):
        return "a solution or a mixture"
    return None
