//! `zfactor flash` end to end: JSON names, the material balance of the reported split, equal
//! fugacities of the reported phases recomputed through the library, consistency of the
//! (T, P), (P, h), (P, s) and bubble/dew modes with each other, and the refusals.
//!
//! Sources of the checks: the material balance z_i = (1 - beta) x_i + beta y_i and the
//! equilibrium conditions ln(x_i phi_i^L) = ln(y_i phi_i^V) at equal T and P (M. L. Michelsen,
//! Fluid Phase Equilib. 9 (1982) 21-40) are identities every reported split must satisfy.

use assert_cmd::Command;
use serde_json::Value;

/// A natural-gas-like feed that splits at 220 K and 30 bar (composition chosen for the test).
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

/// Mole fractions of a phase, in feed order.
fn comp(phase: &Value) -> Vec<f64> {
    phase["composition"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| f(&c["mole_fraction"]))
        .collect()
}

fn feed_z(report: &Value) -> Vec<f64> {
    report["composition"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| f(&c["mole_fraction"]))
        .collect()
}

/// The model as the binary builds it, for recomputing fugacities through eos::Model.
fn model(id: &str, mix: &str) -> zfactor::models::BuiltModel {
    let feed = zfactor::feed::parse_mix(mix, zfactor::cli::Basis::Mole, false).unwrap();
    zfactor::models::build(id, &feed).unwrap()
}

/// max_i |ln(y_i phi_i(T, rho_v, y)) - ln(x_i phi_i(T, rho_l, x))| with the library's ln phi.
fn fugacity_gap(m: &dyn eos::Model, t: f64, rho_v: f64, y: &[f64], rho_l: f64, x: &[f64]) -> f64 {
    let n = x.len();
    let (mut lv, mut ll) = (vec![0.0; n], vec![0.0; n]);
    m.ln_phi(t, rho_v, y, &mut lv);
    m.ln_phi(t, rho_l, x, &mut ll);
    (0..n)
        .map(|i| ((y[i].ln() + lv[i]) - (x[i].ln() + ll[i])).abs())
        .fold(0.0, f64::max)
}

/// Pressure of a phase from the model, P = rho R T Z(T, rho, x).
fn pressure(m: &dyn eos::Model, t: f64, rho: f64, x: &[f64]) -> f64 {
    rho * eos::constants::R * t * m.residual(t, rho, x).z()
}

#[test]
fn two_phase_json_names_balance_and_fugacities() {
    let r = json(&[
        "flash", "--mix", GAS, "-t", "220 K", "-p", "30 bar", "-m", "pr,srk",
    ]);
    assert_eq!(r["input"]["mode"], "T,P");
    let z = feed_z(&r);
    let results = r["results"].as_array().unwrap();
    assert_eq!(results.len(), 2);
    for res in results {
        let id = res["model"].as_str().unwrap();
        assert_eq!(res["phase"], "two-phase", "{id}");
        let beta = f(&res["vapor_fraction"]);
        assert!(beta > 0.0 && beta < 1.0);
        let phases = res["phases"].as_array().unwrap();
        assert_eq!(phases.len(), 2);
        assert_eq!(phases[0]["phase"], "vapor");
        assert_eq!(phases[1]["phase"], "liquid");
        for ph in phases {
            for key in [
                "amount",
                "mass_amount",
                "z",
                "molar_density_mol_m3",
                "mass_density_kg_m3",
                "molar_mass_kg_mol",
            ] {
                assert!(f(&ph[key]).is_finite(), "{id} {key}");
            }
            assert_eq!(ph["composition"][0]["component"], "methane");
        }
        let (y, x) = (comp(&phases[0]), comp(&phases[1]));
        // Material balance z_i = (1 - beta) x_i + beta y_i (identity), to 1e-12.
        for i in 0..z.len() {
            let b = (1.0 - beta) * x[i] + beta * y[i];
            assert!(
                (b - z[i]).abs() <= 1e-12,
                "{id} component {i}: {b} vs {}",
                z[i]
            );
        }
        assert!((f(&phases[0]["amount"]) - beta).abs() <= 1e-15);
        // Mass balance: the mass vapour fraction is beta M_V / M (identity).
        let mm = f(&res["molar_mass_kg_mol"]);
        let bm = beta * f(&phases[0]["molar_mass_kg_mol"]) / mm;
        assert!((f(&res["vapor_mass_fraction"]) - bm).abs() <= 1e-12);
        // Equal fugacities of the reported phases, through eos::Model::ln_phi, to 1e-9; both
        // phases at the reported pressure.
        let built = model(id, GAS);
        let m = built.helmholtz().unwrap();
        let t = f(&res["temperature_k"]);
        let p = f(&res["pressure_pa"]);
        let (rv, rl) = (
            f(&phases[0]["molar_density_mol_m3"]),
            f(&phases[1]["molar_density_mol_m3"]),
        );
        let gap = fugacity_gap(m, t, rv, &y, rl, &x);
        assert!(gap <= 1e-9, "{id}: fugacity gap {gap:e}");
        for rho in [(rv, &y), (rl, &x)] {
            let pp = pressure(m, t, rho.0, rho.1);
            assert!((pp / p - 1.0).abs() <= 1e-9, "{id}: P {pp} vs {p}");
        }
        assert!(rl > rv);
    }
}

#[test]
fn single_phase_is_named_and_has_no_vapour_fraction() {
    let r = json(&["flash", "--mix", GAS, "-t", "320 K", "-p", "50 bar"]);
    let res = &r["results"][0];
    let name = res["phase"].as_str().unwrap();
    assert!(
        ["gas", "supercritical", "vapor", "liquid"].contains(&name),
        "{name}"
    );
    assert!(res["vapor_fraction"].is_null());
    let phases = res["phases"].as_array().unwrap();
    assert_eq!(phases.len(), 1);
    assert!((f(&phases[0]["amount"]) - 1.0).abs() <= 1e-15);
    // One phase: its composition is the feed's.
    let (z, c) = (feed_z(&r), comp(&phases[0]));
    for i in 0..z.len() {
        assert!((z[i] - c[i]).abs() <= 1e-15);
    }
}

#[test]
fn ph_and_ps_flashes_return_to_the_tp_state() {
    // The (P, h) and (P, s) flashes at the h and s of a (T, P) flash find that T again
    // (h and s increase strictly with T at fixed P and feed).
    let tp = json(&["flash", "--mix", GAS, "-t", "220 K", "-p", "30 bar"]);
    let res = &tp["results"][0];
    let (h, s) = (f(&res["enthalpy_j_mol"]), f(&res["entropy_j_mol_k"]));
    let beta = f(&res["vapor_fraction"]);
    let h_arg = format!("{h:e} J/mol");
    let s_arg = format!("{s:e} J/(mol K)");
    for (flag, val, mode) in [
        ("--enthalpy", h_arg.as_str(), "P,h"),
        ("--entropy", s_arg.as_str(), "P,s"),
    ] {
        let r = json(&["flash", "--mix", GAS, "-p", "30 bar", flag, val]);
        assert_eq!(r["input"]["mode"], mode);
        let res = &r["results"][0];
        assert_eq!(res["phase"], "two-phase");
        let t = f(&res["temperature_k"]);
        assert!((t - 220.0).abs() < 1e-6, "{mode}: {t}");
        assert!((f(&res["vapor_fraction"]) - beta).abs() < 1e-6);
    }
    // The same enthalpy per kilogram gives the same state.
    let mm = f(&res["molar_mass_kg_mol"]);
    let per_kg = format!("{:e} kJ/kg", h / mm / 1e3);
    let r = json(&["flash", "--mix", GAS, "-p", "30 bar", "--enthalpy", &per_kg]);
    let t = f(&r["results"][0]["temperature_k"]);
    assert!((t - 220.0).abs() < 1e-6, "{t}");
}

#[test]
fn bubble_and_dew_points_bound_the_split() {
    let model_pr = model("pr", GAS);
    let m = model_pr.helmholtz().unwrap();
    for (flag, name, vf) in [
        ("--bubble-pressure", "bubble-point", 0.0),
        ("--dew-pressure", "dew-point", 1.0),
    ] {
        let r = json(&["flash", "--mix", GAS, "-t", "220 K", flag]);
        let res = &r["results"][0];
        assert_eq!(res["phase"], name);
        assert!((f(&res["vapor_fraction"]) - vf).abs() <= 0.0);
        let t = f(&res["temperature_k"]);
        let p = f(&res["pressure_pa"]);
        let phases = res["phases"].as_array().unwrap();
        let (y, x) = (comp(&phases[0]), comp(&phases[1]));
        let gap = fugacity_gap(
            m,
            t,
            f(&phases[0]["molar_density_mol_m3"]),
            &y,
            f(&phases[1]["molar_density_mol_m3"]),
            &x,
        );
        assert!(gap <= 1e-9, "{name}: fugacity gap {gap:e}");
        // A (T, P) flash just inside the envelope splits with almost all feed on the side of
        // the saturation point; just outside it is one phase (Michelsen 1982: the
        // saturation point is where the stability test changes sign).
        let (inside, outside) = if vf < 0.5 {
            (p * 0.999, p * 1.001)
        } else {
            (p * 1.001, p * 0.999)
        };
        let fl = |pp: f64| {
            json(&[
                "flash",
                "--mix",
                GAS,
                "-t",
                "220 K",
                "-p",
                &format!("{pp} Pa"),
            ])
        };
        let a = fl(inside);
        assert_eq!(a["results"][0]["phase"], "two-phase", "{name}");
        let b = f(&a["results"][0]["vapor_fraction"]);
        assert!((b - vf).abs() < 0.02, "{name}: beta {b}");
        let o = fl(outside);
        assert_ne!(o["results"][0]["phase"], "two-phase", "{name}");
    }
    // At the dew temperature of a pressure, the dew pressure of that temperature is the
    // same pressure (the same point reached from the other variable).
    let r = json(&["flash", "--mix", GAS, "-p", "30 bar", "--dew-temperature"]);
    let t = f(&r["results"][0]["temperature_k"]);
    let r2 = json(&[
        "flash",
        "--mix",
        GAS,
        "-t",
        &format!("{t} K"),
        "--dew-pressure",
    ]);
    let p = f(&r2["results"][0]["pressure_pa"]);
    assert!((p / 30e5 - 1.0).abs() < 1e-8, "{p}");
}

/// Runs a command that must be refused as bad input: exit code 2, a message on stderr that
/// contains `expect`, nothing on stdout.
fn refused(args: &[&str], expect: &str) {
    let out = zf().args(args).output().unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(2), "{args:?}: {err}");
    assert!(out.stdout.is_empty(), "{args:?}: partial output");
    assert!(err.contains(expect), "{args:?}: {err}");
}

#[test]
fn bad_input_is_refused_with_exit_code_2() {
    refused(
        &["flash", "--mix", GAS, "-p", "300 bar", "--dew-temperature"],
        "above the cricondenbar",
    );
    refused(
        &[
            "flash",
            "--mix",
            GAS,
            "-p",
            "300 bar",
            "--dew-temperature",
            "-f",
            "json",
        ],
        "cricondenbar",
    );
    refused(
        &["flash", "--mix", GAS, "-t", "400 K", "--dew-pressure"],
        "above the cricondentherm",
    );
    refused(
        &[
            "flash",
            "--mix",
            "methane=0.5,ethane=0,propane=0.5",
            "-t",
            "200 K",
            "-p",
            "10 bar",
        ],
        "fraction of ethane is zero",
    );
    // Triple points: methane 90.694 K, nitrogen 63.151 K (the fluids table).
    refused(
        &[
            "flash",
            "--mix",
            "methane=0.5,nitrogen=0.5",
            "-t",
            "50 K",
            "-p",
            "10 bar",
        ],
        "below the triple point of every component",
    );
    refused(
        &["flash", "--fluid", "methane", "-t", "150 K", "-p", "10 bar"],
        "pure fluid",
    );
    refused(
        &[
            "flash", "--mix", GAS, "-t", "220 K", "-p", "30 bar", "-m", "lk",
        ],
        "no Helmholtz energy",
    );
    refused(
        &["flash", "--mix", GAS, "-p", "30 bar", "--enthalpy", "-7 kJ"],
        "\"-7 kJ\"",
    );
    refused(
        &[
            "flash",
            "--mix",
            GAS,
            "-p",
            "30 bar",
            "--entropy",
            "1 kJ/kg",
        ],
        "unknown unit",
    );
    refused(
        &["flash", "--mix", GAS, "-t", "220 K"],
        "give --temperature",
    );
}

#[test]
fn csv_has_one_row_per_model_and_phase() {
    let out = zf()
        .args([
            "flash", "--mix", GAS, "-t", "220 K", "-p", "30 bar", "-m", "pr,srk", "-f", "csv",
        ])
        .output()
        .unwrap();
    assert!(matches!(out.status.code(), Some(0) | Some(3)));
    let text = String::from_utf8(out.stdout).unwrap();
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines.len(), 5, "{text}");
    assert!(lines[0].starts_with("model,state,temperature_k,pressure_pa,vapor_fraction"));
    assert!(lines[0].ends_with("x_n-butane"));
    assert!(lines[1].starts_with("pr,two-phase,") && lines[1].contains(",vapor,"));
    assert!(lines[4].starts_with("srk,two-phase,") && lines[4].contains(",liquid,"));
}

#[test]
fn bubble_and_dew_pressures_lie_on_the_traced_envelope() {
    // Two independent routes to the same curve: the direct saturation-point solve at T and
    // the continuation of the envelope (Michelsen, Fluid Phase Equilib. 4 (1980) 1-10). Below
    // the critical temperature the bubble and the dew pressure at T are unique.
    let out = zf()
        .args(["envelope", "--mix", GAS, "--format", "json"])
        .output()
        .unwrap();
    let env: Value = serde_json::from_slice(&out.stdout).unwrap();
    let tc = f(&env["critical_point"]["temperature_k"]);
    let pts = env["points"].as_array().unwrap();
    let mut checked = 0;
    for (k, pt) in pts.iter().enumerate() {
        let t = f(&pt["temperature_k"]);
        if k % 6 != 0 || t > tc - 0.5 {
            continue;
        }
        let flag = match pt["branch"].as_str().unwrap() {
            "bubble" => "--bubble-pressure",
            _ => "--dew-pressure",
        };
        let r = json(&["flash", "--mix", GAS, "-t", &format!("{t:e} K"), flag]);
        let p = f(&r["results"][0]["pressure_pa"]);
        let want = f(&pt["pressure_pa"]);
        assert!(
            (p / want - 1.0).abs() < 1e-6,
            "{flag} at {t} K: {p} Pa, envelope {want} Pa"
        );
        checked += 1;
    }
    assert!(checked >= 8, "{checked} points");
}

/// Both dew pressures of a retrograde isotherm (between the critical temperature and the
/// cricondentherm), each labelled by its branch, each lying between the envelope's own
/// critical pressure and cricondenbar or below them as a dew curve must.
#[test]
fn dew_pressure_offers_both_branches_of_a_retrograde_isotherm() {
    let mix = "methane=0.9,propane=0.1";
    let v = json(&[
        "flash",
        "--mix",
        mix,
        "-t",
        "250 K",
        "--dew-pressure",
        "-m",
        "pr",
    ]);
    let r = v["results"].as_array().unwrap();
    assert_eq!(r.len(), 2, "{v}");
    assert_eq!(r[0]["branch"], "lower");
    assert_eq!(r[1]["branch"], "upper");
    let env = json(&["envelope", "--mix", mix, "-m", "pr"]);
    let cricondenbar = f(&env["cricondenbar"]["pressure_pa"]);
    let (lower, upper) = (f(&r[0]["pressure_pa"]), f(&r[1]["pressure_pa"]));
    assert!(
        lower < upper && upper < cricondenbar,
        "{lower} {upper} {cricondenbar}"
    );
    let out = zf()
        .args([
            "flash",
            "--mix",
            mix,
            "-t",
            "250 K",
            "--dew-pressure",
            "-m",
            "pr",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("upper branch (retrograde dew point)"),
        "{text}"
    );
    // One dew pressure where the isotherm crosses the dew curve once: no branch label.
    let v = json(&[
        "flash",
        "--mix",
        mix,
        "-t",
        "200 K",
        "--dew-pressure",
        "-m",
        "pr",
    ]);
    assert_eq!(v["results"].as_array().unwrap().len(), 1);
    assert!(v["results"][0]["branch"].is_null());
}
