"""Names that mean a solution or a mixture, not a pure fluid.

A plant calls its liquids by what they are for: brine, syrup, seawater, the stripper's wash, a
coolant at 50 %. None of them boils where a pure component does (a dissolved solid raises the
boiling point; a liquid mixture boils over a range), so a name like these must never be answered
with the nearest pure component's name. The words below are the trade's (common practice, no
source); refrigerant blends are numbered R-400 to R-599 by ANSI/ASHRAE Standard 34 (recalled from
memory).
"""

from __future__ import annotations

import re
from collections.abc import Callable

SOLUTIONS = {
    "brine": "a salt dissolved in water",
    "salt water": "a salt dissolved in water",
    "saltwater": "a salt dissolved in water",
    "salted water": "a salt dissolved in water",
    "seawater": "water with sea salt (about 35 g/kg)",
    "sea water": "water with sea salt (about 35 g/kg)",
    "sea salt": "water with sea salt (about 35 g/kg)",
    "syrup": "sugar dissolved in water",
    "sugar": "sugar dissolved in water",
    "molasses": "sugars dissolved in water",
    "wort": "sugars dissolved in water",
    "juice": "sugars and acids dissolved in water",
    "milk": "water with lactose, salts, proteins and fat",
    "cream": "water with fat, lactose and proteins",
    "whey": "water with lactose and salts",
    "permeate": "water with lactose and salts",
    "caustic": "sodium hydroxide dissolved in water",
    "caustic soda": "sodium hydroxide, as a plant holds it: dissolved in water",
    "lye": "sodium hydroxide dissolved in water",
    "wash": "a fermented mash: a few percent ethanol in water",
    "beer": "a few percent ethanol in water, with sugars",
    "wine": "ethanol in water, with sugars and acids",
    "wines": "ethanol in water",
    "spirits": "ethanol in water",
    "hydrous": "a liquid with a few percent water",
    "azeotrope": "a mixture that boils at one temperature",
    "stillage": "the residue of a still: solids dissolved and suspended in water",
    "vinasse": "the residue of a still: solids dissolved and suspended in water",
    "liquor": "solids dissolved in water",
    "sanitizer": "its active agent dissolved in water",
    "peracetic": "peracetic acid with acetic acid and hydrogen peroxide in water",
    "aqua ammonia": "ammonia dissolved in water",
    "ammonia water": "ammonia dissolved in water",
    "antifreeze": "a glycol in water",
    "coolant": "a glycol in water",
    "air": "a mixture of nitrogen, oxygen and argon",
    "natural gas": "a mixture of methane and heavier alkanes",
    "lng": "a mixture of methane and heavier alkanes",
    "lpg": "a mixture of propane and butanes",
    "gasoline": "a mixture of hydrocarbons",
    "petrol": "a mixture of hydrocarbons",
    "diesel": "a mixture of hydrocarbons",
    "kerosene": "a mixture of hydrocarbons",
}
"""Words a plant uses for its solutions and mixtures, and what each usually is."""

GLYCOL = "a glycol in water, as plants use the word (the pure fluid is ethylene-glycol)"
PURITY = 99.0
"""A share of at least this many percent of one fluid is a purity grade (ammonia 99.98 %), not a solution."""

_WORDS = re.compile(r"\b(" + "|".join(sorted(map(re.escape, SOLUTIONS), key=len, reverse=True)) + r")\b")
_BLEND = re.compile(r"^r-?[45]\d\d[a-z]?$")
_SHARE = re.compile(
    r"\d\s*(%|percent|pct|wt|vol|mass|mol|proof|abv|brix|w/w|v/v)|\d\s*[/:]\s*\d"
    r"|\b(solution|mixture|blend|aqueous|diluted?)\b|\bin water\b"
)
"""A share (50 %, 30 wt, 40/60) or a word that says the liquid is a solution or a mixture."""
_NUMBER = r"\d+(?:\.\d+)?"
_GRADE = re.compile(
    rf"^(?:(?P<a>.+?)(?:\s+(?P<n>{_NUMBER})\s*%?|\s*(?P<p>{_NUMBER})\s*%)|(?P<m>{_NUMBER})(?:\s*%\s*|\s+)(?P<b>.+))$"
)
"""A fluid's name with one number before or after it: a purity grade or a share."""
_JOINS = re.compile(r"\s*(?:/|\+|&|\band\b|\bwith\b)\s*")
"""What joins the names of a mixture's parts: ethanol/water, water + ethanol, water and glycol."""


def solution_or_mixture(name: str, fluid_id: Callable[[str], str | None]) -> str | None:
    """What ``name`` means when it names a solution or a mixture; None when it may name a pure fluid.

    ``fluid_id`` gives the catalog id a name denotes (None for none), so that two catalog fluids joined
    read as their mixture, one fluid named twice (water/steam) or with its purity (ammonia 99.98 %)
    as that fluid, and a catalog fluid with a share (ethanol 10 %) as a solution.

    >>> pure = {"ethanol": "ethanol", "water": "water", "steam": "water"}.get
    >>> solution_or_mixture("Sugar syrup", pure)
    'sugar dissolved in water'
    >>> solution_or_mixture("ethanol/water", pure), solution_or_mixture("water/steam", pure)
    ('a mixture of ethanol and water', None)
    >>> solution_or_mixture("ethanol 10 %", pure), solution_or_mixture("ethanol 99.9 %", pure)
    ('a solution or a mixture', None)
    >>> solution_or_mixture("propylene glycol", pure) is None
    True
    """
    folded = " ".join(name.casefold().split())
    if fluid_id(folded.replace(" ", "-")):  # helium 4
        return None
    grade = _GRADE.match(folded)
    if grade and fluid_id((grade["a"] or grade["b"]).strip(" ,")):
        return None if float(grade["n"] or grade["p"] or grade["m"]) >= PURITY else "a solution or a mixture"
    if _BLEND.match(folded):
        return "a refrigerant blend: a mixture"
    found = _WORDS.search(folded)
    if found:
        return SOLUTIONS[found.group(1)]
    words = re.findall(r"[a-z]+", folded)
    if "glycol" in words and (words == ["glycol"] or "water" in words or re.search(r"\d", folded)):
        return GLYCOL
    for parts in (_JOINS.split(folded), folded.replace("-", " ").split()):
        ids = [fluid_id(part) for part in parts if part]
        if len(ids) > 1 and all(ids):
            return None if len(set(ids)) == 1 else f"a mixture of {' and '.join(dict.fromkeys(ids))}"
    joined = [part for part in _JOINS.split(folded) if part]
    if (len(joined) > 1 and any(map(fluid_id, joined))) or _SHARE.search(folded):
        return "a solution or a mixture"  # water with salt, NaCl solution, 30 % NaOH
    return None
