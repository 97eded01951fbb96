"""The Kubernetes manifests in docker/k8s/, checked against the code, the Dockerfile and each other.

Nothing is deployed: the files are parsed and cross-checked, so a renamed route, port, variable or user
breaks this test rather than a rollout.
"""

from __future__ import annotations

import ast
import re
import shlex
import tomllib
from decimal import Decimal
from pathlib import Path
from typing import Any

import pytest
import yaml
from flask import Flask

ROOT = Path(__file__).resolve().parents[1]
K8S = ROOT / "docker" / "k8s"
DOCKERFILE = ROOT / "docker" / "Dockerfile"
GUNICORN_CONF = ROOT / "docker" / "gunicorn.conf.py"
NAME = "boiling-point-service"
LABEL = "app.kubernetes.io/name"

# Read by libraries rather than by our code: prometheus_client's multiprocess mode.
LIBRARY_VARIABLES = frozenset({"PROMETHEUS_MULTIPROC_DIR"})


# --- loading -----------------------------------------------------------------------------------------


def manifests() -> dict[str, dict[str, Any]]:
    """Every docker/k8s/*.yaml, parsed, by kind (yaml.safe_load refuses a file of several documents)."""
    out: dict[str, dict[str, Any]] = {}
    for path in sorted(K8S.glob("*.y*ml")):
        document = yaml.safe_load(path.read_text(encoding="utf-8"))
        assert isinstance(document, dict) and "kind" in document, f"{path.name}: not a Kubernetes object"
        assert document["kind"] not in out, f"{path.name}: a second {document['kind']}"
        out[document["kind"]] = document
    return out


@pytest.fixture(scope="module")
def objects() -> dict[str, dict[str, Any]]:
    found = manifests()
    assert {"Deployment", "Service", "HorizontalPodAutoscaler"} <= found.keys(), sorted(found)
    return found


@pytest.fixture(scope="module")
def deployment(objects: dict[str, dict[str, Any]]) -> dict[str, Any]:
    return objects["Deployment"]


@pytest.fixture(scope="module")
def container(deployment: dict[str, Any]) -> dict[str, Any]:
    containers = deployment["spec"]["template"]["spec"]["containers"]
    assert len(containers) == 1
    return containers[0]


@pytest.fixture(scope="module")
def env(container: dict[str, Any]) -> dict[str, dict[str, Any]]:
    entries = container["env"]
    names = [e["name"] for e in entries]
    assert len(names) == len(set(names)), f"a variable is set twice: {names}"
    return {e["name"]: e for e in entries}


def dockerfile_instructions() -> list[tuple[str, str]]:
    """(INSTRUCTION, arguments) pairs, continuation lines joined, comments dropped."""
    text = re.sub(r"\\\n", " ", DOCKERFILE.read_text(encoding="utf-8"))
    out = []
    for line in text.splitlines():
        stripped = line.strip()
        if stripped and not stripped.startswith("#"):
            instruction, _, arguments = stripped.partition(" ")
            out.append((instruction.upper(), arguments.strip()))
    return out


def dockerfile_env() -> dict[str, str]:
    out: dict[str, str] = {}
    for instruction, arguments in dockerfile_instructions():
        if instruction == "ENV":
            for word in shlex.split(arguments):
                key, _, value = word.partition("=")
                out[key] = value
    return out


# --- which environment variables the code reads ----------------------------------------------------------


def _is_environ(node: ast.expr) -> bool:
    """``os.environ``, or a parameter named ``environ`` (as in service.config.settings)."""
    return (isinstance(node, ast.Name) and node.id == "environ") or (
        isinstance(node, ast.Attribute) and node.attr == "environ"
    )


def _string(node: ast.expr | None) -> str | None:
    return node.value if isinstance(node, ast.Constant) and isinstance(node.value, str) else None


def variables_read(source: str) -> set[str]:
    """Names of environment variables a Python source reads.

    ``environ.get("X")``, ``environ["X"]``, ``"X" in environ``, ``os.getenv("X")``, the values of a
    ``_ENVIRONMENT`` mapping, and any ``"BOILING_..."`` string literal (the service's own prefix).
    """
    found: set[str] = set()
    for node in ast.walk(ast.parse(source)):
        if isinstance(node, ast.Call) and node.args:
            function = node.func
            name = function.attr if isinstance(function, ast.Attribute) else getattr(function, "id", None)
            from_environ = isinstance(function, ast.Attribute) and _is_environ(function.value)
            if name == "getenv" or (from_environ and name in {"get", "pop", "setdefault"}):
                found.add(_string(node.args[0]) or "")
        elif isinstance(node, ast.Subscript) and _is_environ(node.value):
            found.add(_string(node.slice) or "")
        elif isinstance(node, ast.Compare) and any(_is_environ(c) for c in node.comparators):
            if any(isinstance(op, ast.In | ast.NotIn) for op in node.ops):
                found.add(_string(node.left) or "")
        elif isinstance(node, ast.Assign | ast.AnnAssign) and isinstance(node.value, ast.Dict):
            targets = node.targets if isinstance(node, ast.Assign) else [node.target]
            if any(isinstance(t, ast.Name) and t.id == "_ENVIRONMENT" for t in targets):
                found.update(_string(v) or "" for v in node.value.values)
        elif isinstance(node, ast.Constant) and re.fullmatch(r"BOILING_[A-Z0-9_]+", str(node.value)):
            found.add(str(node.value))
    found.discard("")
    return found


def variables_in_code() -> set[str]:
    """Every variable read by service/**/*.py or docker/gunicorn.conf.py, read now (not cached)."""
    names: set[str] = set()
    for path in [GUNICORN_CONF, *sorted((ROOT / "service").rglob("*.py"))]:
        names |= variables_read(path.read_text(encoding="utf-8"))
    return names


def test_the_variable_scanner_finds_each_form() -> None:
    source = (
        "import os\n"
        "a = os.environ.get('A', '1')\n"
        'b = os.environ["B"]\n'
        "c = os.getenv('C')\n"
        "if 'D' in environ: pass\n"
        "_ENVIRONMENT = {'KEY': 'E'}\n"
        "names = ['BOILING_F', 'not_a_variable']\n"
    )
    assert variables_read(source) == {"A", "B", "C", "D", "E", "BOILING_F"}


def test_the_scanner_sees_the_known_settings() -> None:
    assert {
        "HOST",
        "PORT",
        "WEB_CONCURRENCY",
        "GUNICORN_TIMEOUT",
        "GUNICORN_GRACEFUL_TIMEOUT",
        "LOG_LEVEL",
        "BOILING_MAX_POINTS",
        "BOILING_MAX_BODY_BYTES",
        "BOILING_EXTRA_CATALOGS",
        "BOILING_ANSWER_CACHE_SIZE",
    } <= variables_in_code()


# --- (c) every variable the Deployment sets is one something reads ----------------------------------------


def test_every_env_name_is_read_by_the_service(env: dict[str, dict[str, Any]]) -> None:
    unknown = sorted(set(env) - variables_in_code() - LIBRARY_VARIABLES)
    assert not unknown, f"set in deployment.yaml but read by neither service/ nor gunicorn.conf.py: {unknown}"


def test_env_values_are_strings_or_references(env: dict[str, dict[str, Any]]) -> None:
    for name, entry in env.items():
        assert ("value" in entry) != ("valueFrom" in entry), name
        if "value" in entry:
            assert isinstance(entry["value"], str), f"{name}: quote the value, Kubernetes wants a string"


def test_the_api_key_comes_from_the_secret(env: dict[str, dict[str, Any]]) -> None:
    entry = env["BOILING_API_KEY"]
    assert "value" not in entry, "never a literal key in the manifest"
    assert entry["valueFrom"]["secretKeyRef"] == {"name": NAME, "key": "api-key", "optional": True}


def test_worker_count_is_set_explicitly(env: dict[str, dict[str, Any]], container: dict[str, Any]) -> None:
    # gunicorn's default counts the node's cores, not the pod's CPU limit.
    workers = int(env["WEB_CONCURRENCY"]["value"])
    assert 1 <= workers <= 2 * max(1, cpu(container["resources"]["limits"]["cpu"])) + 1


# --- (a) probes -----------------------------------------------------------------------------------------


def get_routes(app: Flask) -> set[str]:
    return {rule.rule for rule in app.url_map.iter_rules() if "GET" in (rule.methods or set())}


def test_probe_and_scrape_paths_are_routes_of_the_app(
    app: Flask, deployment: dict[str, Any], container: dict[str, Any]
) -> None:
    assert container["livenessProbe"]["httpGet"]["path"] == "/healthz"
    assert container["readinessProbe"]["httpGet"]["path"] == "/readyz"
    routes = get_routes(app)
    client = app.test_client()
    for probe in ("startupProbe", "livenessProbe", "readinessProbe"):
        if probe in container:
            check = container[probe]["httpGet"]
            assert check["path"] in routes, f"{probe}: {check['path']} is not a GET route of the app"
            assert check["port"] == "http", f"{probe}: probe the named port"
            assert client.get(check["path"]).status_code == 200, f"{probe}: {check['path']} fails on a loaded app"
    scrape = deployment["spec"]["template"]["metadata"]["annotations"]["prometheus.io/path"]
    assert scrape in routes, f"prometheus.io/path {scrape} is not a GET route of the app"


# --- (b) ports --------------------------------------------------------------------------------------------


def test_ports_agree(
    objects: dict[str, dict[str, Any]], container: dict[str, Any], env: dict[str, dict[str, Any]]
) -> None:
    (port,) = container["ports"]
    assert port["name"] == "http"
    number = port["containerPort"]
    assert int(env["PORT"]["value"]) == number
    assert env["HOST"]["value"] == "0.0.0.0"
    exposed = [a for i, a in dockerfile_instructions() if i == "EXPOSE"]
    assert exposed == [str(number)], f"Dockerfile EXPOSE {exposed}, manifest {number}"
    assert dockerfile_env()["PORT"] == str(number)
    assert dockerfile_env()["HOST"] == "0.0.0.0"
    annotations = objects["Deployment"]["spec"]["template"]["metadata"]["annotations"]
    assert annotations["prometheus.io/scrape"] == "true"
    assert annotations["prometheus.io/path"] == "/metrics"
    assert annotations["prometheus.io/port"] == str(number)
    service = objects["Service"]["spec"]
    assert service.get("type", "ClusterIP") == "ClusterIP"
    (service_port,) = service["ports"]
    assert service_port["port"] == 80
    assert service_port["targetPort"] == port["name"]


def test_the_service_selects_the_pods(objects: dict[str, dict[str, Any]]) -> None:
    deployment = objects["Deployment"]["spec"]
    pod_labels = deployment["template"]["metadata"]["labels"]
    assert deployment["selector"]["matchLabels"].items() <= pod_labels.items()
    assert objects["Service"]["spec"]["selector"].items() <= pod_labels.items()
    for kind, document in objects.items():
        assert document["metadata"]["name"] == NAME, kind
        assert document["metadata"]["labels"][LABEL] == NAME, kind
    assert pod_labels[LABEL] == NAME


def test_the_image_is_this_version(container: dict[str, Any]) -> None:
    project = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    assert container["image"].rpartition("/")[2] == f"{project['name']}:{project['version']}"


# --- (d) the autoscaler -----------------------------------------------------------------------------------


def test_the_hpa_scales_the_deployment(objects: dict[str, dict[str, Any]]) -> None:
    hpa, deployment = objects["HorizontalPodAutoscaler"], objects["Deployment"]
    assert hpa["apiVersion"] == "autoscaling/v2"
    target = hpa["spec"]["scaleTargetRef"]
    assert (target["apiVersion"], target["kind"], target["name"]) == (
        deployment["apiVersion"],
        deployment["kind"],
        deployment["metadata"]["name"],
    )
    spec = hpa["spec"]
    assert spec["minReplicas"] == 2
    assert spec["maxReplicas"] == 10
    assert spec["minReplicas"] <= deployment["spec"]["replicas"] <= spec["maxReplicas"]
    (metric,) = spec["metrics"]
    assert metric["type"] == "Resource"
    assert metric["resource"]["name"] == "cpu"
    assert metric["resource"]["target"]["type"] == "Utilization"
    assert 0 < metric["resource"]["target"]["averageUtilization"] <= 100
    # Utilisation is a share of the request, so the request must be there.
    assert "cpu" in deployment["spec"]["template"]["spec"]["containers"][0]["resources"]["requests"]


# --- (e) security -----------------------------------------------------------------------------------------


def test_runs_as_the_dockerfile_user(deployment: dict[str, Any], container: dict[str, Any]) -> None:
    runs = [a for i, a in dockerfile_instructions() if i == "RUN"]
    uids = [m for a in runs for m in re.findall(r"useradd\b[^&;|]*?--uid[= ](\d+)", a)]
    assert len(uids) == 1, f"expected one `useradd --uid` in the Dockerfile, found {uids}"
    pod = deployment["spec"]["template"]["spec"].get("securityContext", {})
    merged = {**pod, **container.get("securityContext", {})}
    assert merged["runAsUser"] == int(uids[0])
    assert merged["runAsNonRoot"] is True
    own = container["securityContext"]
    assert own["readOnlyRootFilesystem"] is True
    assert own["allowPrivilegeEscalation"] is False
    assert own["capabilities"]["drop"] == ["ALL"]


def test_writable_paths_are_empty_dirs(
    deployment: dict[str, Any], container: dict[str, Any], env: dict[str, dict[str, Any]]
) -> None:
    volumes = {v["name"]: v for v in deployment["spec"]["template"]["spec"]["volumes"]}
    mounts = {m["mountPath"]: m["name"] for m in container["volumeMounts"]}
    assert all("emptyDir" in volumes[name] for name in mounts.values())
    assert all(not m.get("readOnly", False) for m in container["volumeMounts"])
    assert "/tmp" in mounts, "gunicorn's worker heartbeat files need a writable /tmp"
    multiproc = Path(env["PROMETHEUS_MULTIPROC_DIR"]["value"])
    assert multiproc.is_absolute()
    assert any(multiproc.is_relative_to(m) for m in mounts), f"{multiproc} is not on a writable mount"


# --- (f) resources and shutdown ---------------------------------------------------------------------------

_BINARY = {"Ki": 2**10, "Mi": 2**20, "Gi": 2**30, "Ti": 2**40}
_DECIMAL = {"m": Decimal("0.001"), "": 1, "k": 10**3, "M": 10**6, "G": 10**9, "T": 10**12}


def quantity(value: str | int | float) -> Decimal:
    """A Kubernetes resource quantity ("250m", "1", "512Mi") as a number of cores or bytes."""
    match = re.fullmatch(r"([0-9.]+)(Ki|Mi|Gi|Ti|m|k|M|G|T|)", str(value))
    assert match, f"not a quantity: {value!r}"
    number, suffix = match.groups()
    return Decimal(number) * _BINARY.get(suffix, _DECIMAL.get(suffix, 1))


def cpu(value: str | int | float) -> int:
    return int(quantity(value))


def test_quantities() -> None:
    assert quantity("250m") == Decimal("0.25")
    assert quantity("1") == quantity(1) == 1
    assert quantity("512Mi") == 512 * 2**20
    assert quantity("1G") == 10**9


def test_requests_do_not_exceed_limits(container: dict[str, Any]) -> None:
    resources = container["resources"]
    for resource in ("cpu", "memory"):
        request = quantity(resources["requests"][resource])
        limit = quantity(resources["limits"][resource])
        assert 0 < request <= limit, f"{resource}: request {request} > limit {limit}"


def test_in_memory_volumes_fit_under_the_memory_limit(deployment: dict[str, Any], container: dict[str, Any]) -> None:
    # A medium: Memory emptyDir counts against the container's memory limit; each needs a sizeLimit,
    # and together they must leave the workers at least the request's worth of headroom.
    in_memory = [
        v["emptyDir"]
        for v in deployment["spec"]["template"]["spec"]["volumes"]
        if v.get("emptyDir", {}).get("medium") == "Memory"
    ]
    assert all("sizeLimit" in v for v in in_memory)
    total = sum((quantity(v["sizeLimit"]) for v in in_memory), Decimal(0))
    memory = container["resources"]
    assert total <= quantity(memory["limits"]["memory"]) - quantity(memory["requests"]["memory"])


def test_grace_period_covers_prestop_and_gunicorn_drain(
    deployment: dict[str, Any], container: dict[str, Any], env: dict[str, dict[str, Any]]
) -> None:
    if "GUNICORN_GRACEFUL_TIMEOUT" in env:
        graceful = int(env["GUNICORN_GRACEFUL_TIMEOUT"]["value"])
    else:
        default = re.search(r"GUNICORN_GRACEFUL_TIMEOUT['\"],\s*['\"]?(\d+)", GUNICORN_CONF.read_text("utf-8"))
        assert default, "cannot find gunicorn's graceful timeout default"
        graceful = int(default.group(1))
    command = container["lifecycle"]["preStop"]["exec"]["command"]
    assert command[0] == "sleep"
    pause = int(command[1])
    assert 1 <= pause <= 15
    assert deployment["spec"]["template"]["spec"]["terminationGracePeriodSeconds"] > pause + graceful
