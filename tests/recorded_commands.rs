//! Twenty realistic commands an engineer runs in the first hour, their whole terminal output
//! (stdout, stderr, exit code) recorded in `tests/recorded/` and compared byte for byte: a
//! change to what a user reads shows here first. Each output also stays within 100 columns
//! (common practice for terminal output) and speaks the units typed.
//!
//! After a deliberate change of the output: `ZFACTOR_RECORD=1 cargo test --test
//! recorded_commands`, then read the diff before committing it.

use assert_cmd::Command;
use std::path::PathBuf;

const GAS: &str = "methane=0.889,ethane=0.054,propane=0.016,n-butane=0.004,isobutane=0.003,\
nitrogen=0.018,carbon dioxide=0.016";

/// (file name, arguments).
fn commands() -> Vec<(&'static str, Vec<&'static str>)> {
    vec![
        ("01-demo", vec!["demo"]),
        (
            "02-state-methane-all",
            vec![
                "state", "--fluid", "methane", "-t", "25 degC", "-p", "70 barg", "-m", "all",
            ],
        ),
        (
            "03-state-pipeline-gas",
            vec![
                "state",
                "--mix",
                GAS,
                "-t",
                "40 degC",
                "-p",
                "70 barg",
                "-m",
                "pr,srk,lk",
            ],
        ),
        (
            "04-state-steam-ph",
            vec![
                "state",
                "--fluid",
                "water",
                "-p",
                "10 bar",
                "--enthalpy",
                "2800 kJ/kg",
                "-m",
                "if97,reference",
            ],
        ),
        (
            "05-saturation-propane",
            vec![
                "saturation",
                "--fluid",
                "propane",
                "-t",
                "20 degC",
                "-m",
                "pr,srk",
            ],
        ),
        (
            "06-flash-dew-both-branches",
            vec![
                "flash",
                "--mix",
                "methane=0.9,propane=0.1",
                "-t",
                "250 K",
                "--dew-pressure",
                "-m",
                "pr",
            ],
        ),
        (
            "07-flash-split",
            vec![
                "flash",
                "--mix",
                "methane=0.8,ethane=0.1,propane=0.06,n-butane=0.04",
                "-t",
                "220 K",
                "-p",
                "30 bar",
                "-m",
                "pr",
            ],
        ),
        (
            "08-envelope",
            vec![
                "envelope",
                "--mix",
                "methane=0.85,ethane=0.08,propane=0.05,n-butane=0.02",
                "-m",
                "pr",
            ],
        ),
        (
            "09-compare-nitrogen",
            vec![
                "compare",
                "--fluid",
                "nitrogen",
                "-t",
                "150..300 K n 4",
                "-p",
                "1..300 bar n 5",
                "-m",
                "pr,srk,lk",
            ],
        ),
        (
            "10-table-co2",
            vec![
                "table",
                "--fluid",
                "co2",
                "-t",
                "0..40 degC step 20",
                "-p",
                "10..70 barg step 30",
                "-m",
                "reference",
                "--properties",
                "z,density,h,phase",
            ],
        ),
        (
            "11-vessel-heating",
            vec![
                "vessel",
                "--fluid",
                "nitrogen",
                "--volume",
                "50 L",
                "-t",
                "15 degC",
                "-p",
                "200 barg",
                "--to-temperature",
                "50 degC",
                "-m",
                "pr,reference",
            ],
        ),
        (
            "12-vessel-venting",
            vec![
                "vessel",
                "--mix",
                "methane=0.9,ethane=0.1",
                "--volume",
                "2 m3",
                "-t",
                "20 degC",
                "-p",
                "70 barg",
                "--vent-to",
                "1 bar",
                "--mdmt",
                "-29 degC",
                "-m",
                "pr",
            ],
        ),
        (
            "13-compress",
            vec![
                "compress",
                "--mix",
                "methane=0.9,ethane=0.06,propane=0.04",
                "-p",
                "30 bar",
                "-t",
                "30 degC",
                "--discharge-pressure",
                "90 bar",
                "--polytropic-efficiency",
                "78%",
                "--flow",
                "2 MMscfd",
                "-m",
                "pr,srk",
            ],
        ),
        (
            "14-flow",
            vec![
                "flow",
                "--fluid",
                "methane",
                "--flow",
                "50000 Sm3/h",
                "-t",
                "40 degC",
                "-p",
                "60 bar",
                "-m",
                "pr",
            ],
        ),
        (
            "15-process-throttle",
            vec![
                "process",
                "--fluid",
                "co2",
                "--path",
                "isenthalpic",
                "-t",
                "40 degC",
                "-p",
                "80 bar",
                "--to-pressure",
                "10 bar",
                "-m",
                "pr,reference",
            ],
        ),
        (
            "16-relief",
            vec![
                "relief",
                "--mix",
                "methane=0.9,propane=0.1",
                "-t",
                "60 degC",
                "-p",
                "110 bar",
                "-m",
                "pr",
            ],
        ),
        ("17-models-pr", vec!["models", "pr"]),
        ("18-fluids-methane", vec!["fluids", "methane"]),
        ("19-kij-methane", vec!["kij", "methane"]),
        (
            "20-state-hydrogen-700-bar",
            vec![
                "state", "--fluid", "hydrogen", "-t", "15 degC", "-p", "700 bar", "-m", "all",
            ],
        ),
    ]
}

fn record(args: &[&str]) -> String {
    let out = Command::cargo_bin("zfactor")
        .unwrap()
        .args(args)
        .output()
        .unwrap();
    let quoted: Vec<String> = args
        .iter()
        .map(|a| {
            if a.contains(' ') || a.contains(',') {
                format!("\"{a}\"")
            } else {
                a.to_string()
            }
        })
        .collect();
    format!(
        "$ zfactor {}\n{}--- stderr\n{}--- exit {}\n",
        quoted.join(" "),
        String::from_utf8_lossy(&out.stdout),
        String::from_utf8_lossy(&out.stderr),
        out.status.code().unwrap_or(-1)
    )
}

#[test]
fn recorded_commands_print_what_was_recorded() {
    let dir = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("tests/recorded");
    let update = std::env::var_os("ZFACTOR_RECORD").is_some();
    let mut differ = Vec::new();
    for (name, args) in commands() {
        let got = record(&args);
        let first_line = got.lines().next().unwrap_or("");
        // The terminal text, stdout and stderr (not the command line itself), within 100
        // columns.
        for line in got.lines().skip(1) {
            assert!(
                line.chars().count() <= 100,
                "{name}: a line of {} columns: {line}",
                line.chars().count()
            );
        }
        let path = dir.join(format!("{name}.txt"));
        if update {
            std::fs::write(&path, &got).unwrap();
            continue;
        }
        let want = std::fs::read_to_string(&path).unwrap_or_else(|_| {
            panic!(
                "{}: no recording; run with ZFACTOR_RECORD=1 to make it",
                path.display()
            )
        });
        if got != want {
            differ.push(format!("{name} ({first_line})"));
        }
    }
    assert!(
        differ.is_empty(),
        "outputs differ from their recordings: {differ:#?}"
    );
}

/// The recordings speak the units typed: degC and barg come back as degC and barg.
#[test]
fn recorded_commands_echo_the_units_typed() {
    let r = record(&[
        "vessel", "--fluid", "nitrogen", "--volume", "50 L", "-t", "15 degC", "-p", "200 barg",
        "-m", "pr",
    ]);
    assert!(r.contains("vessel 50 L at 15 degC, 200 barg"), "{r}");
    let r = record(&[
        "compress",
        "--fluid",
        "methane",
        "-p",
        "30 barg",
        "-t",
        "25 degC",
        "--discharge-pressure",
        "90 barg",
        "--isentropic-efficiency",
        "78%",
        "-m",
        "pr",
    ]);
    assert!(r.contains("discharge temperature         degC"), "{r}");
}
