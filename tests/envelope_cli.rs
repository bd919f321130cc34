//! `zfactor envelope` end to end: JSON names, the critical point between the dew and bubble
//! branches, the chart files (valid SVG and PNG, never overwritten without --force), the
//! pure-fluid vapour-pressure curve against the definition of the acentric factor, and the
//! refusals.

use assert_cmd::Command;
use serde_json::Value;

/// A natural-gas-like feed (composition chosen for the test).
const GAS: &str = "methane=0.8,ethane=0.1,propane=0.06,n-butane=0.04";

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn json(args: &[&str]) -> Value {
    let out = zf().args(args).args(["--format", "json"]).output().unwrap();
    // 0: success; 3: success with warnings on stderr (README, exit codes).
    assert!(
        matches!(out.status.code(), Some(0) | Some(3)),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn f(v: &Value) -> f64 {
    v.as_f64().unwrap_or_else(|| panic!("not a number: {v}"))
}

#[test]
fn critical_point_lies_between_the_dew_and_bubble_branches() {
    let r = json(&["envelope", "--mix", GAS]);
    assert_eq!(r["kind"], "mixture");
    assert_eq!(r["model"], "pr");
    assert_eq!(r["stop"], "complete");
    let pts = r["points"].as_array().unwrap();
    assert!(pts.len() > 20);
    for key in [
        "temperature_k",
        "pressure_pa",
        "liquid_molar_density_mol_m3",
        "vapor_molar_density_mol_m3",
        "liquid_mass_density_kg_m3",
        "vapor_mass_density_kg_m3",
    ] {
        assert!(f(&pts[0][key]) > 0.0, "{key}");
    }
    // Tracing order: the dew branch, then the bubble branch, switching once.
    let branches: Vec<&str> = pts.iter().map(|p| p["branch"].as_str().unwrap()).collect();
    let k = branches.iter().position(|b| *b == "bubble").unwrap();
    assert!(k > 0 && branches[..k].iter().all(|b| *b == "dew"));
    assert!(branches[k..].iter().all(|b| *b == "bubble"));
    // The critical point lies between the last dew point and the first bubble point of the
    // trace, where the liquid and vapour densities meet (the K-values pass through 1:
    // Michelsen, Fluid Phase Equilib. 4 (1980) 1-10).
    let c = &r["critical_point"];
    let (tc, pc) = (f(&c["temperature_k"]), f(&c["pressure_pa"]));
    let (a, b) = (&pts[k - 1], &pts[k]);
    let between = |x: f64, p: f64, q: f64| x >= p.min(q) && x <= p.max(q);
    assert!(between(tc, f(&a["temperature_k"]), f(&b["temperature_k"])));
    assert!(between(pc, f(&a["pressure_pa"]), f(&b["pressure_pa"])));
    // On both sides of it the two phases' densities are close and on the right side of
    // each other.
    for p in [a, b] {
        let (l, v) = (
            f(&p["liquid_molar_density_mol_m3"]),
            f(&p["vapor_molar_density_mol_m3"]),
        );
        assert!(l > v && l / v < 2.0, "{l} {v}");
    }
    // The extremes bound every point.
    let ccb = f(&r["cricondenbar"]["pressure_pa"]);
    let cct = f(&r["cricondentherm"]["temperature_k"]);
    assert!(pc <= ccb && tc <= cct);
    for p in pts {
        assert!(f(&p["pressure_pa"]) <= ccb * (1.0 + 1e-9));
        assert!(f(&p["temperature_k"]) <= cct * (1.0 + 1e-9));
    }
}

/// PNG signature (PNG specification, ISO/IEC 15948, section 5.2).
const PNG_MAGIC: [u8; 8] = [0x89, b'P', b'N', b'G', 0x0d, 0x0a, 0x1a, 0x0a];

#[test]
fn charts_are_valid_and_not_overwritten_without_force() {
    let dir = tempfile::tempdir().unwrap();
    let svg = dir.path().join("env.svg");
    let png = dir.path().join("env.png");
    let svg_s = svg.to_str().unwrap();
    let png_s = png.to_str().unwrap();
    zf().args(["envelope", "--mix", GAS, "--chart", svg_s])
        .assert()
        .success();
    zf().args(["envelope", "--mix", GAS, "--chart", png_s])
        .assert()
        .success();
    let text = std::fs::read_to_string(&svg).unwrap();
    assert!(text.contains("<svg") && text.trim_end().ends_with("</svg>"));
    assert!(text.contains("cricondenbar") && text.contains("temperature T [K]"));
    let bytes = std::fs::read(&png).unwrap();
    assert_eq!(bytes[..8], PNG_MAGIC);
    // An existing file is refused (exit 2, nothing printed) and left as it was.
    for path in [svg_s, png_s] {
        let before = std::fs::read(path).unwrap();
        let out = zf()
            .args(["envelope", "--mix", GAS, "--chart", path])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(2));
        assert!(out.stdout.is_empty());
        assert!(String::from_utf8_lossy(&out.stderr).contains("--force"));
        assert_eq!(std::fs::read(path).unwrap(), before);
    }
    zf().args(["envelope", "--mix", GAS, "--chart", svg_s, "--force"])
        .assert()
        .success();
    // No temporary file is left behind.
    assert_eq!(std::fs::read_dir(dir.path()).unwrap().count(), 2);
}

/// ln P interpolated linearly in 1/T between the points of the curve that bracket `t`.
fn p_at(points: &[Value], t: f64) -> f64 {
    for w in points.windows(2) {
        let (ta, tb) = (f(&w[0]["temperature_k"]), f(&w[1]["temperature_k"]));
        if ta <= t && t <= tb {
            let (la, lb) = (f(&w[0]["pressure_pa"]).ln(), f(&w[1]["pressure_pa"]).ln());
            let s = (1.0 / t - 1.0 / ta) / (1.0 / tb - 1.0 / ta);
            return (la + s * (lb - la)).exp();
        }
    }
    panic!("{t} K is not on the curve");
}

#[test]
fn pure_fluid_curve_meets_the_acentric_factor_definition() {
    // Pitzer's acentric factor (K. S. Pitzer et al., J. Am. Chem. Soc. 77 (1955) 3433):
    // omega = -log10(Psat/Pc) at Tr = 0.7 - 1, so Psat(0.7 Tc) = Pc 10^-(1 + omega). The
    // Peng-Robinson alpha function was fitted to reproduce vapour pressures
    // (Peng & Robinson, Ind. Eng. Chem. Fundam. 15 (1976) 59), so within 1 %.
    for fluid in [
        "methane", "ethane", "propane", "n-butane", "nitrogen", "n-hexane",
    ] {
        let r = json(&["envelope", "--fluid", fluid, "-m", "pr"]);
        assert_eq!(r["kind"], "pure");
        let rec = json(&["fluids", fluid]);
        let omega = f(&rec["omega"]);
        let c = &r["critical_point"];
        let (tc, pc) = (f(&c["temperature_k"]), f(&c["pressure_pa"]));
        // The model's critical point is the component's (critical conditions of the cubic).
        assert!((tc / f(&rec["tc_k"]) - 1.0).abs() < 1e-9);
        assert!((pc / f(&rec["pc_pa"]) - 1.0).abs() < 1e-9);
        let pts = r["points"].as_array().unwrap();
        assert!(pts.iter().all(|p| p["branch"] == "saturation"));
        let p = p_at(pts, 0.7 * tc);
        let expected = pc * 10f64.powf(-(1.0 + omega));
        assert!(
            (p / expected - 1.0).abs() < 0.01,
            "{fluid}: {p} Pa vs {expected} Pa"
        );
        // The curve rises monotonically up to the critical point.
        for w in pts.windows(2) {
            assert!(f(&w[1]["pressure_pa"]) > f(&w[0]["pressure_pa"]));
        }
        assert!(f(&pts[pts.len() - 1]["pressure_pa"]) < pc);
    }
}

#[test]
fn reference_curve_starts_at_the_triple_point() {
    // Carbon dioxide, Span & Wagner (1996): triple point 216.592 K, 0.51795 MPa; critical
    // point 304.1282 K, 7.3773 MPa (from memory of the paper's Table 3 and section 2).
    let r = json(&["envelope", "--fluid", "co2", "-m", "reference"]);
    let pts = r["points"].as_array().unwrap();
    let first = &pts[0];
    assert!((f(&first["temperature_k"]) - 216.592).abs() < 1e-3);
    let p3 = f(&first["pressure_pa"]);
    assert!((p3 / 0.51795e6 - 1.0).abs() < 1e-3, "{p3}");
    let c = &r["critical_point"];
    assert!((f(&c["temperature_k"]) - 304.1282).abs() < 1e-3);
    assert!((f(&c["pressure_pa"]) / 7.3773e6 - 1.0).abs() < 1e-4);
}

#[test]
fn pv_chart_of_a_pure_fluid() {
    let dir = tempfile::tempdir().unwrap();
    let pt = dir.path().join("psat.png");
    let pv = dir.path().join("dome.png");
    let r = json(&[
        "envelope",
        "--fluid",
        "propane",
        "--chart",
        pt.to_str().unwrap(),
        "--pv",
        pv.to_str().unwrap(),
    ]);
    assert_eq!(r["charts"].as_array().unwrap().len(), 2);
    for path in [&pt, &pv] {
        assert_eq!(std::fs::read(path).unwrap()[..8], PNG_MAGIC);
    }
    // Isotherms below, at and above Tc; below Tc flat across the dome at the vapour
    // pressure (Maxwell's equal-area construction, the stable isotherm).
    let iso = r["isotherms"].as_array().unwrap();
    let tc = f(&r["critical_point"]["temperature_k"]);
    let trs: Vec<f64> = iso.iter().map(|i| f(&i["temperature_k"]) / tc).collect();
    assert!(trs.iter().any(|&x| x < 1.0) && trs.iter().any(|&x| x > 1.0));
    assert!(trs.iter().any(|&x| (x - 1.0).abs() < 1e-12));
    let low = &iso[0];
    let ps: Vec<f64> = low["pressure_pa"]
        .as_array()
        .unwrap()
        .iter()
        .map(f)
        .collect();
    let psat = p_at(r["points"].as_array().unwrap(), f(&low["temperature_k"]));
    let flat = ps
        .iter()
        .filter(|&&p| (p / psat - 1.0).abs() < 1e-3)
        .count();
    assert!(flat > 10, "{flat} points on the tie line");
}

fn refused(args: &[&str], expect: &str) {
    let out = zf().args(args).output().unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(2), "{args:?}: {err}");
    assert!(out.stdout.is_empty(), "{args:?}: partial output");
    assert!(err.contains(expect), "{args:?}: {err}");
}

#[test]
fn bad_input_is_refused_with_exit_code_2() {
    let dir = tempfile::tempdir().unwrap();
    let pv = dir.path().join("dome.svg");
    refused(
        &["envelope", "--mix", GAS, "--pv", pv.to_str().unwrap()],
        "pure fluid",
    );
    assert!(!pv.exists());
    let bad = dir.path().join("env.jpg");
    refused(
        &["envelope", "--mix", GAS, "--chart", bad.to_str().unwrap()],
        ".svg or .png",
    );
    refused(&["envelope", "--mix", GAS, "-m", "pr,srk"], "one model");
    refused(
        &["envelope", "--mix", GAS, "--start-pressure", "200 bar"],
        "above the cricondenbar",
    );
    refused(
        &["envelope", "--mix", GAS, "-m", "dak"],
        "no Helmholtz energy",
    );
    refused(
        &["envelope", "--fluid", "methane", "-m", "ideal"],
        "never condenses",
    );
    refused(
        &["envelope", "--mix", "methane=0.9,ethane=0.0,propane=0.1"],
        "zero",
    );
}
