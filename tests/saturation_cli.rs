//! End-to-end tests of `zfactor saturation`: the JSON interface against the library called
//! directly and against IAPWS-95 (IAPWS R6-95(2018) Table 8), CSV and table output, and the
//! refusals (exit code 2, nothing on stdout, one message on stderr).

use assert_cmd::Command;
use eos::helmholtz::reference_for;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn json(args: &[&str]) -> Value {
    let out = zf()
        .arg("saturation")
        .args(args)
        .args(["--format", "json"])
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn refused(args: &[&str], needle: &str) {
    let out = zf().arg("saturation").args(args).output().unwrap();
    assert_eq!(out.status.code(), Some(2), "{args:?}");
    assert!(out.stdout.is_empty(), "{args:?} printed data");
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(err.trim_end().lines().count(), 1, "{err}");
    assert!(err.contains(needle), "{args:?}: {err}");
}

fn num(v: &Value) -> f64 {
    v.as_f64().unwrap()
}

#[test]
fn iapws95_table8_through_the_command() {
    // IAPWS R6-95(2018) Table 8 at 450 K: p_sat = 0.932203564 MPa, rho' = 890.341250 kg/m3,
    // rho'' = 4.81200360 kg/m3, h'' - h' = 2774.41078 - 749.161585 kJ/kg; 9 digits printed.
    let v = json(&["--fluid", "water", "-t", "450 K", "-m", "reference"]);
    let r = &v["results"][0];
    assert_eq!(r["model"], "reference");
    assert!((num(&r["pressure_pa"]) / 0.932203564e6 - 1.0).abs() < 1e-8);
    assert!((num(&r["liquid"]["mass_density_kg_m3"]) / 890.341250 - 1.0).abs() < 1e-8);
    assert!((num(&r["vapor"]["mass_density_kg_m3"]) / 4.81200360 - 1.0).abs() < 1e-8);
    let latent = (2774.41078 - 749.161585) * 1e3;
    assert!((num(&r["latent_heat_j_kg"]) / latent - 1.0).abs() < 1e-8);
    // The same numbers as the library called directly.
    let w = reference_for("water").unwrap();
    let s = w.saturation_t(450.0).unwrap();
    assert_eq!(num(&r["pressure_pa"]).to_bits(), s.p.to_bits());
}

#[test]
fn saturation_temperature_at_one_atmosphere() {
    // Normal boiling point of water, 373.1243 K at 101.325 kPa (from memory of the IAPWS-95
    // release text); printed to 4 decimals.
    let v = json(&["--fluid", "water", "-p", "1 atm", "-m", "reference"]);
    let t = num(&v["results"][0]["temperature_k"]);
    assert!((t - 373.1243).abs() < 1e-4, "{t}");
    assert_eq!(v["input"]["given"], "P");
    assert_eq!(
        num(&v["input"]["pressure_pa"]).to_bits(),
        101_325f64.to_bits()
    );
}

#[test]
fn all_models_for_a_fluid_with_both_formulations() {
    // Methane has a reference (Setzmann & Wagner 1991) and a 12-term equation: all = 7 models.
    let v = json(&["--fluid", "methane", "-t", "150 K"]);
    let ids: Vec<&str> = v["results"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["model"].as_str().unwrap())
        .collect();
    assert_eq!(ids, ["vdw", "rk", "srk", "pr", "pr78", "reference", "sw12"]);
    for r in v["results"].as_array().unwrap() {
        // The liquid is denser than the vapour and the latent heat positive.
        assert!(
            num(&r["liquid"]["molar_density_mol_m3"]) > num(&r["vapor"]["molar_density_mol_m3"])
        );
        assert!(num(&r["latent_heat_j_mol"]) > 0.0);
    }
    // Water has no 12-term equation here: all = five cubics and the reference.
    let v = json(&["--fluid", "water", "-t", "400 K"]);
    assert_eq!(v["results"].as_array().unwrap().len(), 6);
}

#[test]
fn csv_and_table() {
    let out = zf()
        .args([
            "saturation",
            "--fluid",
            "co2",
            "-t",
            "250 K",
            "-m",
            "pr,reference",
            "-f",
            "csv",
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines.len(), 3);
    assert!(lines[0].starts_with("model,temperature_k,pressure_pa"));
    let out = zf()
        .args([
            "saturation",
            "--fluid",
            "nitrogen",
            "-p",
            "5 bar",
            "-m",
            "srk",
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(text.contains("latent heat") && text.contains("saturation temperature"));
}

#[test]
fn bad_input_is_refused_whole() {
    refused(&["--fluid", "water", "-t", "700 K"], "critical");
    refused(
        &["--fluid", "water", "-t", "650 K", "-m", "reference"],
        "critical",
    );
    refused(
        &["--fluid", "water", "-p", "300 bar", "-m", "pr"],
        "critical",
    );
    refused(&["--fluid", "unobtainium", "-t", "300 K"], "unobtainium");
    refused(
        &["--mix", "methane=0.5,ethane=0.5", "-t", "150 K"],
        "pure fluid",
    );
    refused(
        &["--fluid", "water", "-t", "300 K", "-p", "1 bar"],
        "exactly one",
    );
    refused(&["--fluid", "water"], "exactly one");
    refused(
        &["--fluid", "water", "-t", "300 K", "-m", "ideal"],
        "unknown model",
    );
    refused(
        &["--fluid", "propane", "-t", "300 K", "-m", "reference"],
        "no reference",
    );
    refused(&["--fluid", "water", "-t", "300"], "300");
}
