"""The commands from Python as frames: state, saturation, flash, envelope and compare give
the command line's own numbers (its JSON for the same options), its messages as exceptions,
its warnings as ZFactorWarning, and the basis in the frame's attrs."""

import json
import subprocess
import sys
import warnings

import pytest

import zfactor

GAS = "methane=0.9,ethane=0.06,propane=0.04"


def cli_json(cli, *args):
    out = subprocess.run([str(cli), *args, "--format", "json"], capture_output=True, text=True)
    assert out.returncode in (0, 3), out.stderr
    return json.loads(out.stdout)


def test_state_frame_equals_the_command_line(cli):
    df = zfactor.state(mix=GAS, temperature="15 degC", pressure="70 barg", model="pr,srk,lk")
    want = cli_json(cli, "state", "--mix", GAS, "-t", "15 degC", "-p", "70 barg", "-m", "pr,srk,lk")
    assert list(df["model"]) == [r["model"] for r in want["results"]]
    assert list(df["z"]) == [r["z"] for r in want["results"]]
    assert df.attrs["caution"] == want["caution"]
    assert df.attrs["input"]["pressure_is_gauge"] is True


def test_saturation_of_propane(cli):
    df = zfactor.saturation(fluid="propane", temperature="20 degC", model="pr,srk")
    want = cli_json(cli, "saturation", "--fluid", "propane", "-t", "20 degC", "-m", "pr,srk")
    assert df.to_dict("records")[0]["pressure_pa"] == want["results"][0]["pressure_pa"]
    # Propane boils at about 8.4 bar at 20 degC (handbook vapour-pressure tables, recalled
    # from memory); both cubics come within 3 %.
    for p in df["pressure_pa"]:
        assert p / 1e5 == pytest.approx(8.36, rel=0.03)


def test_flash_gives_both_dew_points_of_a_retrograde_isotherm():
    df = zfactor.flash(mix="methane=0.9,propane=0.1", temperature="250 K", dew_pressure=True, model="pr")
    assert list(df["branch"]) == ["lower", "upper"]
    assert df["pressure_pa"].iloc[0] < df["pressure_pa"].iloc[1]


def test_envelope_and_compare(cli):
    env = zfactor.envelope(mix=GAS, model="pr")
    assert set(env["branch"]) == {"dew", "bubble"}
    assert env.attrs["cricondenbar"]["pressure_pa"] >= env["pressure_pa"].max() * (1 - 1e-9)
    df = zfactor.compare(fluid="nitrogen", temperatures="150..300 K n 4", pressures="1..300 bar n 5", model="pr,srk")
    assert len(df) == 4 * 5 * 2
    want = cli_json(cli, "compare", "--fluid", "nitrogen", "-t", "150..300 K n 4", "-p", "1..300 bar n 5", "-m", "pr,srk")
    got = df[(df["model"] == "srk")]["deviation_pct"].tolist()
    assert got == [p["values"][1]["deviation_pct"] for p in want["points"]]
    assert df.attrs["reference"]["id"] == "reference"


def test_messages_are_the_command_lines(cli):
    with pytest.raises(ValueError, match='cannot read "25 degX" as a temperature'):
        zfactor.state(fluid="methane", temperature="25 degX", pressure="1 bar")
    with pytest.raises(ValueError, match="not an option of table"):
        zfactor.report("table", fluid="methane", temperatures="300 K", pressures="1 bar", output="x.csv")
    with pytest.warns(zfactor.ZFactorWarning, match="outside"):
        zfactor.state(fluid="methane", temperature="700 K", pressure="900 bar", model="dak")


def test_without_pandas_a_dict_of_columns(monkeypatch):
    monkeypatch.setitem(sys.modules, "pandas", None)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", zfactor.ZFactorWarning)
        cols = zfactor.state(fluid="methane", temperature="300 K", pressure="50 bar", model="pr,srk")
    assert cols["model"] == ["pr", "srk"]
    assert cols["z"].dtype.kind == "f" and len(cols["z"]) == 2
    assert "caution" in cols["attrs"]


def test_audit_of_a_data_frame(cli):
    import pandas as pd

    # The sheet's densities: one as the reference equation gives it (Setzmann and Wagner
    # 1991, through the command line), one computed at 70 bar absolute for 70 barg, the
    # gauge-read-as-absolute mistake the audit names.
    right = cli_json(cli, "state", "--fluid", "methane", "-t", "15 degC", "-p", "70 barg", "-m", "reference")
    wrong = cli_json(cli, "state", "--fluid", "methane", "-t", "15 degC", "-p", "70 bar", "-m", "reference")
    sheet = pd.DataFrame(
        {
            "fluid": ["methane", "methane"],
            "T [degC]": [15, 15],
            "P [barg]": [70, 70],
            "density [kg/m3]": [r["results"][0]["mass_density_kg_m3"] for r in (right, wrong)],
        }
    )
    with pytest.warns(zfactor.ZFactorWarning):
        out = zfactor.audit(sheet, tolerance="1%")
    assert list(out["status"]) == ["ok", "FLAG"]
    assert out["reconciling_causes"].iloc[1] == "gauge pressure read as absolute"
    assert out.attrs["rows_flagged"] == 1
    with pytest.raises(ValueError, match="tolerance"):
        zfactor.audit(sheet, tolerance="lots")
