//! `zfactor process` and `zfactor relief` end to end: exact ideal-gas heat and work, the
//! throttle's constant enthalpy, the Z-range warning, refusals of bad input.

use assert_cmd::Command;
use predicates::prelude::*;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn run_json(args: &[&str]) -> (Value, Option<i32>, String) {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    let code = out.status.code();
    assert!(
        code == Some(0) || code == Some(3),
        "{:?} failed: {}",
        args,
        String::from_utf8_lossy(&out.stderr)
    );
    (
        serde_json::from_slice(&out.stdout).unwrap(),
        code,
        String::from_utf8_lossy(&out.stderr).to_string(),
    )
}

/// CODATA 2018 molar gas constant.
const R: f64 = 8.314_462_618;

#[test]
fn isothermal_ideal_gas_heat_is_rt_ln_p1_over_p2() {
    // Reversible isothermal ideal gas: q = w = R T ln(P1/P2) per mole (first law, du = 0).
    let (v, _, _) = run_json(&[
        "process",
        "--fluid",
        "argon",
        "--path",
        "isothermal",
        "-t",
        "300 K",
        "-p",
        "50 bar",
        "--to-pressure",
        "5 bar",
        "-m",
        "ideal,pr",
    ]);
    let out = zf()
        .args(["fluids", "argon", "--format", "json"])
        .output()
        .unwrap();
    let m = serde_json::from_slice::<Value>(&out.stdout).unwrap()["molar_mass_kg_mol"]
        .as_f64()
        .unwrap();
    let r = &v["results"][1];
    let q = r["heat_j_kg"]["ideal"].as_f64().unwrap();
    let exact = R * 300.0 * 10f64.ln() / m;
    assert!((q / exact - 1.0).abs() < 1e-10, "{q} vs {exact}");
    let w = r["work_j_kg"]["ideal"].as_f64().unwrap();
    assert!((w / exact - 1.0).abs() < 1e-10);
    // The real gas: first law du = q - w holds for the model's own numbers.
    let (q, w, du) = (
        r["heat_j_kg"]["value"].as_f64().unwrap(),
        r["work_j_kg"]["value"].as_f64().unwrap(),
        r["delta_u_j_kg"]["value"].as_f64().unwrap(),
    );
    assert!((du - (q - w)).abs() < 1e-9 * q.abs());
}

#[test]
fn a_throttle_keeps_enthalpy_and_cools_methane() {
    let (v, _, err) = run_json(&[
        "process",
        "--fluid",
        "methane",
        "--path",
        "isenthalpic",
        "-t",
        "25 degC",
        "-p",
        "100 bar",
        "--to-pressure",
        "10 bar",
        "-m",
        "pr,srk",
    ]);
    for r in v["results"].as_array().unwrap() {
        let dh = r["delta_h_j_kg"]["value"].as_f64().unwrap();
        assert!(dh.abs() < 1e-6, "{dh}");
        assert!(r["delta_t_k"]["value"].as_f64().unwrap() < -20.0);
        assert!(r["delta_t_k"]["ideal"].as_f64().unwrap().abs() < 1e-9);
    }
    assert!(err.contains("caution:"));
}

#[test]
fn relief_warns_outside_the_z_range_and_not_inside_it() {
    let (v, code, err) = run_json(&[
        "relief", "--fluid", "ethylene", "-t", "30 degC", "-p", "60 bar", "-m", "pr",
    ]);
    assert_eq!(code, Some(3));
    assert_eq!(v["results"][0]["z_outside_range"], true);
    assert!(err.contains("outside 0.8-1.1"));
    let (v, code, _) = run_json(&[
        "relief",
        "--fluid",
        "nitrogen",
        "-t",
        "300 K",
        "-p",
        "10 bar",
        "-m",
        "pr,srk,ideal",
    ]);
    assert_eq!(code, Some(0));
    for r in v["results"].as_array().unwrap() {
        assert_eq!(r["z_outside_range"], false);
        let k = r["isentropic_exponent"]["value"].as_f64().unwrap();
        assert!(k > 1.3 && k < 1.5, "{k}");
    }
}

#[test]
fn relief_gives_the_critical_pressure_ratio_and_the_api_520_coefficient() {
    // Argon is monatomic: k = 5/3 exactly for the ideal gas, whose critical pressure ratio is
    // (3/4)^2.5 = 0.48714 and flow function sqrt(5/3 (3/4)^4) = 0.72618 (computed by hand);
    // API 520 Part I tabulates C = 378 (US units) near k = 1.66 (recalled from memory).
    let (v, _, err) = run_json(&[
        "relief", "--fluid", "argon", "-t", "300 K", "-p", "1 bar", "-m", "ideal,pr",
    ]);
    let ideal = &v["results"][0];
    assert_eq!(ideal["model"], "ideal", "{err}");
    let ratio = ideal["critical_pressure_ratio"]["value"].as_f64().unwrap();
    assert!((ratio - 0.75f64.powf(2.5)).abs() < 1e-9, "{ratio}");
    let c = ideal["sizing_coefficient_c"]["value"].as_f64().unwrap();
    assert!(
        (c - 0.03948 * (5.0 / 3.0 * 0.75f64.powi(4)).sqrt()).abs() < 1e-9,
        "{c}"
    );
    assert!((c * 520.0 / 0.03948 - 378.0).abs() < 1.0, "{c}");
    // At 1 bar PR's real-gas k, and so both, are within 0.2 % of the ideal gas's.
    let pr = &v["results"][1];
    let dev = pr["critical_pressure_ratio"]["ideal_error_pct"]
        .as_f64()
        .unwrap();
    assert!(dev.abs() < 0.2, "{dev}");
    // The terminal table says what C is for.
    let out = zf()
        .args([
            "relief", "--fluid", "argon", "-t", "300 K", "-p", "1 bar", "-m", "pr",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("C (API 520, SI)") && text.contains("kPa abs"),
        "{text}"
    );
}

#[test]
fn bad_process_and_relief_input_is_refused() {
    zf().args([
        "process",
        "--fluid",
        "methane",
        "--path",
        "isobaric",
        "-t",
        "300 K",
        "-p",
        "10 bar",
        "--to-pressure",
        "5 bar",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("--to-temperature"));
    // Propane at 20 degC and 20 bar is a liquid: gas relief inputs do not apply.
    zf().args([
        "relief", "--fluid", "propane", "-t", "20 degC", "-p", "20 bar", "-m", "pr",
    ])
    .assert()
    .code(2)
    .stderr(predicate::str::contains("relieving conditions"));
}
