//! An interrupted or killed run (Ctrl-C's SIGINT, SIGTERM, SIGHUP) leaves no partial output
//! file: the output is written to a temporary file and renamed only when complete, and the
//! signal handler removes any temporary file before the process exits.

#![cfg(unix)]

use std::process::Command;
use std::time::{Duration, Instant};

#[test]
fn ctrl_c_leaves_no_file_behind() {
    leaves_no_file_behind("INT");
}

#[test]
fn termination_and_hangup_leave_no_file_behind() {
    // SIGTERM and SIGHUP once left the hidden temporary file behind.
    leaves_no_file_behind("TERM");
    leaves_no_file_behind("HUP");
}

fn leaves_no_file_behind(signal: &str) {
    let dir = tempfile::tempdir().unwrap();
    let out = dir.path().join("basis.csv");
    // A long design table: 4,000,000 states of a mixture (the largest grid accepted; some
    // ten seconds of work on two cores, so that it is still running when interrupted).
    let mut child = Command::new(env!("CARGO_BIN_EXE_zfactor"))
        .args([
            "table",
            "--mix",
            "methane=0.8,ethane=0.1,propane=0.05,n-butane=0.05",
            "--temperatures",
            "200..400 K n 2000",
            "--pressures",
            "1..200 bar n 2000",
            "--model",
            "pr",
            "--properties",
            "z,density,h",
            "--format",
            "csv",
            "--output",
        ])
        .arg(&out)
        .spawn()
        .unwrap();
    std::thread::sleep(Duration::from_millis(800));
    let status = Command::new("kill")
        .args([&format!("-{signal}"), &child.id().to_string()])
        .status()
        .unwrap();
    assert!(status.success());
    let start = Instant::now();
    let code = loop {
        if let Some(s) = child.try_wait().unwrap() {
            break s.code();
        }
        assert!(
            start.elapsed() < Duration::from_secs(30),
            "no exit after SIG{signal}"
        );
        std::thread::sleep(Duration::from_millis(20));
    };
    assert_eq!(code, Some(130), "exit status after SIG{signal}");
    let left: Vec<_> = std::fs::read_dir(dir.path()).unwrap().collect();
    assert!(left.is_empty(), "files left behind: {left:?}");
}
