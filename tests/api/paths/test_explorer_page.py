"""GET /docs (``service.api.paths.explorer`` and its page, ``explorer_page/``) in a real browser: Debian's
headless Chromium, driven by selenium, opens the API explorer served by the app on a loopback port, finds
every operation of /openapi.json on the page, makes one request from it ("Try it out", "Execute") and
reads the answer, and the browser's console shows no content-security-policy violation or any other error.

Without Chromium and chromedriver (``apt-get install chromium chromium-driver``) the tests skip
on a developer's machine, but fail when ``BOILING_REQUIRE_BROWSER=1``, as CI sets it (``.ci/run``).
"""

from __future__ import annotations

import json
import os
import threading
import urllib.request
from collections.abc import Iterator
from pathlib import Path
from typing import Any

import pytest
from flask import Flask
from werkzeug.serving import make_server

try:
    from selenium import webdriver
    from selenium.common.exceptions import WebDriverException
    from selenium.webdriver.chrome.service import Service
    from selenium.webdriver.common.by import By
    from selenium.webdriver.remote.webelement import WebElement
    from selenium.webdriver.support.ui import WebDriverWait
except ImportError:  # the test extra is not installed
    webdriver = None

CHROMIUM = Path("/usr/bin/chromium")
CHROMEDRIVER = Path("/usr/bin/chromedriver")
FLAGS = (
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",  # the network is closed: no background connections to fail
    "--disable-component-update",
    "--disable-sync",
    "--window-size=1280,1024",
)
ANSWER = ".live-responses-table tr.response"  # the answer "Execute" got, below the documented ones
WAIT = 30  # seconds, at most, for any one step; each ends as soon as its condition holds


def missing() -> str | None:
    """Why the browser test cannot run here, or None."""
    if webdriver is None:
        return "selenium is not installed (pip install -e '.[test]')"
    for program in (CHROMIUM, CHROMEDRIVER):
        if not program.exists():
            return f"{program} is missing (apt-get install chromium chromium-driver)"
    return None


@pytest.fixture(scope="module")
def base_url(app: Flask) -> Iterator[str]:
    """The app served on a free loopback port for the module's tests."""
    server = make_server("127.0.0.1", 0, app, threaded=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield f"http://127.0.0.1:{server.server_port}"
    server.shutdown()
    thread.join(timeout=10)


@pytest.fixture(scope="module")
def browser(tmp_path_factory: pytest.TempPathFactory) -> Iterator[Any]:
    reason = missing()
    if reason:
        if os.environ.get("BOILING_REQUIRE_BROWSER") == "1":
            pytest.fail(f"BOILING_REQUIRE_BROWSER=1, but {reason}")
        pytest.skip(reason)
    options = webdriver.ChromeOptions()
    options.binary_location = str(CHROMIUM)
    for flag in FLAGS:
        options.add_argument(flag)
    options.add_argument(f"--user-data-dir={tmp_path_factory.mktemp('chromium')}")
    options.set_capability("goog:loggingPrefs", {"browser": "ALL"})
    # The explicit driver path: selenium looks nothing up and downloads nothing.
    driver = webdriver.Chrome(service=Service(executable_path=str(CHROMEDRIVER)), options=options)
    try:
        yield driver
    finally:
        driver.quit()


@pytest.fixture(scope="module")
def document(base_url: str) -> dict[str, Any]:
    """The OpenAPI document as the app serves it to the page."""
    with urllib.request.urlopen(f"{base_url}/openapi.json", timeout=WAIT) as answer:
        return json.load(answer)


@pytest.fixture(scope="module")
def explorer(browser: Any, base_url: str, document: dict[str, Any]) -> Any:
    """The browser on /docs, once Swagger UI has rendered every operation of the document."""
    browser.get(f"{base_url}/docs")
    expected = sum(len(item) for item in document["paths"].values())
    until(browser, lambda d: len(d.find_elements(By.CSS_SELECTOR, ".opblock")) >= expected, "the operations")
    return browser


def until(driver: Any, condition: Any, what: str) -> Any:
    try:
        return WebDriverWait(driver, WAIT, poll_frequency=0.05).until(condition)
    except WebDriverException as error:
        raise AssertionError(f"the page never showed {what} within {WAIT} s; console: {console(driver)}") from error


def console(driver: Any) -> list[dict[str, Any]]:
    """The console entries logged since the last call (the log is drained on reading)."""
    return driver.get_log("browser")


def assert_clean_console(driver: Any) -> None:
    errors = [entry for entry in console(driver) if entry["level"] == "SEVERE" or entry.get("source") == "security"]
    violations = [entry["message"] for entry in errors if "Content Security Policy" in entry["message"]]
    assert not violations, f"content-security-policy violations: {violations}"
    assert not errors, f"console errors: {errors}"


def test_every_operation_of_the_document_is_listed(explorer: Any, document: dict[str, Any]) -> None:
    listed = {
        (
            block.find_element(By.CSS_SELECTOR, ".opblock-summary-method").text.lower(),
            block.find_element(By.CSS_SELECTOR, ".opblock-summary-path").get_attribute("data-path"),
        )
        for block in explorer.find_elements(By.CSS_SELECTOR, ".opblock")
    }
    documented = {(method, path) for path, item in document["paths"].items() for method in item}
    assert listed == documented
    assert_clean_console(explorer)


def test_a_request_made_from_the_page_is_answered(explorer: Any) -> None:
    operation: WebElement = explorer.find_element(
        By.XPATH, "//div[contains(@class, 'opblock-get')][.//*[@data-path='/v1/boiling-point']]"
    )
    operation.find_element(By.CSS_SELECTOR, ".opblock-summary-control").click()
    until(explorer, lambda _: operation.find_element(By.CSS_SELECTOR, ".try-out__btn"), '"Try it out"').click()
    pressure = until(
        explorer,
        lambda _: operation.find_element(By.CSS_SELECTOR, 'tr[data-param-name="pressure"] input'),
        "the pressure field",
    )
    pressure.send_keys("101.325")
    operation.find_element(By.CSS_SELECTOR, "button.execute").click()
    status = until(
        explorer,
        lambda _: operation.find_element(By.CSS_SELECTOR, f"{ANSWER} td.response-col_status").text,
        "the answer",
    )
    assert status == "200"
    shown = operation.find_element(By.CSS_SELECTOR, f"{ANSWER} td.response-col_description pre").text
    answer = json.loads(shown)
    assert answer["boiling_point"]["unit"] == "degC"
    assert answer["boiling_point"]["value"] == pytest.approx(99.974, abs=0.001)  # water at 1 atm (ITS-90)
    assert "pressure=101.325" in operation.find_element(By.CSS_SELECTOR, ".request-url").text
    assert_clean_console(explorer)
