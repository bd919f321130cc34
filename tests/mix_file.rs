//! Gas analyses from a file (`--mix-file`): the same composition as CSV, as a workbook and
//! as `--mix` gives identical results; malformed files are refused with the row named.
//!
//! The analysis is an invented lean pipeline gas (a demo scenario of our own); the labels are
//! the trade's usual ones (C1, iC4, N2, ...; common practice).

use assert_cmd::Command;
use serde_json::Value;
use std::fs;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

const MIX: &str = "C1=88.9%,C2=5.4%,C3=1.6%,iC4=0.3%,nC4=0.4%,N2=1.8%,CO2=1.6%";

const CSV: &str = "Component,Amount (mol %)\n\
C1,88.90\nC2,5.40\nC3,1.60\niC4,0.30\nnC4,0.40\nneoC5,0.000\nN2,1.80\nCO2,1.60\n\
Total,100.00\n";

fn state(fluid: &[&str], model: &str) -> (i32, Value, String) {
    let out = zf()
        .arg("state")
        .args(fluid)
        .args(["-t", "40 degC", "-p", "70 barg", "-m", model, "-f", "json"])
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    let v = serde_json::from_slice(&out.stdout).unwrap_or(Value::Null);
    (out.status.code().unwrap_or(-1), v, err)
}

#[test]
fn csv_workbook_and_command_line_give_the_same_answer() {
    let dir = tempfile::tempdir().unwrap();
    let csv = dir.path().join("lab.csv");
    fs::write(&csv, CSV).unwrap();
    let book = dir.path().join("lab.xlsx");
    let mut wb = rust_xlsxwriter::Workbook::new();
    let ws = wb.add_worksheet();
    ws.write_string(0, 0, "Component").unwrap();
    ws.write_string(0, 1, "mol %").unwrap();
    for (r, (c, v)) in [
        ("C1", 88.9),
        ("C2", 5.4),
        ("C3", 1.6),
        ("iC4", 0.3),
        ("nC4", 0.4),
        ("N2", 1.8),
        ("CO2", 1.6),
    ]
    .iter()
    .enumerate()
    {
        ws.write_string(r as u32 + 1, 0, *c).unwrap();
        ws.write_number(r as u32 + 1, 1, *v).unwrap();
    }
    wb.save(&book).unwrap();
    let (c0, direct, e0) = state(&["--mix", MIX], "pr,srk");
    assert_eq!(c0, 0, "{e0}");
    for path in [&csv, &book] {
        let (code, v, err) = state(&["--mix-file", path.to_str().unwrap()], "pr,srk");
        assert_eq!(code, 0, "{}: {err}", path.display());
        assert_eq!(v["results"], direct["results"], "{}", path.display());
        assert_eq!(v["composition"], direct["composition"]);
    }
    // The table and the flash take the file too.
    let out = zf()
        .args([
            "table",
            "--mix-file",
            csv.to_str().unwrap(),
            "-t",
            "0 degC,40 degC",
        ])
        .args(["-p", "10 bar,70 bar", "-m", "pr", "-f", "csv"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(0));
    let out = zf()
        .args([
            "flash",
            "--mix-file",
            csv.to_str().unwrap(),
            "-t",
            "-40 degC",
        ])
        .args(["-p", "40 bar", "-m", "pr", "-f", "json"])
        .output()
        .unwrap();
    assert!(matches!(out.status.code(), Some(0 | 3)));
}

#[test]
fn a_mass_analysis_reads_as_mass_fractions() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("mass.csv");
    fs::write(&path, "name,wt %\nmethane,80\nethane,20\n").unwrap();
    let (_, file, _) = state(&["--mix-file", path.to_str().unwrap()], "pr");
    let (_, direct, _) = state(
        &["--mix", "methane=80%,ethane=20%", "--basis", "mass"],
        "pr",
    );
    assert_eq!(file["results"], direct["results"]);
}

#[test]
fn lumped_carbon_numbers_are_read_and_said() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("c6.csv");
    fs::write(&path, "component,mole fraction\nC1,0.95\nC6,0.05\n").unwrap();
    let (code, v, err) = state(&["--mix-file", path.to_str().unwrap()], "pr");
    assert_eq!(code, 3, "{err}");
    assert!(err.contains("row 3: \"C6\" is read as n-hexane"), "{err}");
    assert!(v["fluid"].as_str().unwrap().contains("n-hexane"));
}

#[test]
fn malformed_analyses_name_the_row() {
    let dir = tempfile::tempdir().unwrap();
    let cases = [
        (
            "nocol.csv",
            "component,density [kg/m3]\nC1,0.7\n",
            "needs a component column",
        ),
        (
            "unknown.csv",
            "component,mol %\nC1,90\nunobtainium,10\n",
            "row 3:",
        ),
        ("sum.csv", "component,mol %\nC1,90\nC2,5\n", "sum to 95"),
        (
            "twice.csv",
            "component,mol %\nC1,90\nmethane,10\n",
            "listed twice (rows 2 and 3)",
        ),
        (
            "plus.csv",
            "component,mol %\nC1,90\nC7+,10\n",
            "row 3: \"C7+\" is a plus fraction",
        ),
        (
            "text.csv",
            "component,mol %\nC1,ninety\nC2,10\n",
            "row 2: the amount",
        ),
        (
            "total.csv",
            "component,mol %\nC1,90\nC2,10\nTotal,99\n",
            "row 4: the total says 99",
        ),
        ("empty.csv", "component,mol %\n", "no component"),
    ];
    for (name, text, want) in cases {
        let path = dir.path().join(name);
        fs::write(&path, text).unwrap();
        let (code, _, err) = state(&["--mix-file", path.to_str().unwrap()], "pr");
        assert_eq!(code, 2, "{name}: {err}");
        assert!(err.contains(want), "{name}: {err}");
    }
    // Within 0.1 % of 100: rounding, scaled, and the sum as read is kept in the basis.
    let path = dir.path().join("rounded.csv");
    fs::write(&path, "component,mol %\nC1,90.01\nC2,10.00\n").unwrap();
    let (code, v, err) = state(&["--mix-file", path.to_str().unwrap()], "pr");
    assert_eq!(code, 0, "{err}");
    assert_eq!(v["input"]["normalized_from"], 100.01, "{}", v["input"]);
}
