"""The local web page in a real browser: headless Chromium from the system's packages
(installed by .ci/run; no browser is downloaded) driven by Playwright. The page loads, the
demo gas and a pure fluid are entered, the comparison runs, the table's values equal the
command line's JSON for the same state, and the chart has one series per model. A screenshot
is kept as a test artifact (target/web-page.png)."""

import json
import os
import pathlib
import shutil
import subprocess

import pytest
from playwright.sync_api import sync_playwright

from conftest import ROOT

CHROMIUM = os.environ.get("ZFACTOR_CHROMIUM") or shutil.which("chromium") or "/usr/bin/chromium"
# Flags for a closed network: no background connections, no first-run work.
FLAGS = [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
]
SCREENSHOT = ROOT / "target" / "web-page.png"


@pytest.fixture(scope="module")
def server(cli):
    """`zfactor serve --port 0`, its address read from its first line of stdout."""
    proc = subprocess.Popen(
        [str(cli), "serve", "--port", "0"], stdout=subprocess.PIPE, stderr=subprocess.DEVNULL, text=True
    )
    url = proc.stdout.readline().strip()
    assert url.startswith("http://127.0.0.1:") and url.endswith("/"), url
    yield url
    proc.terminate()
    proc.wait(timeout=10)


@pytest.fixture(scope="module")
def page(server):
    if not pathlib.Path(CHROMIUM).is_file():
        pytest.fail(f"no Chromium at {CHROMIUM}: .ci/run installs Debian's chromium package")
    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path=CHROMIUM, headless=True, args=FLAGS)
        context = browser.new_context(viewport={"width": 1366, "height": 900}, accept_downloads=True)
        pg = context.new_page()
        errors = []
        pg.on("pageerror", lambda e: errors.append(str(e)))
        pg.goto(server)
        pg.wait_for_selector("body[data-ready=true]", timeout=20_000)
        yield pg
        assert errors == [], errors
        browser.close()


def cli_state(cli, gas_option, gas, t, p, models):
    out = subprocess.run(
        [str(cli), "state", gas_option, gas, "-t", t, "-p", p, "-m", models, "-f", "json"],
        capture_output=True,
        text=True,
    )
    assert out.returncode in (0, 3), out.stderr
    return {r["model"]: r for r in json.loads(out.stdout)["results"]}


def run_comparison(page, t_value, t_unit, p_value, p_unit, models):
    page.fill("#t-value", t_value)
    page.select_option("#t-unit", t_unit)
    page.fill("#p-value", p_value)
    page.select_option("#p-unit", p_unit)
    for box in page.query_selector_all("#models input[type=checkbox]"):
        want = box.get_attribute("value") in models
        if box.is_checked() != want:
            box.click()
    page.click("#run")
    # Selectors, not script: the page's content security policy refuses evaluated strings.
    page.wait_for_selector("#status:not(.failed) >> text=/^Done/", timeout=60_000)


def table_cells(page, key):
    return {
        row.get_attribute("data-model"): row.query_selector(f"td[data-key={key}]")
        for row in page.query_selector_all("#side tbody tr")
    }


def test_demo_gas_comparison_equals_the_command_line(page, cli):
    page.click("#demo-gas")
    gas = page.input_value("#gas")
    run_comparison(page, "15", "degC", "70", "barg", ["pr", "srk", "lk"])
    expected = cli_state(cli, "--mix", gas, "15 degC", "70 barg", "pr,srk,lk")
    z = table_cells(page, "z")
    assert set(z) == {"pr", "srk", "lk"}
    for model, cell in z.items():
        # The cell keeps the full value; the text shows it to five decimals.
        assert float(cell.get_attribute("data-value")) == pytest.approx(expected[model]["z"], rel=1e-12, abs=0)
        assert cell.inner_text() == f"{expected[model]['z']:.5f}"
    rho = table_cells(page, "density")
    for model, cell in rho.items():
        assert float(cell.get_attribute("data-value")) == pytest.approx(
            expected[model]["mass_density_kg_m3"], rel=1e-12
        )
    # One series per model on the isotherm chart (and the ideal gas; no reference for a
    # mixture), each with its own legend entry.
    series = json.loads(page.get_attribute("#isotherm", "data-series"))
    assert sorted(series) == ["ideal", "lk", "pr", "srk"]
    legend = page.query_selector_all("#isotherm .u-legend tr.u-series")
    assert len(legend) == 1 + len(series)  # the first entry is the pressure axis
    # The envelope with the state marked, and the caution.
    assert page.query_selector("#envelope svg .state-mark") is not None
    assert {b.get_attribute("data-branch") for b in page.query_selector_all("#envelope path.branch")} == {
        "dew",
        "bubble",
    }
    assert "licensed engineer" in page.inner_text("#caution")
    SCREENSHOT.parent.mkdir(parents=True, exist_ok=True)
    page.screenshot(path=str(SCREENSHOT), full_page=True)


def test_pure_fluid_has_its_reference_and_deviations(page, cli):
    page.fill("#gas", "methane")
    run_comparison(page, "250", "K", "10", "MPa", ["pr", "srk"])
    expected = cli_state(cli, "--fluid", "methane", "250 K", "10 MPa", "pr,srk,reference")
    z = table_cells(page, "z")
    assert set(z) == {"pr", "srk", "reference"}
    for model, cell in z.items():
        assert cell.inner_text() == f"{expected[model]['z']:.5f}"
    dev = table_cells(page, "deviation")
    assert dev["reference"].inner_text() == "reference"
    for model in ("pr", "srk"):
        # Density deviation from the reference (Setzmann and Wagner 1991) at the same T and
        # P, in percent: Z_ref / Z - 1 (the molar mass cancels).
        want = (expected["reference"]["z"] / expected[model]["z"] - 1) * 100
        assert float(dev[model].get_attribute("data-value")) == pytest.approx(want, rel=1e-9)
    series = json.loads(page.get_attribute("#isotherm", "data-series"))
    assert sorted(series) == ["ideal", "pr", "reference", "srk"]
    assert page.inner_text("#env-title") == "Vapour-pressure curve"


def test_a_refused_input_shows_the_command_lines_message(page):
    page.fill("#gas", "methane")
    page.fill("#t-value", "abc")
    page.click("#run")
    page.wait_for_selector("#status.failed")
    assert "cannot read" in page.inner_text("#status")


def test_downloads(page, tmp_path):
    page.fill("#gas", "nitrogen")
    run_comparison(page, "20", "degC", "200", "bar", ["pr", "lk"])
    with page.expect_download() as d:
        page.click("#get-xlsx")
    path = tmp_path / "page.xlsx"
    d.value.save_as(path)
    assert path.read_bytes()[:2] == b"PK"
    with page.expect_download() as d:
        page.click("#get-csv")
    path = tmp_path / "page.csv"
    d.value.save_as(path)
    text = path.read_text()
    assert text.startswith("# side by side\nModel,Z,")
    assert "# isotherm" in text and "# envelope" in text
