"""The Kubernetes manifests in docker/k8s/, checked against the code, the Dockerfile and each other,
and the image's pinned dependencies (docker/requirements.lock) against pyproject.toml.

Nothing is built or deployed: the files are parsed, validated against the Kubernetes schemas that the
kubernetes-validate package bundles, and cross-checked, so a renamed route, port, variable or user, a
misspelled field or a dependency missing from the lock breaks this test rather than a build or a rollout.
"""

from __future__ import annotations

import ast
import copy
import math
import re
import shlex
import tomllib
from collections.abc import Callable, Iterable
from decimal import Decimal
from importlib import metadata
from pathlib import Path, PurePosixPath
from typing import Any

import kubernetes_validate
import pytest
import yaml
from flask import Flask
from packaging.requirements import Requirement
from packaging.utils import canonicalize_name
from packaging.version import Version

ROOT = Path(__file__).resolve().parents[1]
K8S = ROOT / "docker" / "k8s"
DOCKERFILE = ROOT / "docker" / "Dockerfile"
GUNICORN_CONF = ROOT / "docker" / "gunicorn.conf.py"
LOCK = ROOT / "docker" / "requirements.lock"
PYPROJECT = ROOT / "pyproject.toml"
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
    expected = {"Deployment", "Service", "HorizontalPodAutoscaler", "PodDisruptionBudget", "NetworkPolicy"}
    assert expected <= found.keys(), sorted(found)
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


# --- (g) the disruption budget ----------------------------------------------------------------------------


def disruptions_allowed(budget: dict[str, Any], pods: int) -> int:
    """How many of ``pods`` ready pods a PodDisruptionBudget lets evictions take at once.

    Kubernetes rounds a percentage up, for minAvailable and maxUnavailable alike.
    """
    spec = budget["spec"]
    assert ("minAvailable" in spec) != ("maxUnavailable" in spec), "set exactly one of minAvailable, maxUnavailable"
    key = "maxUnavailable" if "maxUnavailable" in spec else "minAvailable"
    value = spec[key]
    if isinstance(value, str):
        assert value.endswith("%"), f"{key}: {value!r} is neither a number nor a percentage"
        value = math.ceil(pods * int(value[:-1]) / 100)
    return max(0, value if key == "maxUnavailable" else pods - value)


def test_disruptions_allowed() -> None:
    def budget(**spec: int | str) -> dict[str, Any]:
        return {"spec": spec}

    assert disruptions_allowed(budget(minAvailable=1), 2) == 1
    assert disruptions_allowed(budget(minAvailable=1), 10) == 9
    assert disruptions_allowed(budget(minAvailable=2), 2) == 0
    assert disruptions_allowed(budget(maxUnavailable=1), 10) == 1
    assert disruptions_allowed(budget(maxUnavailable="25%"), 2) == 1
    assert disruptions_allowed(budget(minAvailable="50%"), 3) == 1


def test_the_disruption_budget_guards_the_pods_without_blocking_drains(objects: dict[str, dict[str, Any]]) -> None:
    budget, deployment, hpa = objects["PodDisruptionBudget"], objects["Deployment"], objects["HorizontalPodAutoscaler"]
    assert budget["apiVersion"] == "policy/v1"
    # The same pods as the Deployment's, no more and no fewer.
    assert budget["spec"]["selector"] == deployment["spec"]["selector"]
    # A pod that is not Ready serves nothing; it must not hold up a node drain.
    assert budget["spec"].get("unhealthyPodEvictionPolicy") == "AlwaysAllow"
    low, high = hpa["spec"]["minReplicas"], hpa["spec"]["maxReplicas"]
    for pods in range(min(low, deployment["spec"]["replicas"]), high + 1):
        allowed = disruptions_allowed(budget, pods)
        assert allowed >= 1, f"at {pods} pods no eviction is allowed: a node drain would hang"
        assert allowed < pods, f"at {pods} pods a drain could evict them all"
        assert allowed <= max(1, pods // 2), f"at {pods} pods a drain could evict {allowed} at once"


# --- (h) the network policy -------------------------------------------------------------------------------


def admitted(rule: dict[str, Any], container: dict[str, Any], number: int) -> bool:
    """Whether an ingress rule's ports admit TCP to the container's port ``number`` (by number or by name)."""
    names = {p["name"] for p in container["ports"] if p["containerPort"] == number and "name" in p}
    if "ports" not in rule:
        return True  # no ports: every port
    for port in rule["ports"]:
        if port.get("protocol", "TCP") != "TCP":
            continue
        if "port" not in port or port["port"] in names:
            return True
        if isinstance(port["port"], int) and port["port"] <= number <= port.get("endPort", port["port"]):
            return True
    return False


def port_number(container: dict[str, Any], port: int | str) -> int:
    """A probe's or Service's port, by number or by the name of one of the container's ports."""
    if isinstance(port, int):
        return port
    (number,) = [p["containerPort"] for p in container["ports"] if p.get("name") == port]
    return number


def test_the_network_policy_admits_the_http_port_only(
    objects: dict[str, dict[str, Any]], container: dict[str, Any]
) -> None:
    policy, deployment = objects["NetworkPolicy"], objects["Deployment"]
    assert policy["apiVersion"] == "networking.k8s.io/v1"
    spec = policy["spec"]
    assert spec["podSelector"] == deployment["spec"]["selector"]
    assert sorted(spec["policyTypes"]) == ["Egress", "Ingress"]
    (port,) = container["ports"]
    (rule,) = spec["ingress"]
    (allowed,) = rule["ports"]
    assert allowed["port"] in {port["containerPort"], port["name"]}, f"admits {allowed}, the container has {port}"
    assert allowed.get("protocol", "TCP") == port.get("protocol", "TCP") == "TCP"
    assert "endPort" not in allowed
    assert admitted(rule, container, port["containerPort"])
    assert not admitted(rule, container, port["containerPort"] + 1)
    # What must get through: Prometheus's scrape, and the probes where a network plugin filters them.
    annotations = deployment["spec"]["template"]["metadata"]["annotations"]
    assert admitted(rule, container, int(annotations["prometheus.io/port"]))
    for probe in ("startupProbe", "livenessProbe", "readinessProbe"):
        if probe in container:
            assert admitted(rule, container, port_number(container, container[probe]["httpGet"]["port"])), probe
    # The Service sends its clients to a port the policy admits.
    (service_port,) = objects["Service"]["spec"]["ports"]
    assert admitted(rule, container, port_number(container, service_port["targetPort"]))


def test_the_network_policy_denies_all_egress(objects: dict[str, dict[str, Any]]) -> None:
    spec = objects["NetworkPolicy"]["spec"]
    assert "Egress" in spec["policyTypes"]
    assert not spec.get("egress"), "the service calls nothing, so it may reach nothing (not even DNS)"


# Modules that open connections to other hosts. The service must import none: its NetworkPolicy denies
# all egress.
NETWORK_CLIENTS = frozenset(
    {
        "aiohttp",
        "ftplib",
        "http.client",
        "httpx",
        "imaplib",
        "poplib",
        "requests",
        "smtplib",
        "socket",
        "ssl",
        "urllib.request",
        "urllib3",
        "xmlrpc.client",
    }
)


def modules_imported(source: str) -> set[str]:
    """Every module a Python source imports: ``import a.b`` gives a.b; ``from a import b`` gives a and a.b."""
    found: set[str] = set()
    for node in ast.walk(ast.parse(source)):
        if isinstance(node, ast.Import):
            found.update(alias.name for alias in node.names)
        elif isinstance(node, ast.ImportFrom) and node.module and not node.level:
            found.add(node.module)
            found.update(f"{node.module}.{alias.name}" for alias in node.names)
    return found


def network_clients(modules: Iterable[str]) -> set[str]:
    return {m for m in modules if any(m == c or m.startswith(f"{c}.") for c in NETWORK_CLIENTS)}


def test_the_import_scanner_finds_each_form() -> None:
    source = "import socket\nimport urllib.request as r\nfrom http import client\nfrom os import path\n"
    assert network_clients(modules_imported(source)) == {"socket", "urllib.request", "http.client"}
    assert not network_clients(modules_imported("import urllib.parse\nfrom . import socket\n"))


def test_the_code_makes_no_outbound_calls() -> None:
    for path in [GUNICORN_CONF, *sorted((ROOT / "service").rglob("*.py"))]:
        found = network_clients(modules_imported(path.read_text(encoding="utf-8")))
        assert not found, (
            f"{path.relative_to(ROOT)} imports {sorted(found)}; docker/k8s/networkpolicy.yaml denies all "
            "egress: add the egress the service now needs there (and DNS), then extend this test"
        )


# --- (i) every manifest against the Kubernetes schemas ----------------------------------------------------

# The Kubernetes releases whose API schemas the manifests must satisfy, as bundled by the PyPI package
# kubernetes-validate (offline): the newest it bundles, and the oldest the files are meant for (the
# budget's unhealthyPodEvictionPolicy is on by default from 1.27). Strict: an unknown field, such as a
# misspelling, is an error.
KUBERNETES_VERSION = "1.37"
OLDEST_KUBERNETES_VERSION = "1.27"


def schema_errors(document: dict[str, Any], version: str = KUBERNETES_VERSION) -> str | None:
    """Why the Kubernetes schemas of a release refuse a manifest, or None when they accept it."""
    try:
        used = kubernetes_validate.validate(document, version, strict=True)
    except kubernetes_validate.ValidationError as error:
        return f"{'.'.join(str(p) for p in error.path) or '(top)'}: {error.message}"
    except (kubernetes_validate.SchemaNotFoundError, kubernetes_validate.InvalidSchemaError) as error:
        return error.message
    assert used == version, f"kubernetes-validate has no {version} schemas; it used {used}'s"
    return None


@pytest.mark.parametrize("version", [OLDEST_KUBERNETES_VERSION, KUBERNETES_VERSION])
@pytest.mark.parametrize("path", sorted(K8S.glob("*.y*ml")), ids=lambda path: path.name)
def test_manifest_is_valid_for_kubernetes(path: Path, version: str) -> None:
    error = schema_errors(yaml.safe_load(path.read_text(encoding="utf-8")), version)
    assert error is None, f"{path.name} against the Kubernetes {version} schemas: {error}"


def _container(document: dict[str, Any]) -> dict[str, Any]:
    return document["spec"]["template"]["spec"]["containers"][0]


def _set(document: dict[str, Any], key: str, value: Any) -> None:
    document[key] = value


BREAKAGES: dict[str, tuple[str, Callable[[dict[str, Any]], None]]] = {
    "misspelled field": (
        "Deployment",
        lambda d: _container(d).__setitem__("containerPorts", _container(d).pop("ports")),
    ),
    "number as a string": ("Deployment", lambda d: _set(d["spec"], "replicas", "2")),
    "required field missing": ("Deployment", lambda d: _container(d).pop("name")),
    "wrong type in a list": ("Service", lambda d: _set(d["spec"]["ports"][0], "port", "eighty")),
    "removed API version": ("PodDisruptionBudget", lambda d: _set(d, "apiVersion", "policy/v1beta1")),
    "list as a string": ("NetworkPolicy", lambda d: _set(d["spec"], "policyTypes", "Ingress")),
    "field at the wrong level": ("HorizontalPodAutoscaler", lambda d: _set(d, "minReplicas", 2)),
}


@pytest.mark.parametrize("breakage", sorted(BREAKAGES))
def test_a_broken_manifest_is_refused(objects: dict[str, dict[str, Any]], breakage: str) -> None:
    kind, damage = BREAKAGES[breakage]
    document = copy.deepcopy(objects[kind])
    assert schema_errors(document) is None
    damage(document)
    assert schema_errors(document) is not None, f"{kind} with a {breakage} passed the schema check"


# --- (j) the image's pinned dependencies ------------------------------------------------------------------

# Environment markers as the image evaluates them: python:3.11-slim on linux/amd64.
IMAGE_MARKERS = {
    "implementation_name": "cpython",
    "platform_python_implementation": "CPython",
    "python_version": "3.11",
    "python_full_version": "3.11.0",  # any 3.11 release: the base image's patch level moves
    "os_name": "posix",
    "sys_platform": "linux",
    "platform_system": "Linux",
    "platform_machine": "x86_64",
}


def project() -> dict[str, Any]:
    return tomllib.loads(PYPROJECT.read_text(encoding="utf-8"))["project"]


def read_lock(text: str) -> dict[str, Version]:
    """A pip-freeze-style lock: exact ``name==version`` pins, one a line, comments and blank lines aside."""
    pins: dict[str, Version] = {}
    for number, line in enumerate(text.splitlines(), start=1):
        entry = line.split("#", 1)[0].strip()
        if not entry:
            continue
        requirement = Requirement(entry)
        specifiers = list(requirement.specifier)
        assert len(specifiers) == 1, f"line {number}: {entry!r} is not one exact pin"
        (specifier,) = specifiers
        assert specifier.operator == "==" and "*" not in specifier.version, f"line {number}: {entry!r} is not a pin"
        assert not requirement.extras and not requirement.marker and not requirement.url, f"line {number}: {entry!r}"
        name = canonicalize_name(requirement.name)
        assert name not in pins, f"line {number}: {requirement.name} is pinned twice"
        pins[name] = Version(specifier.version)
    return pins


def applies(requirement: Requirement, extras: Iterable[str] = ()) -> bool:
    """Whether the image installs a requirement: its marker holds there, for no extra or one asked for."""
    marker = requirement.marker
    return marker is None or any(marker.evaluate({**IMAGE_MARKERS, "extra": extra}) for extra in ("", *extras))


def runtime_edges() -> list[tuple[str, Requirement]]:
    """(who requires it, requirement) for everything the image needs, transitively.

    The project's own requirements come from pyproject.toml's [project].dependencies (required by
    "pyproject.toml"); each package's requirements from its installed metadata, for the extras asked of it.
    """
    edges: list[tuple[str, Requirement]] = []
    pending = [("pyproject.toml", Requirement(text)) for text in project()["dependencies"]]
    extras_walked: dict[str, set[str]] = {}
    while pending:
        parent, requirement = pending.pop()
        if parent == "pyproject.toml" and not applies(requirement):
            continue
        edges.append((parent, requirement))
        name = canonicalize_name(requirement.name)
        wanted = set(requirement.extras)
        if name in extras_walked and wanted <= extras_walked[name]:
            continue
        extras_walked.setdefault(name, set()).update(wanted)
        try:
            distribution = metadata.distribution(name)
        except metadata.PackageNotFoundError:
            pytest.fail(
                f"{requirement} (required by {parent}) is not installed here, so its own requirements cannot be "
                "read: reinstall the project (make test, or pip install -e '.[test]')"
            )
        pending.extend(
            (name, child)
            for child in map(Requirement, distribution.requires or [])
            if applies(child, extras_walked[name])
        )
    return edges


def lock_problems(pins: dict[str, Version], edges: Iterable[tuple[str, Requirement]]) -> list[str]:
    """What the lock fails to cover: requirements with no pin, or pinned at a version they exclude.

    A package's own requirements are read from the installed version; where that is not the pinned
    version, only their names are checked (the pinned version's requirements are not at hand).
    """
    problems = set()
    for parent, requirement in edges:
        name = canonicalize_name(requirement.name)
        if name not in pins:
            problems.add(f"{name} is not pinned (required by {parent}: {requirement})")
            continue
        as_pinned = parent == "pyproject.toml" or (parent in pins and Version(metadata.version(parent)) == pins[parent])
        if as_pinned and not requirement.specifier.contains(pins[name], prereleases=True):
            problems.add(f"{name}=={pins[name]} does not satisfy {requirement} (required by {parent})")
    return sorted(problems)


@pytest.fixture(scope="module")
def pins() -> dict[str, Version]:
    return read_lock(LOCK.read_text(encoding="utf-8"))


@pytest.fixture(scope="module")
def edges() -> list[tuple[str, Requirement]]:
    return runtime_edges()


def test_the_lock_says_how_it_was_made() -> None:
    header = LOCK.read_text(encoding="utf-8").splitlines()[:6]
    assert header[0].startswith("#")
    assert any("make lock" in line for line in header), "the lock's header names the command that made it"


def test_the_lock_covers_the_runtime_dependencies(
    pins: dict[str, Version], edges: list[tuple[str, Requirement]]
) -> None:
    problems = lock_problems(pins, edges)
    differ = sorted(
        f"{name} {metadata.version(name)} (pinned {pins[name]})"
        for name in {canonicalize_name(r.name) for _, r in edges}
        if name in pins and Version(metadata.version(name)) != pins[name]
    )
    assert not problems, (
        f"{LOCK.relative_to(ROOT)} no longer covers the runtime dependencies; run `make lock`:\n  "
        + "\n  ".join(problems)
        + (f"\n(installed here, not as pinned: {', '.join(differ)})" if differ else "")
    )
    assert canonicalize_name(project()["name"]) not in pins, "the lock pins the project itself"


def test_the_walk_reaches_transitive_requirements(edges: list[tuple[str, Requirement]]) -> None:
    # flask -> jinja2 -> markupsafe: two levels below pyproject.toml.
    required = {(parent, canonicalize_name(r.name)) for parent, r in edges}
    assert ("pyproject.toml", "flask") in required
    assert ("flask", "jinja2") in required
    assert ("jinja2", "markupsafe") in required


def test_markers_are_read_for_the_image() -> None:
    assert applies(Requirement("numpy"))
    assert applies(Requirement('uvloop; sys_platform == "linux"'))
    assert not applies(Requirement('pywin32; sys_platform == "win32"'))
    assert not applies(Requirement('tomli; python_version < "3.11"'))
    assert not applies(Requirement('pytest; extra == "test"'))
    assert applies(Requirement('pytest; extra == "test"'), ["test"])


def test_a_lock_that_misses_a_requirement_is_refused(
    pins: dict[str, Version], edges: list[tuple[str, Requirement]]
) -> None:
    without = {name: version for name, version in pins.items() if name != "markupsafe"}
    missing = [p for p in lock_problems(without, edges) if "not pinned" in p]
    assert missing, "a lock without MarkupSafe passed"
    assert all(p.startswith("markupsafe is not pinned") for p in missing), missing
    too_old = {**pins, "numpy": Version("1.0")}
    assert any(p.startswith("numpy==1.0 does not satisfy numpy") for p in lock_problems(too_old, edges))
    assert read_lock("# header\n\nflask==3.1.3\n") == {"flask": Version("3.1.3")}
    for bad in ("flask>=3", "flask", "flask==3.*", "flask==3.1.3\nFlask==3.1.3"):
        with pytest.raises(AssertionError):
            read_lock(bad)


# --- (k) the Dockerfile installs the lock -----------------------------------------------------------------


def pip_commands() -> list[tuple[str, PurePosixPath, list[str]]]:
    """The Dockerfile's pip commands in order, as (subcommand, working directory, arguments)."""
    workdir = PurePosixPath("/")
    out = []
    for instruction, arguments in dockerfile_instructions():
        if instruction == "WORKDIR":
            workdir = workdir / arguments
        elif instruction == "RUN":
            for command in re.split(r"&&|\|\||;", arguments):
                words = shlex.split(command)
                if words[:3] == ["python", "-m", "pip"]:
                    words = words[2:]
                if words[:1] == ["pip"] and len(words) > 1:
                    out.append((words[1], workdir, words[2:]))
    return out


def option_values(arguments: list[str], *names: str) -> list[str]:
    """Values of an option given as ``-r x``, ``--requirement x`` or ``--requirement=x``."""
    values = []
    for i, word in enumerate(arguments):
        for name in names:
            if word == name and i + 1 < len(arguments):
                values.append(arguments[i + 1])
            elif name.startswith("--") and word.startswith(f"{name}="):
                values.append(word.partition("=")[2])
    return values


def test_the_image_installs_exactly_the_lock() -> None:
    workdir = PurePosixPath("/")
    copied: PurePosixPath | None = None
    source = LOCK.relative_to(ROOT).as_posix()
    for instruction, arguments in dockerfile_instructions():
        if instruction == "WORKDIR":
            workdir = workdir / arguments
        elif instruction == "COPY":
            *sources, destination = shlex.split(arguments)
            if source in sources:
                copied = workdir / destination / LOCK.name if destination.endswith("/") else workdir / destination
    assert copied is not None, f"the Dockerfile does not COPY {source}"
    steps = pip_commands()
    installs = [(i, cwd, args) for i, (sub, cwd, args) in enumerate(steps) if sub == "install"]
    from_lock = [
        i for i, cwd, args in installs if copied in {cwd / v for v in option_values(args, "-r", "--requirement")}
    ]
    assert from_lock, f"no `pip install -r {copied}` in the Dockerfile"
    project_installs = [i for i, _, args in installs if "." in args]
    assert project_installs, "the Dockerfile does not install the service"
    assert min(from_lock) < min(project_installs), "install the pinned dependencies before the service"
    for _, _, args in installs:
        assert "--no-deps" in args, f"`pip install {' '.join(args)}` may install versions the lock does not pin"
    checks = [i for i, (sub, _, _) in enumerate(steps) if sub == "check"]
    assert checks and max(checks) > max(i for i, _, _ in installs), "`pip check` must run after the last install"
