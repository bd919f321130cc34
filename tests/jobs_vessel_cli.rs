//! `zfactor vessel` end to end: the scriptable JSON fields, the caution, exact ideal-gas
//! relations, mass conservation and refusals of bad input.

use assert_cmd::Command;
use predicates::prelude::*;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn run_json(args: &[&str]) -> (Value, String) {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    assert!(
        out.status.code() == Some(0) || out.status.code() == Some(3),
        "{:?} failed: {}",
        args,
        String::from_utf8_lossy(&out.stderr)
    );
    (
        serde_json::from_slice(&out.stdout).unwrap(),
        String::from_utf8_lossy(&out.stderr).to_string(),
    )
}

/// CODATA 2018 molar gas constant, exact in the 2019 SI.
const R: f64 = 8.314_462_618;

fn molar_mass(fluid: &str) -> f64 {
    let out = zf()
        .args(["fluids", fluid, "--format", "json"])
        .output()
        .unwrap();
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    v["molar_mass_kg_mol"].as_f64().unwrap()
}

#[test]
fn every_model_gives_model_and_mass_kg_and_the_caution() {
    let (v, err) = run_json(&[
        "vessel",
        "--fluid",
        "methane",
        "--volume",
        "1 m3",
        "--temperature",
        "15 degC",
        "--pressure",
        "200 bar",
        "--model",
        "ideal,vdw,rk,srk,pr,pr78",
    ]);
    let res = v["results"].as_array().unwrap();
    let ids: Vec<&str> = res.iter().map(|r| r["model"].as_str().unwrap()).collect();
    assert_eq!(ids, ["ideal", "vdw", "rk", "srk", "pr", "pr78"]);
    // Ideal gas: m = P V M / (R T) (definition of the ideal gas).
    let m_ideal = 200e5 * 1.0 * molar_mass("methane") / (R * 288.15);
    for r in res {
        let mass = r["mass_kg"].as_f64().unwrap();
        assert!(mass > 0.0);
        let mi = r["mass_ideal_kg"].as_f64().unwrap();
        assert!((mi / m_ideal - 1.0).abs() < 1e-12, "{mi} vs {m_ideal}");
        let err_pct = r["mass_ideal_error_pct"].as_f64().unwrap();
        assert!((err_pct - 100.0 * (mi - mass) / mass).abs() < 1e-9);
    }
    assert!(err.contains("caution:") && err.contains("licensed engineer"));
}

#[test]
fn the_table_prints_the_caution_and_the_ideal_gas_rows() {
    zf().args([
        "vessel",
        "--mix",
        "methane=0.9,ethane=0.1",
        "--volume",
        "50 L",
        "-t",
        "20 degC",
        "-p",
        "150 barg",
        "-m",
        "pr",
    ])
    .assert()
    .success()
    .stdout(predicate::str::contains("ideal-gas error"))
    .stdout(predicate::str::contains("licensed engineer"))
    .stdout(predicate::str::contains("local codes"));
}

#[test]
fn ideal_gas_heating_and_standard_volume_are_exact() {
    let (v, _) = run_json(&[
        "vessel",
        "--fluid",
        "nitrogen",
        "--volume",
        "2 m3",
        "-t",
        "288.15 K",
        "-p",
        "100 bar",
        "--to-temperature",
        "348.15 K",
        "--base",
        "0degC",
        "-m",
        "ideal",
    ]);
    let r = &v["results"][0];
    // Ideal gas at fixed n, V: P2 = P1 T2 / T1.
    let p2 = r["heating"]["pressure_pa"]["value"].as_f64().unwrap();
    assert!((p2 / (100e5 * 348.15 / 288.15) - 1.0).abs() < 1e-12);
    // Standard volume at 0 degC, 1 atm: V P1 / T1 x T_b / P_b.
    let vs = r["standard_volume_m3"].as_f64().unwrap();
    let exact = 2.0 * 100e5 / 288.15 * 273.15 / 101_325.0;
    assert!((vs / exact - 1.0).abs() < 1e-12, "{vs} vs {exact}");
    assert_eq!(v["base"]["id"], "0degC");
}

#[test]
fn cooling_a_propane_cylinder_reports_the_split_and_conserves_mass() {
    let (v, err) = run_json(&[
        "vessel",
        "--fluid",
        "propane",
        "--volume",
        "1 m3",
        "-t",
        "400 K",
        "-p",
        "30 bar",
        "--to-temperature",
        "300 K",
        "-m",
        "pr",
    ]);
    let h = &v["results"][0]["heating"];
    assert_eq!(h["end_state"]["phase"], "two-phase");
    let q = h["end_state"]["vapor_mass_fraction"].as_f64().unwrap();
    assert!(q > 0.0 && q < 1.0);
    assert!(h["mass_balance"].as_f64().unwrap().abs() < 1e-10);
    assert!(err.contains("condense"));
}

#[test]
fn venting_is_flagged_against_the_mdmt_and_conserves_mass() {
    let (v, err) = run_json(&[
        "vessel",
        "--fluid",
        "nitrogen",
        "--volume",
        "1 m3",
        "-t",
        "20 degC",
        "-p",
        "200 bar",
        "--vent-to",
        "10 bar",
        "--mdmt",
        "-46 degC",
        "-m",
        "pr",
    ]);
    let vent = &v["results"][0]["venting"];
    assert_eq!(vent["below_mdmt"], true);
    let m0 = v["results"][0]["mass_kg"].as_f64().unwrap();
    let left = vent["mass_left_kg"]["value"].as_f64().unwrap();
    let out = vent["mass_vented_kg"]["value"].as_f64().unwrap();
    assert!(((left + out) / m0 - 1.0).abs() < 1e-13);
    assert!(vent["entropy_drift_j_mol_k"].as_f64().unwrap() < 1e-9);
    // Warnings are folded at 100 columns like every prose line of the terminal.
    assert!(err
        .replace("\n  ", " ")
        .contains("minimum design metal temperature"));
}

#[test]
fn unreachable_targets_and_bad_input_are_refused_with_code_2() {
    // Venting below the back pressure.
    zf().args([
        "vessel",
        "--fluid",
        "methane",
        "--volume",
        "1 m3",
        "-t",
        "15 degC",
        "-p",
        "50 bar",
        "--target-pressure",
        "0.5 bar",
        "-m",
        "pr",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("back pressure"));
    // More mass than the model can put in the volume.
    zf().args([
        "vessel",
        "--fluid",
        "methane",
        "--volume",
        "1 L",
        "-t",
        "15 degC",
        "-p",
        "50 bar",
        "--target-mass",
        "500 kg",
        "-m",
        "pr",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("cannot hold"));
    // Venting "to" a higher pressure.
    zf().args([
        "vessel",
        "--fluid",
        "methane",
        "--volume",
        "1 m3",
        "-t",
        "15 degC",
        "-p",
        "50 bar",
        "--vent-to",
        "60 bar",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("--vent-to"));
    // A mass without a unit.
    zf().args([
        "vessel",
        "--fluid",
        "methane",
        "--volume",
        "1 m3",
        "-t",
        "15 degC",
        "-p",
        "50 bar",
        "--target-mass",
        "500",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("unit"));
}

#[test]
fn csv_output_has_one_row_per_model_with_the_fixed_names() {
    let out = zf()
        .args([
            "vessel", "--fluid", "methane", "--volume", "1 m3", "-t", "15 degC", "-p", "100 bar",
            "-m", "ideal,pr", "--format", "csv",
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let mut rd = csv::Reader::from_reader(out.stdout.as_slice());
    let head = rd.headers().unwrap().clone();
    let col = |name: &str| head.iter().position(|h| h == name).unwrap();
    let rows: Vec<csv::StringRecord> = rd.records().map(|r| r.unwrap()).collect();
    assert_eq!(rows.len(), 2);
    assert_eq!(&rows[1][col("model")], "pr");
    let m: f64 = rows[1][col("mass_kg")].parse().unwrap();
    assert!(m > 0.0);
    assert!(String::from_utf8_lossy(&out.stderr).contains("caution:"));
}
