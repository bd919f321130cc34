//! A mixture's compression factor at the ISO 6976 reference conditions by the standard's
//! summation method, as a reference in `compare` and beside the models in `flow`.
//!
//! Outside values: ISO 6976:1995 Table 2 summation factors sqrt(b) at 0, 15 and 20 degC
//! (recalled from memory, as in the project's reference collection): methane 0.0490,
//! 0.0447, 0.0436; ethane 0.1000, 0.0922, 0.0894; nitrogen 0.0224, 0.0173, 0.0170; CO2
//! 0.0819, 0.0748, 0.0728. Z_mix = 1 - (sum x_i sqrt(b_i))^2 (ISO 6976:1995, clause 6).

use assert_cmd::Command;
use serde_json::Value;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

const MIX: &str = "methane=0.9,ethane=0.05,nitrogen=0.03,co2=0.02";

/// Z_mix by hand at the three temperatures.
fn by_hand() -> [f64; 3] {
    let x = [0.9, 0.05, 0.03, 0.02];
    let sqrt_b = [
        [0.0490, 0.1000, 0.0224, 0.0819],
        [0.0447, 0.0922, 0.0173, 0.0748],
        [0.0436, 0.0894, 0.0170, 0.0728],
    ];
    sqrt_b.map(|b| {
        let s: f64 = x.iter().zip(b).map(|(xi, bi)| xi * bi).sum();
        1.0 - s * s
    })
}

#[test]
fn a_mixture_is_compared_with_the_summation_method() {
    let out = zf()
        .args([
            "compare",
            "--mix",
            MIX,
            "--reference",
            "iso6976",
            "-m",
            "srk,pr",
        ])
        .args(["-f", "json"])
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    assert!(v["reference"]["citation"]
        .as_str()
        .unwrap()
        .contains("summation method"));
    let points = v["points"].as_array().unwrap();
    assert_eq!(points.len(), 3);
    for (p, want) in points.iter().zip(by_hand()) {
        assert!((p["pressure_pa"].as_f64().unwrap() - 101_325.0).abs() < 1e-9);
        let z = p["reference_z"].as_f64().unwrap();
        assert!((z - want).abs() < 1e-12, "{z} vs {want}");
    }
    // A component without a factor: refused, and named.
    let out = zf()
        .args([
            "compare",
            "--mix",
            "methane=0.9,n-pentane=0.1",
            "--reference",
            "iso6976",
        ])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("n-pentane"));
}

#[test]
fn flow_shows_the_summation_value_beside_the_models() {
    let out = zf()
        .args([
            "flow",
            "--mix",
            MIX,
            "--flow",
            "10 MMscfd",
            "-m",
            "pr",
            "-f",
            "json",
        ])
        .output()
        .unwrap();
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    let s = &v["iso6976_summation"]["values"];
    for (k, want) in by_hand().iter().enumerate() {
        assert!((s[k]["z"].as_f64().unwrap() - want).abs() < 1e-12);
    }
    let out = zf()
        .args([
            "flow",
            "--mix",
            "methane=0.9,n-pentane=0.1",
            "--flow",
            "1 kg/s",
            "-m",
            "pr",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("ISO 6976 summation: not available"), "{text}");
}
