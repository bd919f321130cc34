//! The user's own components (`--components FILE`).
//!
//! Checks against outside facts: a component given the published constants of propane
//! (Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed., App. A, as in
//! the built-in data) behaves as propane does in a corresponding-states cubic, whose Z
//! depends on Tc, Pc and the acentric factor alone (Peng & Robinson 1976); and an ideal gas of
//! constant heat capacity has h(T2) - h(T1) = cp (T2 - T1) exactly (definition of cp).

use assert_cmd::Command;
use serde_json::Value;
use std::fs;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

const HEADER: &str = "name,molar mass [g/mol],Tc [K],Pc [bar],acentric factor,\
cp [J/(mol K)],cp Tmin [K],cp Tmax [K],source\n";

fn file(dir: &std::path::Path, name: &str, rows: &str) -> String {
    let p = dir.join(name);
    fs::write(&p, format!("{HEADER}{rows}")).unwrap();
    p.to_str().unwrap().to_string()
}

fn json(args: &[&str]) -> (i32, Value, String) {
    let out = zf().args(args).args(["-f", "json"]).output().unwrap();
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    let v = serde_json::from_slice(&out.stdout).unwrap_or(Value::Null);
    (out.status.code().unwrap_or(-1), v, err)
}

const MY_PROPANE: &str =
    "my-propane,44.09562,369.83,42.48,0.152,73.6,250,400,Poling 5th ed. App. A constants\n";

#[test]
fn a_component_with_propanes_constants_behaves_as_propane() {
    let dir = tempfile::tempdir().unwrap();
    let path = file(dir.path(), "comps.csv", MY_PROPANE);
    let args = |fluid: &str| {
        vec![
            "state".to_string(),
            "--fluid".into(),
            fluid.into(),
            "-t".into(),
            "350 K".into(),
            "-p".into(),
            "10 bar".into(),
            "-m".into(),
            "pr,srk".into(),
            "--components".into(),
            path.clone(),
        ]
    };
    let mine = args("my-propane");
    let theirs = args("propane");
    let (c1, a, e1) = json(&mine.iter().map(String::as_str).collect::<Vec<_>>());
    let (c2, b, e2) = json(&theirs.iter().map(String::as_str).collect::<Vec<_>>());
    assert_eq!(c1, 0, "{e1}");
    assert_eq!(c2, 0, "{e2}");
    for k in 0..2 {
        assert_eq!(a["results"][k]["z"], b["results"][k]["z"]);
    }
}

#[test]
fn a_constant_heat_capacity_is_used_as_given() {
    let dir = tempfile::tempdir().unwrap();
    let path = file(dir.path(), "comps.csv", MY_PROPANE);
    let h = |t: &str| {
        let (code, v, err) = json(&[
            "--components",
            &path,
            "state",
            "--fluid",
            "my-propane",
            "-t",
            t,
            "-p",
            "1 bar",
            "-m",
            "ideal",
        ]);
        assert_eq!(code, 0, "{err}");
        v["results"][0]["enthalpy_j_mol"].as_f64().unwrap()
    };
    let dh = h("350 K") - h("300 K");
    assert!((dh - 73.6 * 50.0).abs() < 1e-6, "{dh}");
}

#[test]
fn a_user_component_mixes_and_takes_a_kij() {
    let dir = tempfile::tempdir().unwrap();
    let path = file(dir.path(), "comps.csv", MY_PROPANE);
    let (code, v, err) = json(&[
        "state",
        "--components",
        &path,
        "--mix",
        "methane=0.9,my-propane=0.1",
        "-t",
        "300 K",
        "-p",
        "50 bar",
        "-m",
        "pr",
        "--kij",
        "methane-my-propane=0.02",
    ]);
    assert_eq!(code, 0, "{err}");
    let notes = v["results"][0]["notes"].to_string();
    assert!(
        notes.contains("methane-my-propane = 0.02 [user: --kij]"),
        "{notes}"
    );
}

#[test]
fn bad_component_files_name_the_line_and_column() {
    let dir = tempfile::tempdir().unwrap();
    let cases = [
        (
            file(dir.path(), "clash.csv", "Propane,44.1,369.8,42.5,0.15,73.6,250,400,x\n"),
            "built-in component propane",
        ),
        (
            file(dir.path(), "tc.csv", "hot,44.1,36980,42.5,0.15,73.6,250,400,x\n"),
            "line 2, column \"Tc [K]\": Tc is outside the plausible range",
        ),
        (
            file(dir.path(), "cp.csv", "cold,44.1,369.8,42.5,0.15,10,250,400,x\n"),
            "column \"cp [J/(mol K)]\": cp0 = ",
        ),
        (
            file(dir.path(), "text.csv", "word,44.1,369.8,forty,0.15,73.6,250,400,x\n"),
            "column \"Pc [bar]\": \"forty\" is not a number",
        ),
        (
            file(dir.path(), "nosource.csv", "quiet,44.1,369.8,42.5,0.15,73.6,250,400,\n"),
            "column \"source\"",
        ),
        (
            file(
                dir.path(),
                "twice.csv",
                "c-one,44.1,369.8,42.5,0.15,73.6,250,400,x\nc-one,58.1,425.1,38.0,0.2,98,250,400,x\n",
            ),
            "line 3, column \"name\": \"c-one\" is already defined",
        ),
    ];
    for (path, want) in &cases {
        let (code, _, err) = json(&["--components", path, "fluids"]);
        assert_eq!(code, 2, "{path}: {err}");
        assert!(err.contains(want), "{path}: {err}");
    }
    let p = dir.path().join("unit.csv");
    fs::write(
        &p,
        "name,molar mass [g],Tc [K],Pc [bar],acentric factor,cp/R,cp Tmin [K],cp Tmax [K],source\n",
    )
    .unwrap();
    let (code, _, err) = json(&["--components", p.to_str().unwrap(), "fluids"]);
    assert_eq!(code, 2);
    assert!(err.contains("column \"molar mass [g]\""), "{err}");
}

#[test]
fn a_rackett_compressibility_sets_the_peneloux_shift() {
    // Peneloux, Rauzy & Freze (1982): the SRK volume shift c = 0.40768 (0.29441 - Z_RA) R Tc/Pc,
    // and the translated molar volume is v_SRK - c at the same T and P.
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join("zra.csv");
    std::fs::write(
        &p,
        "name,molar mass [g/mol],Tc [K],Pc [bar],acentric factor,Z_RA,cp [J/(mol K)],\
cp Tmin [K],cp Tmax [K],source\n\
c3-lab,44.09562,369.83,42.48,0.152,0.2700,73.6,200,400,invented demo values\n",
    )
    .unwrap();
    let (code, v, err) = json(&[
        "--components",
        p.to_str().unwrap(),
        "state",
        "--fluid",
        "c3-lab",
        "-t",
        "250 K",
        "-p",
        "20 bar",
        "-m",
        "srk,srk-pen",
    ]);
    assert!(matches!(code, 0 | 3), "{err}");
    let vol = |k: usize| v["results"][k]["molar_volume_m3_mol"].as_f64().unwrap();
    let c = 0.40768 * (0.29441 - 0.2700) * 8.314_462_618 * 369.83 / 42.48e5;
    assert!(
        (vol(0) - vol(1) - c).abs() < 1e-12,
        "{} {} {c}",
        vol(0),
        vol(1)
    );
}
