//! Trust at the edges, end to end: each case here once answered wrongly or unsafely (a
//! mislabelled error, a unit read a billion times too large, a run aborted by one model, a
//! steam enthalpy on the wrong zero). Each test states the outside fact it checks against.

use assert_cmd::Command;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

/// Runs with `--format json`, expecting exit 0 or 3; returns (JSON, exit code, stderr).
fn run_json(args: &[&str]) -> (Value, i32, String) {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    let code = out.status.code().unwrap_or(-1);
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    assert!(matches!(code, 0 | 3), "{args:?}: exit {code}: {err}");
    (serde_json::from_slice(&out.stdout).unwrap(), code, err)
}

fn result<'a>(v: &'a Value, model: &str) -> &'a Value {
    v["results"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["model"] == model)
        .unwrap_or_else(|| panic!("no result for {model}: {v}"))
}

/// CODATA 2018 molar gas constant, J/(mol K).
const R: f64 = 8.314_462_618;

#[test]
fn the_ideal_gas_error_with_density_given_is_the_error_in_pressure() {
    // CO2 at 40 degC and 600 kg/m3: the ideal gas gives P = rho R T / M = 355 bar, against
    // 96.7 bar from the reference equation; the ideal gas over-predicts the pressure by
    // (355 / 96.7 - 1) = 267 %. The row once printed Z - 1 (-72.75 %) under that label.
    let (v, _, _) = run_json(&[
        "state",
        "--fluid",
        "co2",
        "-t",
        "40 degC",
        "-d",
        "600 kg/m3",
        "-m",
        "reference",
    ]);
    let r = result(&v, "reference");
    assert_eq!(r["ideal_gas_deviation_of"], "pressure");
    let p_model = r["pressure_pa"].as_f64().unwrap();
    let m = 0.044_009_5; // kg/mol, CO2 (Span & Wagner 1996)
    let p_ideal = 600.0 / m * R * 313.15;
    let expected = 100.0 * (p_ideal / p_model - 1.0);
    let got = r["ideal_gas_deviation_pct"].as_f64().unwrap();
    assert!((got - expected).abs() < 0.05, "{got} vs {expected}");
    assert!(got > 260.0, "{got}");
}

#[test]
fn one_model_that_cannot_answer_never_aborts_a_run_of_several() {
    // Methane at 15 degC and 250 bar: the truncated virial equation has no density root
    // there (it holds to about half the critical density, common practice); Lee-Kesler and
    // the reference equation answer. The run once ended with exit 1.
    let (v, code, err) = run_json(&[
        "state",
        "--fluid",
        "methane",
        "-t",
        "15 degC",
        "-p",
        "250 bar",
        "-m",
        "virial,lk,reference",
    ]);
    assert_eq!(code, 3, "{err}");
    let models: Vec<&str> = v["results"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| r["model"].as_str().unwrap())
        .collect();
    assert_eq!(models, ["lk", "reference"]);
    assert!(err.contains("virial left out"), "{err}");

    // Saturation just below methane's triple point (90.6941 K, Setzmann & Wagner 1991): the
    // reference formulations refuse, the cubics answer; `saturation -m all` once aborted
    // with exit 2 on the first refusal.
    let (v, code, err) = run_json(&[
        "saturation",
        "--fluid",
        "methane",
        "-t",
        "90 K",
        "-m",
        "all",
    ]);
    assert_eq!(code, 3, "{err}");
    assert!(result(&v, "pr")["pressure_pa"].as_f64().unwrap() > 0.0);
    assert!(err.contains("reference left out"), "{err}");
}

#[test]
fn a_millipascal_is_not_a_megapascal_and_is_flagged() {
    // SI brochure (BIPM, 9th ed., 2019, table 7): m is milli. "1 mPa" was read as 1 MPa.
    let (v, code, err) = run_json(&[
        "state", "--fluid", "methane", "-t", "15 degC", "-p", "1 mPa", "-m", "ideal",
    ]);
    let p = result(&v, "ideal")["pressure_pa"].as_f64().unwrap();
    assert!((p - 1e-3).abs() < 1e-12, "{p}");
    assert_eq!(code, 3, "an implausible unit is flagged: {err}");
    assert!(err.contains("1e-3 Pa"), "{err}");
    let (v, code, _) = run_json(&[
        "state", "--fluid", "methane", "-t", "15 degC", "-p", "1 MPa", "-m", "ideal",
    ]);
    let p = result(&v, "ideal")["pressure_pa"].as_f64().unwrap();
    assert!((p - 1e6).abs() < 1e-6, "{p}");
    assert_eq!(code, 0);
}

#[test]
fn the_trades_flow_spellings_mean_the_same_flow() {
    // MMscfd: million standard cubic feet per day at 60 degF and 14.696 psia (common
    // practice); written MMscfd, MMSCFD or mmscfd.
    let mass = |unit: &str| {
        let (v, _, _) = run_json(&[
            "flow", "--fluid", "methane", "--flow", unit, "-t", "40 degC", "-p", "60 bar", "-m",
            "pr",
        ]);
        v["results"].to_string()
    };
    let a = mass("2 MMscfd");
    assert_eq!(a, mass("2 MMSCFD"));
    assert_eq!(a, mass("2 mmscfd"));
}
