//! `zfactor audit` end to end on spreadsheets of our own invention, generated here: each
//! planted cause is found, correct rows pass, bad cells are reported by row and column while
//! good rows are still audited, the annotated copy is written and the input is untouched.
//!
//! The planted values are computed here by exact ideal-gas arithmetic, rho = P M / (R T)
//! with the CODATA 2018 R, and the audit is run with the ideal-gas model (Z = 1) so that
//! the expected value of every row is known without the library; the Z-forced-to-1 case is
//! run with Peng-Robinson against that same exact ideal-gas number.

use assert_cmd::Command;
use serde_json::Value;
use std::path::Path;

/// CODATA 2018 molar gas constant.
const R: f64 = 8.314_462_618;
/// 15 degC in K.
const T15: f64 = 288.15;

fn zf() -> Command {
    Command::cargo_bin("zfactor").unwrap()
}

fn molar_mass(fluid: &str) -> f64 {
    let out = zf()
        .args(["fluids", fluid, "--format", "json"])
        .output()
        .unwrap();
    serde_json::from_slice::<Value>(&out.stdout).unwrap()["molar_mass_kg_mol"]
        .as_f64()
        .unwrap()
}

fn write_csv(path: &Path, rows: &[Vec<String>]) {
    let mut w = csv::Writer::from_path(path).unwrap();
    for r in rows {
        w.write_record(r).unwrap();
    }
    w.flush().unwrap();
}

fn audit(args: &[&str]) -> Value {
    let out = zf()
        .arg("audit")
        .args(args)
        .args(["--format", "json"])
        .output()
        .unwrap();
    assert!(
        out.status.code() == Some(0) || out.status.code() == Some(3),
        "audit failed: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).unwrap()
}

fn row(v: &Value, n: u64) -> Option<&Value> {
    v["flagged"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["row"] == n)
}

fn causes_of(v: &Value, n: u64) -> Vec<String> {
    row(v, n).unwrap_or_else(|| panic!("row {n} not flagged: {v}"))["reconciling_causes"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c.as_str().unwrap().to_string())
        .collect()
}

fn s(x: &str) -> String {
    x.to_string()
}

#[test]
fn every_planted_cause_is_found_and_bad_cells_are_located() {
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("sheet.csv");
    let (m1, m2) = (molar_mass("methane"), molar_mass("ethane"));
    let p = 50e5;
    let rho = |p: f64, m: f64, t: f64, r: f64| p * m / (r * t);
    let n = |v: f64| format!("{v:.12e}");
    let rows = vec![
        vec![
            s("Fluid"),
            s("Temperature (degC)"),
            s("Pressure"),
            s("Quantity"),
            s("Value"),
            s("Volume (m3)"),
            s("Basis"),
        ],
        // 2: correct.
        vec![
            s("methane"),
            s("15"),
            s("50 bar"),
            s("density"),
            n(rho(p, m1, T15, R)),
            s(""),
            s(""),
        ],
        // 3: 50 barg computed as 50 bar absolute.
        vec![
            s("methane"),
            s("15"),
            s("50 barg"),
            s("density"),
            n(rho(p, m1, T15, R)),
            s(""),
            s(""),
        ],
        // 4: 15 degC computed as 15 K.
        vec![
            s("methane"),
            s("15"),
            s("50 bar"),
            s("density"),
            n(rho(p, m1, 15.0, R)),
            s(""),
            s(""),
        ],
        // 5: standard volume of 1 m3 stated at 15 degC but computed at 0 degC.
        vec![
            s("methane"),
            s("15"),
            s("50 bar"),
            s("std_volume"),
            n(1.0 * (p / T15) / (101_325.0 / 273.15)),
            s("1"),
            s(""),
        ],
        // 6: mass fractions 0.5/0.5 used as mole fractions.
        vec![
            s("methane=0.5,ethane=0.5"),
            s("15"),
            s("50 bar"),
            s("density"),
            n(rho(p, 0.5 * m1 + 0.5 * m2, T15, R)),
            s(""),
            s("mass"),
        ],
        // 7: R in L atm/(mol K) used as J/(mol K).
        vec![
            s("methane"),
            s("15"),
            s("50 bar"),
            s("density"),
            n(rho(p, m1, T15, 0.082_057_366)),
            s(""),
            s(""),
        ],
        // 8: text in a number cell.
        vec![
            s("methane"),
            s("abc"),
            s("50 bar"),
            s("density"),
            s("1"),
            s(""),
            s(""),
        ],
        // 9: blank row.
        vec![s(""), s(""), s(""), s(""), s(""), s(""), s("")],
        // 10: unknown unit.
        vec![
            s("methane"),
            s("15"),
            s("50 furlongs"),
            s("density"),
            s("1"),
            s(""),
            s(""),
        ],
        // 11: correct mixture on a mass basis.
        vec![
            s("methane=0.5,ethane=0.5"),
            s("15"),
            s("50 bar"),
            s("density"),
            n(rho(p, 1.0 / (0.5 / m1 + 0.5 / m2), T15, R)),
            s(""),
            s("mass"),
        ],
    ];
    write_csv(&input, &rows);
    let before = std::fs::read(&input).unwrap();
    let v = audit(&[
        input.to_str().unwrap(),
        "--model",
        "ideal",
        "--tolerance",
        "0.1%",
    ]);
    assert_eq!(v["rows_read"], 10);
    assert_eq!(v["rows_audited"], 7);
    assert_eq!(v["rows_within_tolerance"], 2, "{v}");
    assert_eq!(v["rows_flagged"], 5);
    assert_eq!(v["rows_bad"], 3);
    assert!(causes_of(&v, 3).contains(&s("gauge pressure read as absolute")));
    assert!(causes_of(&v, 4).contains(&s("degC read as K")));
    assert!(causes_of(&v, 5).contains(&s("base conditions 0degC instead of the stated")));
    assert!(causes_of(&v, 6).contains(&s("mass fractions read as mole fractions")));
    assert!(causes_of(&v, 7)
        .iter()
        .any(|c| c.starts_with("gas constant 0.082057366")));
    let bad = v["bad"].as_array().unwrap();
    let find = |r: u64| bad.iter().find(|b| b["row"] == r).unwrap();
    assert!(find(8)["column"].as_str().unwrap().starts_with("B "));
    assert!(find(8)["message"].as_str().unwrap().contains("abc"));
    assert_eq!(find(9)["message"], "blank row");
    assert!(find(10)["column"].as_str().unwrap().starts_with("C "));
    assert!(find(10)["message"].as_str().unwrap().contains("furlongs"));
    // The input is untouched; the annotated copy sits beside it with one line per row.
    assert_eq!(std::fs::read(&input).unwrap(), before);
    let out = dir.path().join("sheet.audit.csv");
    let mut rd = csv::ReaderBuilder::new()
        .flexible(true)
        .from_path(&out)
        .unwrap();
    let statuses: Vec<String> = rd
        .records()
        .map(|r| r.unwrap().get(12).unwrap_or("").to_string())
        .collect();
    assert_eq!(
        statuses,
        ["ok", "FLAG", "FLAG", "FLAG", "FLAG", "FLAG", "bad", "bad", "bad", "ok"]
    );
    // No temporary file is left behind.
    let names: Vec<String> = std::fs::read_dir(dir.path())
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
        .collect();
    assert_eq!(names.len(), 2, "{names:?}");
}

#[test]
fn z_forced_to_one_is_found_with_a_real_gas_model() {
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("z.csv");
    let m = molar_mass("methane");
    let rows = vec![
        vec![s("Gas"), s("T (K)"), s("P (bar)"), s("Density (kg/m3)")],
        vec![
            s("methane"),
            s("300"),
            s("100"),
            format!("{:.12e}", 100e5 * m / (R * 300.0)),
        ],
    ];
    write_csv(&input, &rows);
    let v = audit(&[input.to_str().unwrap(), "--model", "pr"]);
    assert_eq!(v["rows_flagged"], 1);
    assert!(causes_of(&v, 2).contains(&s("Z forced to 1 (ideal gas)")));
    // The annotated copy carries the ideal-gas value beside the model's: here the planted
    // number itself.
    let mut rd = csv::Reader::from_path(dir.path().join("z.audit.csv")).unwrap();
    let rec = rd.records().next().unwrap().unwrap();
    let ideal: f64 = rec.get(6).unwrap().parse().unwrap();
    assert!((ideal / (100e5 * m / (R * 300.0)) - 1.0).abs() < 1e-12);
}

#[test]
fn the_audit_never_writes_over_its_input_and_refuses_bad_options() {
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("a.csv");
    write_csv(
        &input,
        &[
            vec![s("Fluid"), s("T (K)"), s("P (bar)"), s("Z")],
            vec![s("methane"), s("300"), s("10"), s("0.98")],
        ],
    );
    let before = std::fs::read(&input).unwrap();
    zf().args([
        "audit",
        input.to_str().unwrap(),
        "--output",
        input.to_str().unwrap(),
    ])
    .assert()
    .code(2);
    zf().args(["audit", input.to_str().unwrap(), "--model", "all"])
        .assert()
        .code(2);
    zf().args(["audit", input.to_str().unwrap(), "--tolerance", "abc"])
        .assert()
        .code(2);
    zf().args(["audit", input.to_str().unwrap(), "--columns", "value=Nope"])
        .assert()
        .code(2);
    assert_eq!(std::fs::read(&input).unwrap(), before);
}

#[test]
fn a_workbook_with_merged_cells_text_and_a_blank_row_is_audited_row_by_row() {
    use calamine::{open_workbook, Reader, Xlsx};
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("book.xlsx");
    let m = molar_mass("nitrogen");
    let rho = |t: f64, p: f64| p * m / (R * t);
    let mut wb = rust_xlsxwriter::Workbook::new();
    let ws = wb.add_worksheet();
    ws.set_name("gas").unwrap();
    for (c, h) in ["Fluid", "T (K)", "P (bar)", "Density (kg/m3)"]
        .iter()
        .enumerate()
    {
        ws.write_string(0, c as u16, *h).unwrap();
    }
    // Rows 2 and 3: correct values as numbers.
    for (r, (t, p)) in [(300.0, 10.0), (320.0, 20.0)].iter().enumerate() {
        let r = r as u32 + 1;
        ws.write_string(r, 0, "nitrogen").unwrap();
        ws.write_number(r, 1, *t).unwrap();
        ws.write_number(r, 2, *p).unwrap();
        ws.write_number(r, 3, rho(*t, p * 1e5)).unwrap();
    }
    // Rows 4-5: the fluid cell merged over two rows.
    ws.merge_range(3, 0, 4, 0, "nitrogen", &rust_xlsxwriter::Format::new())
        .unwrap();
    for r in [3u32, 4] {
        ws.write_number(r, 1, 300.0).unwrap();
        ws.write_number(r, 2, 10.0).unwrap();
        ws.write_number(r, 3, rho(300.0, 10e5)).unwrap();
    }
    // Row 6: text in the pressure cell; row 7 blank; row 8 correct.
    ws.write_string(5, 0, "nitrogen").unwrap();
    ws.write_number(5, 1, 300.0).unwrap();
    ws.write_string(5, 2, "ten").unwrap();
    ws.write_number(5, 3, 1.0).unwrap();
    ws.write_string(7, 0, "nitrogen").unwrap();
    ws.write_number(7, 1, 350.0).unwrap();
    ws.write_number(7, 2, 5.0).unwrap();
    ws.write_number(7, 3, rho(350.0, 5e5)).unwrap();
    wb.save(&input).unwrap();
    let before = std::fs::read(&input).unwrap();
    let v = audit(&[
        input.to_str().unwrap(),
        "--model",
        "ideal",
        "--sheet",
        "gas",
    ]);
    assert_eq!(v["rows_within_tolerance"], 3, "{v}");
    let bad = v["bad"].as_array().unwrap();
    let find = |r: u64| {
        bad.iter()
            .find(|b| b["row"] == r)
            .unwrap_or_else(|| panic!("{v}"))
    };
    assert!(find(4)["message"]
        .as_str()
        .unwrap()
        .contains("merged cells A4:A5"));
    assert!(find(5)["message"].as_str().unwrap().contains("merged"));
    assert!(find(6)["column"].as_str().unwrap().starts_with("C "));
    assert_eq!(find(7)["message"], "blank row");
    assert_eq!(std::fs::read(&input).unwrap(), before);
    // The annotated workbook reads back with the status column.
    let mut out: Xlsx<_> = open_workbook(dir.path().join("book.audit.xlsx")).unwrap();
    let range = out.worksheet_range_at(0).unwrap().unwrap();
    let status: Vec<String> = range.rows().skip(1).map(|r| r[9].to_string()).collect();
    assert_eq!(status, ["ok", "ok", "bad", "bad", "bad", "bad", "ok"]);
}

#[test]
fn a_table_that_starts_away_from_a1_names_the_cells_as_the_sheet_does() {
    // The header at C3, data from C4: a bad pressure in cell E6 is named E6, on its sheet.
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("offset.xlsx");
    let m = molar_mass("nitrogen");
    let mut wb = rust_xlsxwriter::Workbook::new();
    let ws = wb.add_worksheet();
    ws.set_name("readings").unwrap();
    for (c, h) in ["Fluid", "T (K)", "P (bar)", "Density (kg/m3)"]
        .iter()
        .enumerate()
    {
        ws.write_string(2, 2 + c as u16, *h).unwrap();
    }
    for (r, p) in [(3u32, "10"), (4, "20"), (5, "twenty")] {
        ws.write_string(r, 2, "nitrogen").unwrap();
        ws.write_number(r, 3, 300.0).unwrap();
        match p.parse::<f64>() {
            Ok(v) => {
                ws.write_number(r, 4, v).unwrap();
                ws.write_number(r, 5, v * 1e5 * m / (R * 300.0)).unwrap();
            }
            Err(_) => {
                ws.write_string(r, 4, p).unwrap();
                ws.write_number(r, 5, 1.0).unwrap();
            }
        }
    }
    wb.save(&input).unwrap();
    let v = audit(&[input.to_str().unwrap(), "--model", "ideal"]);
    assert_eq!(v["sheet"], "readings");
    assert_eq!(v["rows_within_tolerance"], 2, "{v}");
    let bad = v["bad"].as_array().unwrap();
    assert_eq!(bad.len(), 1, "{v}");
    assert_eq!(bad[0]["row"], 6, "{v}");
    assert!(bad[0]["column"].as_str().unwrap().starts_with("E "), "{v}");
}
