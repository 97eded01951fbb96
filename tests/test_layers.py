"""The three floors: physics and the domain never reach up into the web layer, and modules stay small."""

import ast
from pathlib import Path

import pytest

SERVICE = Path(__file__).resolve().parents[1] / "service"
LOWER_FLOORS = sorted([*(SERVICE / "physics").rglob("*.py"), *(SERVICE / "fluids").rglob("*.py")])
MAX_LINES = 400


def _imported(path: Path) -> set[str]:
    names = set()
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.Import):
            names.update(alias.name for alias in node.names)
        elif isinstance(node, ast.ImportFrom) and node.module:
            names.add(node.module)
    return names


@pytest.mark.parametrize("path", LOWER_FLOORS, ids=lambda p: str(p.relative_to(SERVICE)))
def test_physics_and_the_domain_import_nothing_of_the_web_layer(path: Path) -> None:
    forbidden = {n for n in _imported(path) if n.split(".")[0] in {"flask", "werkzeug"} or n.startswith("service.api")}
    assert not forbidden, f"{path.name} imports {sorted(forbidden)}"


def test_physics_imports_nothing_of_the_domain() -> None:
    upward = {
        p.name: n for p in (SERVICE / "physics").rglob("*.py") for n in _imported(p) if n.startswith("service.fluids")
    }
    assert not upward


@pytest.mark.parametrize("path", sorted(SERVICE.rglob("*.py")), ids=lambda p: str(p.relative_to(SERVICE)))
def test_no_module_is_over_400_lines(path: Path) -> None:
    assert len(path.read_text(encoding="utf-8").splitlines()) <= MAX_LINES
