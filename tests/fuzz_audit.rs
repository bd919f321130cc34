//! Randomised and hostile inputs for the spreadsheet audit, the parser of whole files:
//! - one CSV of 100,000 rows, each a valid row mutated by insertion, deletion, duplication
//!   and replacement of characters (digits, units, separators, quotes, multi-byte text);
//! - hostile files: a 4 MB cell, 5,000 columns, binary garbage, unbalanced quotes, a header
//!   only, an empty file, a byte-order mark with CRLF line ends; .xlsx files that are not
//!   zip archives, truncated archives and a zip with no workbook in it.
//!
//! The property: no panic, no hang; a file that can be read is audited with every row counted
//! (audited, or bad with its row and column); one that cannot is refused with exit code 2 and
//! a message naming it; the input is never modified.

use assert_cmd::Command;
use serde_json::Value;
use std::path::Path;

struct Rng(u64);

impl Rng {
    fn next(&mut self) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_f491_4f6c_dd1d)
    }
    fn below(&mut self, n: usize) -> usize {
        (self.next() % n as u64) as usize
    }
}

const PIECES: &[&str] = &[
    "0", "1", "9", ".", "-", "e", " ", ",", "\"", "bar", "g", "degC", "K", "%", "=", ";",
    "methane", "co2", "nan", "inf", "1e308", "µ", "🔥", "\t", "density", "z",
];

fn mutate(rng: &mut Rng, seed: &str) -> String {
    let mut s: Vec<char> = seed.chars().collect();
    for _ in 0..=rng.below(3) {
        let piece: Vec<char> = PIECES[rng.below(PIECES.len())].chars().collect();
        let at = rng.below(s.len() + 1);
        match rng.below(3) {
            0 => {
                s.splice(at..at, piece);
            }
            1 if !s.is_empty() => {
                let i = at.min(s.len() - 1);
                s.remove(i);
            }
            _ => {
                let end = (at + 1).min(s.len());
                s.splice(at.min(end)..end, piece);
            }
        }
    }
    s.into_iter().collect::<String>().replace('\n', " ")
}

/// Runs the audit; returns (exit code, JSON when printed, stderr).
fn audit(input: &Path, out: &Path) -> (i32, Option<Value>, String) {
    let o = Command::cargo_bin("zfactor")
        .unwrap()
        .arg("audit")
        .arg(input)
        .args(["-m", "pr", "--format", "json", "--output"])
        .arg(out)
        .timeout(std::time::Duration::from_secs(120))
        .output()
        .unwrap();
    let code = o.status.code().expect("the audit was killed or timed out");
    (
        code,
        serde_json::from_slice(&o.stdout).ok(),
        String::from_utf8_lossy(&o.stderr).into_owned(),
    )
}

#[test]
fn one_hundred_thousand_mutated_rows() {
    let dir = tempfile::tempdir().unwrap();
    let input = dir.path().join("sheet.csv");
    let seeds = [
        "methane,15,50 bar,density,35.1",
        "\"methane=0.9,ethane=0.1\",20,70 barg,z,0.87",
        "co2,40,10 bar,density,18.2",
        "nitrogen,-10,200 bar,z,1.01",
    ];
    let mut rng = Rng(0x51_7cc1_b727_220a);
    let mut text = String::from("Fluid,Temperature (degC),Pressure,Quantity,Value\n");
    const ROWS: usize = 100_000;
    for _ in 0..ROWS {
        let seed = seeds[rng.below(seeds.len())];
        let row = if rng.below(4) == 0 {
            seed.to_string()
        } else {
            mutate(&mut rng, seed)
        };
        text.push_str(&row);
        text.push('\n');
    }
    std::fs::write(&input, &text).unwrap();
    let before = std::fs::read(&input).unwrap();
    let (code, v, err) = audit(&input, &dir.path().join("out.csv"));
    assert!(matches!(code, 0 | 3), "exit {code}: {err}");
    let v = v.expect("a JSON report");
    let read = v["rows_read"].as_u64().unwrap() as usize;
    let audited = v["rows_audited"].as_u64().unwrap() as usize;
    let bad = v["rows_bad"].as_u64().unwrap() as usize;
    println!("rows read {read}, audited {audited}, bad {bad}");
    // A quote inserted by a mutation may join the following lines into one record (that is
    // CSV): records can merge, never split, and most rows carry no quote.
    assert!((ROWS * 9 / 10..=ROWS).contains(&read), "{read}");
    assert_eq!(audited + bad, read);
    assert!(
        audited > 10_000 && bad > 10_000,
        "audited {audited}, bad {bad}"
    );
    assert_eq!(
        std::fs::read(&input).unwrap(),
        before,
        "the input was modified"
    );
}

#[test]
fn hostile_files_are_audited_or_refused_cleanly() {
    let dir = tempfile::tempdir().unwrap();
    let header = "Fluid,Temperature (degC),Pressure,Quantity,Value\n";
    let mut cases: Vec<(&str, Vec<u8>)> = vec![
        (
            "huge_cell.csv",
            format!(
                "{header}methane,15,50 bar,density,{}\n",
                "9".repeat(4_000_000)
            )
            .into_bytes(),
        ),
        (
            "wide.csv",
            format!("{header}{}\n", vec!["1"; 5000].join(",")).into_bytes(),
        ),
        (
            "binary.csv",
            (0..20_000u32).map(|i| (i * 7919 % 256) as u8).collect(),
        ),
        (
            "quotes.csv",
            format!("{header}\"methane,15,\"50 bar,density,35\n\"\"\"\n").into_bytes(),
        ),
        ("header_only.csv", header.as_bytes().to_vec()),
        ("empty.csv", Vec::new()),
        (
            "bom_crlf.csv",
            format!(
                "\u{feff}{}methane,15,50 bar,density,35.1\r\n",
                header.replace('\n', "\r\n")
            )
            .into_bytes(),
        ),
        ("not_a_zip.xlsx", b"this is not a spreadsheet".to_vec()),
        (
            "truncated.xlsx",
            b"PK\x03\x04\x14\x00\x00\x00\x08\x00".to_vec(),
        ),
    ];
    // A well-formed zip archive holding no workbook (an empty central directory).
    cases.push((
        "empty_zip.xlsx",
        vec![
            0x50, 0x4b, 0x05, 0x06, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
        ],
    ));
    for (name, bytes) in cases {
        let input = dir.path().join(name);
        std::fs::write(&input, &bytes).unwrap();
        let out = dir.path().join(format!("out_{name}"));
        let (code, v, err) = audit(&input, &out);
        match code {
            0 | 3 => {
                let v = v.unwrap_or_else(|| panic!("{name}: no report"));
                let read = v["rows_read"].as_u64().unwrap();
                let counted = v["rows_audited"].as_u64().unwrap() + v["rows_bad"].as_u64().unwrap();
                assert_eq!(read, counted, "{name}");
            }
            2 => assert!(err.contains(name), "{name}: {err}"),
            other => panic!("{name}: exit {other}: {err}"),
        }
        assert_eq!(
            std::fs::read(&input).unwrap(),
            bytes,
            "{name}: input modified"
        );
    }
}
