//! End-to-end tests of the `zfactor` binary: the scriptable interface (JSON field names,
//! exit codes, stderr/stdout split), every model and input pair, and bad input.
//!
//! Physics is checked in the library tests; here the numbers are checked against the library
//! called directly and against exact relations (ideal-gas density P/RT with the CODATA R).

use assert_cmd::Command;
use predicates::prelude::*;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

/// Like [`json`], for runs that end with warnings (exit code 3) by design.
fn json_warned(args: &[&str]) -> Value {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    assert!(
        matches!(out.status.code(), Some(0 | 3)),
        "{:?} failed: {}",
        args,
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn json(args: &[&str]) -> Value {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    assert!(
        out.status.success(),
        "{:?} failed: {}",
        args,
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

/// Equality of two numbers that must agree to the last bit (sums of exactly representable
/// values).
fn exact(a: f64, b: f64) {
    assert_eq!(a.to_bits(), b.to_bits(), "{a} != {b}");
}

const MODELS: [&str; 6] = ["ideal", "vdw", "rk", "srk", "pr", "pr78"];

#[test]
fn state_json_has_the_fixed_fields_for_every_model() {
    let v = json(&[
        "state",
        "--fluid",
        "methane",
        "--temperature",
        "300 K",
        "--pressure",
        "70 barg",
        "--model",
        "all",
    ]);
    let results = v["results"].as_array().unwrap();
    // "all" is the ideal gas, the cubic family and methane's two Helmholtz formulations.
    let all = MODELS.iter().chain(&["sw12", "reference"]);
    assert_eq!(results.len(), MODELS.len() + 2);
    for (r, id) in results.iter().zip(all) {
        assert_eq!(r["model"], *id);
        for key in ["phase", "z", "molar_density_mol_m3", "mass_density_kg_m3"] {
            assert!(!r[key].is_null(), "{id} lacks {key}");
        }
    }
    // 70 barg with the default ambient of 101.325 kPa.
    exact(v["input"]["pressure_pa"].as_f64().unwrap(), 7_101_325.0);
    // Ideal gas: rho = P/(R T) with R = 8.314462618 J/(mol K) (CODATA 2018, exact).
    let rho = results[0]["molar_density_mol_m3"].as_f64().unwrap();
    let want = 7_101_325.0 / (8.314_462_618 * 300.0);
    assert!((rho / want - 1.0).abs() < 1e-14);
}

#[test]
fn the_cli_reports_what_the_library_computes() {
    use eos::cubic::{Cubic, CubicKind};
    use eos::state::{RootChoice, State};
    let rec = fluids::find("ethane").unwrap();
    let m = Cubic::new(CubicKind::Srk, &[rec.to_component()], None).unwrap();
    let s = State::at_tp(&m, 350.0, 4e6, &[1.0], RootChoice::LowestGibbs).unwrap();
    let v = json(&[
        "state", "--fluid", "ethane", "-t", "350 K", "-p", "4 MPa", "-m", "srk",
    ]);
    let z = v["results"][0]["z"].as_f64().unwrap();
    assert!((z - s.props.z).abs() < 1e-15);
}

#[test]
fn every_input_pair_for_pure_fluids_and_mixtures() {
    let mix = "methane=0.9,ethane=0.07,propane=0.03";
    for fluid in [["--fluid", "nitrogen"], ["--mix", mix]] {
        for model in MODELS {
            let tp = json(&[
                "state", fluid[0], fluid[1], "-t", "280 K", "-p", "50 bar", "-m", model,
            ]);
            let rho = tp["results"][0]["molar_density_mol_m3"].as_f64().unwrap();
            let dens = format!("{rho} mol/m3");
            let td = json(&[
                "state", fluid[0], fluid[1], "-t", "280 K", "-d", &dens, "-m", model,
            ]);
            let p = td["results"][0]["pressure_pa"].as_f64().unwrap();
            assert!((p / 50e5 - 1.0).abs() < 1e-9, "{model}: {p}");
            let pd = json(&[
                "state", fluid[0], fluid[1], "-p", "50 bar", "-d", &dens, "-m", model,
            ]);
            let t = pd["results"][0]["temperature_k"].as_f64().unwrap();
            assert!((t / 280.0 - 1.0).abs() < 1e-9, "{model}: {t}");
        }
    }
}

#[test]
fn mass_basis_and_percent_give_the_same_mixture() {
    let a = json(&[
        "state",
        "--mix",
        "methane=90%,ethane=10%",
        "-t",
        "300 K",
        "-p",
        "1 MPa",
        "-m",
        "pr",
    ]);
    let x: Vec<f64> = a["composition"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["mass_fraction"].as_f64().unwrap())
        .collect();
    let mass = format!("methane={},ethane={}", x[0], x[1]);
    let b = json(&[
        "state", "--mix", &mass, "--basis", "mass", "-t", "300 K", "-p", "1 MPa", "-m", "pr",
    ]);
    let xm = b["composition"][0]["mole_fraction"].as_f64().unwrap();
    assert!((xm - 0.9).abs() < 1e-12, "{xm}");
    let za = a["results"][0]["z"].as_f64().unwrap();
    let zb = b["results"][0]["z"].as_f64().unwrap();
    assert!((za - zb).abs() < 1e-12);
}

#[test]
fn gauge_pressure_uses_the_stated_ambient() {
    let v = json(&[
        "state",
        "--fluid",
        "air",
        "-t",
        "20 degC",
        "-p",
        "10 barg",
        "--ambient",
        "0.95 bar",
        "-m",
        "ideal",
    ]);
    exact(
        v["input"]["ambient_pressure_pa"].as_f64().unwrap(),
        95_000.0,
    );
    exact(v["input"]["pressure_pa"].as_f64().unwrap(), 1_095_000.0);
    assert_eq!(v["input"]["pressure_is_gauge"], true);
}

#[test]
fn fluids_json_has_the_fixed_fields() {
    let v = json(&["fluids", "CO2"]);
    for key in [
        "name",
        "tc_k",
        "pc_pa",
        "omega",
        "molar_mass_kg_mol",
        "source",
    ] {
        assert!(!v[key].is_null(), "missing {key}");
    }
    assert!((v["tc_k"].as_f64().unwrap() - 304.1).abs() < 0.2);
}

#[test]
fn table_output_and_demo_run() {
    zf().args(["demo"])
        .assert()
        .success()
        .stdout(predicate::str::contains("pr78").and(predicate::str::contains("caution")));
    zf().args(["state", "--fluid", "methane", "-t", "300 K", "-p", "70 bar"])
        .assert()
        .success()
        .stdout(predicate::str::contains("Z"));
    zf().args(["fluids"]).assert().success();
    zf().args(["fluids", "--search", "butane"])
        .assert()
        .success()
        .stdout(predicate::str::contains("isobutane"));
}

/// Runs a bad command and checks: exit code 2, nothing on stdout, one message on stderr
/// that contains `quote`.
fn refused(args: &[&str], quote: &str) {
    let out = zf().args(args).output().unwrap();
    assert_eq!(out.status.code(), Some(2), "{args:?}");
    assert!(out.stdout.is_empty(), "{args:?} printed partial output");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains(quote), "{args:?}: {err}");
}

#[test]
fn bad_input_is_refused_with_a_message_that_quotes_it() {
    let s = ["state", "-m", "pr"];
    let run = |extra: &[&str], quote: &str| {
        let mut a: Vec<&str> = s.to_vec();
        a.extend_from_slice(extra);
        refused(&a, quote);
    };
    run(
        &["--fluid", "unobtainium", "-t", "300 K", "-p", "1 bar"],
        "unobtainium",
    );
    run(
        &["--fluid", "methan", "-t", "300 K", "-p", "1 bar"],
        "methane",
    );
    run(
        &["--fluid", "methane", "-t", "300", "-p", "1 bar"],
        "\"300\"",
    );
    run(&["--fluid", "methane", "-t", "300 K", "-p", "1 bra"], "bra");
    run(
        &["--fluid", "methane", "-t", "300 K", "-p", "0 bar"],
        "0 bar",
    );
    run(
        &["--fluid", "methane", "-t", "300 K", "-p", "-2 barg"],
        "-2 barg",
    );
    run(
        &["--fluid", "methane", "-t", "-300 degC", "-p", "1 bar"],
        "-300 degC",
    );
    run(
        &["--fluid", "methane", "-t", "NaN K", "-p", "1 bar"],
        "NaN K",
    );
    run(
        &["--fluid", "methane", "-t", "300 K", "-p", "inf bar"],
        "inf bar",
    );
    run(
        &[
            "--mix",
            "methane=0.9,ethane=0.05",
            "-t",
            "300 K",
            "-p",
            "1 bar",
        ],
        "0.95",
    );
    run(
        &[
            "--mix",
            "methane=1.1,ethane=-0.1",
            "-t",
            "300 K",
            "-p",
            "1 bar",
        ],
        "-0.1",
    );
    run(
        &[
            "--mix",
            "methane=90,ethane=10",
            "-t",
            "300 K",
            "-p",
            "1 bar",
        ],
        "percent",
    );
    run(&["--fluid", "methane", "-t", "300 K"], "two properties");
    run(
        &["--fluid", "methane", "-t", "300 K", "-d", "40000 mol/m3"],
        "co-volume",
    );
    refused(
        &[
            "state", "--fluid", "methane", "-t", "300 K", "-p", "1 bar", "-m", "xyz",
        ],
        "xyz",
    );
}

#[test]
fn normalisation_only_when_asked() {
    let v = json(&[
        "state",
        "--mix",
        "methane=0.9,ethane=0.05",
        "--normalize",
        "-t",
        "300 K",
        "-p",
        "1 bar",
        "-m",
        "pr",
    ]);
    assert!((v["input"]["normalized_from"].as_f64().unwrap() - 0.95).abs() < 1e-15);
    let x = v["composition"][0]["mole_fraction"].as_f64().unwrap();
    assert!((x - 0.9 / 0.95).abs() < 1e-15);
}

#[test]
fn a_split_mixture_is_reported_as_two_phases() {
    // Material balance of the reported split (definition of the vapour fraction) and the
    // fixed JSON names of a two-phase state.
    let out = zf()
        .args([
            "state",
            "--mix",
            "methane=0.8,propane=0.15,n-pentane=0.05",
            "-t",
            "250 K",
            "-p",
            "30 bar",
            "-m",
            "pr",
            "--format",
            "json",
        ])
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(3),
        "two-phase states carry a warning"
    );
    assert!(String::from_utf8_lossy(&out.stderr).contains("meaningless"));
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    let r = &v["results"][0];
    assert_eq!(r["phase"], "two-phase");
    let beta = r["vapor_fraction"].as_f64().unwrap();
    assert!(beta > 0.0 && beta < 1.0);
    let phases = r["phases"].as_array().unwrap();
    assert_eq!(phases.len(), 2);
    let feed = [0.8, 0.15, 0.05];
    for (i, zi) in feed.iter().enumerate() {
        let y = phases[0]["composition"][i]["mole_fraction"]
            .as_f64()
            .unwrap();
        let x = phases[1]["composition"][i]["mole_fraction"]
            .as_f64()
            .unwrap();
        assert!((beta * y + (1.0 - beta) * x - zi).abs() < 1e-12);
    }
    for ph in phases {
        for key in ["z", "molar_density_mol_m3", "mass_density_kg_m3"] {
            assert!(ph[key].as_f64().unwrap() > 0.0);
        }
    }
}

#[test]
fn the_model_catalogue_lists_every_model_id() {
    let v = json(&["models"]);
    let ids: Vec<&str> = v["models"]
        .as_array()
        .unwrap()
        .iter()
        .map(|m| m["id"].as_str().unwrap())
        .collect();
    for id in zfactor::models::ALL_IDS {
        assert!(ids.contains(&id), "{id} missing from the catalogue");
    }
    refused(&["models", "nonsense"], "nonsense");
}

#[test]
fn every_model_answers_in_state_where_it_applies() {
    // Water at 400 K, 10 bar (compressed liquid): IF97 and IAPWS-95 agree to 1e-5 in density
    // (IAPWS R7-97(2012) states IF97's consistency with IAPWS-95 to this order in region 1).
    let v = json(&[
        "state",
        "--fluid",
        "water",
        "-t",
        "400 K",
        "-p",
        "10 bar",
        "-m",
        "if97,reference",
    ]);
    let rho: Vec<f64> = v["results"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["mass_density_kg_m3"].as_f64().unwrap())
        .collect();
    assert!((rho[0] / rho[1] - 1.0).abs() < 1e-5, "{rho:?}");
    // Natural gas with every mixture model, one at a time.
    for id in ["srk-pen", "pr-pen", "pr78-pen", "virial", "lk", "dak", "hy"] {
        let v = json(&[
            "state",
            "--mix",
            "methane=0.9,ethane=0.06,propane=0.02,nitrogen=0.02",
            "-t",
            "300 K",
            "-p",
            "20 bar",
            "-m",
            id,
        ]);
        let z = v["results"][0]["z"].as_f64().unwrap();
        assert!(z > 0.9 && z < 1.0, "{id}: Z = {z}");
    }
    refused(
        &[
            "state",
            "--mix",
            "methane=0.5,ethane=0.5",
            "-t",
            "300 K",
            "-p",
            "1 bar",
            "-m",
            "reference",
        ],
        "single fluid",
    );
    refused(
        &[
            "state", "--fluid", "methane", "-t", "300 K", "-p", "1 bar", "-m", "if97",
        ],
        "water",
    );
}

#[test]
fn pure_fluid_pairs_with_enthalpy_entropy_and_quality() {
    // Steam at 10 bar with h = 2000 kJ/kg on the steam-table zero: inside the dome, quality
    // (2000 - h')/(h'' - h') with h' = 762.7 and h'' = 2777.1 kJ/kg at 10 bar (from memory of
    // the IAPWS-IF97 steam tables) = 0.614.
    let v = json_warned(&[
        "state",
        "--fluid",
        "water",
        "-p",
        "10 bar",
        "--enthalpy",
        "2000 kJ/kg",
        "-m",
        "reference",
    ]);
    let r = &v["results"][0];
    assert_eq!(r["phase"], "two-phase");
    let x = r["vapor_fraction"].as_f64().unwrap();
    assert!(
        (x - (2000.0 - 762.7) / (2777.1 - 762.7)).abs() < 2e-3,
        "{x}"
    );
    // (T, x) on every pure-fluid model gives the saturated phases; x = 0 is saturated liquid.
    for model in ["pr", "srk", "reference"] {
        let v = json_warned(&[
            "state",
            "--fluid",
            "co2",
            "-t",
            "280 K",
            "--quality",
            "0",
            "-m",
            model,
        ]);
        assert_eq!(v["results"][0]["phase"], "saturated-liquid", "{model}");
    }
    // A density inside the dome of a pure fluid is two-phase, not a single-phase root.
    let v = json_warned(&[
        "state",
        "--fluid",
        "co2",
        "-t",
        "280 K",
        "-d",
        "400 kg/m3",
        "-m",
        "pr",
    ]);
    assert_eq!(v["results"][0]["phase"], "two-phase");
    refused(
        &[
            "state",
            "--fluid",
            "water",
            "-t",
            "300 K",
            "--quality",
            "1.5",
            "-m",
            "pr",
        ],
        "1.5",
    );
    refused(
        &[
            "state",
            "--mix",
            "methane=0.5,ethane=0.5",
            "-p",
            "1 bar",
            "--quality",
            "0.5",
            "-m",
            "pr",
        ],
        "pure fluid",
    );
}
