//! `zfactor flow` end to end against exact unit arithmetic and the CODATA molar volume.

use assert_cmd::Command;
use predicates::prelude::*;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn run_json(args: &[&str]) -> Value {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    assert!(
        out.status.success(),
        "{:?} failed: {}",
        args,
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn volume_at<'a>(r: &'a Value, base: &str) -> &'a Value {
    r["volumes"]
        .as_array()
        .unwrap()
        .iter()
        .find(|v| v["base"] == base)
        .unwrap()
}

#[test]
fn one_kmol_per_hour_is_the_codata_molar_volume_at_0_degc() {
    // CODATA 2018 molar volume of the ideal gas at 273.15 K, 101.325 kPa:
    // 22.413 969 54 L/mol, so 1 kmol/h = 22.413 969 54 m3/h.
    let v = run_json(&[
        "flow", "--fluid", "nitrogen", "--flow", "1 kmol/h", "-m", "ideal",
    ]);
    let q = volume_at(&v["results"][0], "0degC")["volume_flow_m3_s"]["value"]
        .as_f64()
        .unwrap();
    assert!(
        (q * 3600.0 / 22.413_969_54 - 1.0).abs() < 1e-9,
        "{}",
        q * 3600.0
    );
}

#[test]
fn a_standard_flow_returns_itself_at_its_own_base_and_states_it() {
    // 1 MMscfd = 1e6 x 0.3048^3 m3/d = 28 316.846 592 m3/d (exact foot).
    let v = run_json(&[
        "flow",
        "--fluid",
        "methane",
        "--flow",
        "1 MMscfd",
        "-m",
        "pr,srk,ideal",
    ]);
    assert_eq!(v["input"]["base"]["id"], "60degF-14.696psia");
    for r in v["results"].as_array().unwrap() {
        let q = volume_at(r, "60degF-14.696psia")["volume_flow_m3_s"]["value"]
            .as_f64()
            .unwrap();
        assert!((q * 86_400.0 / 28_316.846_592 - 1.0).abs() < 1e-12);
    }
}

#[test]
fn actual_flow_needs_flowing_conditions_and_scales_with_z() {
    zf().args(["flow", "--fluid", "methane", "--flow", "100 m3/h"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("--temperature"));
    let v = run_json(&[
        "flow",
        "--fluid",
        "methane",
        "--flow",
        "3600 kg/h",
        "-t",
        "300 K",
        "-p",
        "50 bar",
        "-m",
        "pr",
    ]);
    let r = &v["results"][0];
    let a = volume_at(r, "actual");
    let z = a["z"].as_f64().unwrap();
    let q = a["volume_flow_m3_s"]["value"].as_f64().unwrap();
    let qi = a["volume_flow_m3_s"]["ideal"].as_f64().unwrap();
    // Same mass flow: actual volumes stand in the ratio of Z (V = n Z R T / P).
    assert!((q / qi - z).abs() < 1e-12);
    assert!((r["mass_flow_kg_s"].as_f64().unwrap() - 1.0).abs() < 1e-14);
}
