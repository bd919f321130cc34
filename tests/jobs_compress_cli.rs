//! `zfactor compress` end to end: the scriptable JSON fields, the energy balance of the
//! reported numbers, flow conversions and refusals of bad input.

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

fn f(v: &Value) -> f64 {
    v.as_f64().unwrap_or_else(|| panic!("not a number: {v}"))
}

#[test]
fn every_model_gives_the_fixed_fields() {
    let (v, err) = run_json(&[
        "compress",
        "--fluid",
        "methane",
        "--suction-pressure",
        "20 bar",
        "--suction-temperature",
        "300 K",
        "--discharge-pressure",
        "60 bar",
        "--isentropic-efficiency",
        "0.8",
        "--model",
        "ideal,vdw,rk,srk,pr,pr78",
    ]);
    let res = v["results"].as_array().unwrap();
    assert_eq!(res.len(), 6);
    for r in res {
        assert!(r["model"].is_string());
        let t2 = f(&r["discharge_temperature_k"]);
        assert!(t2 > 300.0 && t2 < 500.0, "{t2}");
        let w = f(&r["specific_work_j_kg"]);
        // Energy balance: work = isentropic head / eta_s (definition of eta_s).
        let hs = f(&r["isentropic_head_j_kg"]["value"]);
        assert!((w - hs / 0.8).abs() <= 1e-9 * w, "{w} vs {}", hs / 0.8);
        // The path head equals eta_p (h2 - h1), and the quadrature of v dP agrees.
        let hp = f(&r["polytropic_head_path_j_kg"]["value"]);
        let ep = f(&r["polytropic_efficiency"]);
        assert!((hp - ep * w).abs() <= 1e-8 * w);
        assert!((f(&r["head_quadrature_j_kg"]) / hp - 1.0).abs() < 1e-6);
    }
    assert!(err.contains("caution:"));
}

#[test]
fn power_and_actual_flow_follow_from_the_mass_flow() {
    let (v, _) = run_json(&[
        "compress",
        "--mix",
        "methane=0.9,ethane=0.1",
        "--suction-pressure",
        "30 barg",
        "--suction-temperature",
        "25 degC",
        "--discharge-pressure",
        "80 barg",
        "--polytropic-efficiency",
        "0.78",
        "--flow",
        "36 t/h",
        "-m",
        "pr",
    ]);
    let r = &v["results"][0];
    let q = f(&r["mass_flow_kg_s"]["value"]);
    assert!((q - 10.0).abs() < 1e-12, "36 t/h is 10 kg/s exactly");
    let w = f(&r["specific_work_j_kg"]);
    assert!((f(&r["power_w"]["value"]) - q * w).abs() <= 1e-12 * q * w);
    let rho1 = f(&r["suction"]["mass_density_kg_m3"]);
    assert!((f(&r["actual_inlet_flow_m3_s"]["value"]) - q / rho1).abs() <= 1e-12 * q / rho1);
}

#[test]
fn table_output_has_both_polytropic_heads_and_the_caution() {
    zf().args([
        "compress",
        "--fluid",
        "co2",
        "--suction-pressure",
        "10 bar",
        "--suction-temperature",
        "40 degC",
        "--discharge-pressure",
        "30 bar",
        "--polytropic-efficiency",
        "0.8",
        "-m",
        "pr,srk",
    ])
    .assert()
    .success()
    .stdout(predicate::str::contains("polytropic head, Schultz"))
    .stdout(predicate::str::contains("polytropic head, path"))
    .stdout(predicate::str::contains("licensed engineer"));
}

#[test]
fn bad_input_is_refused_with_code_2() {
    let base = [
        "compress",
        "--fluid",
        "methane",
        "--suction-pressure",
        "20 bar",
        "--suction-temperature",
        "300 K",
    ];
    zf().args(base)
        .args([
            "--discharge-pressure",
            "10 bar",
            "--isentropic-efficiency",
            "0.8",
        ])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("not above --suction-pressure"));
    for e in ["80", "0", "-0.5", "1.2"] {
        zf().args(base)
            .args([
                "--discharge-pressure",
                "40 bar",
                "--isentropic-efficiency",
                e,
            ])
            .assert()
            .code(2)
            .stderr(predicate::str::contains("at most 1"));
    }
    zf().args(base)
        .args([
            "--discharge-pressure",
            "40 bar",
            "--polytropic-efficiency",
            "0.8",
        ])
        .args(["--flow", "100 furlongs/h"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("unknown flow unit"));
}
