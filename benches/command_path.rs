//! The command path against its kernel: `zfactor table` run as a user runs it (argument
//! parsing, the model's set-up, the states, CSV formatting, the file written), over the same
//! grids the kernel benchmarks time. The ratio to the kernel is what the command adds.
//! Run: `cargo bench --bench command_path`.
//!
//! - `pr_z_1000x1000`: the 10-component gas of `z_grid`, Peng-Robinson, Z only: kernel
//!   `z_grid::parallel`.
//! - `if97_z_300x300`, `iapws95_z_300x300`: water on its two reference formulations, Z only,
//!   90,000 states of superheated steam and compressed liquid.

use std::ffi::OsString;

/// The 10-component gas of `z_grid` (mole fractions).
const GAS: &str = "methane=0.80,ethane=0.06,propane=0.03,n-butane=0.01,isobutane=0.01,\
n-pentane=0.005,nitrogen=0.04,co2=0.03,h2s=0.005,n-hexane=0.01";

fn main() {
    divan::main();
}

fn table(fluid: &[&str], model: &str, t: &str, p: &str, out: &std::path::Path) {
    let mut args: Vec<OsString> = vec!["zfactor".into(), "table".into()];
    args.extend(fluid.iter().map(OsString::from));
    for a in [
        "-m",
        model,
        "-t",
        t,
        "-p",
        p,
        "--properties",
        "z",
        "-f",
        "csv",
        "--force",
        "-o",
    ] {
        args.push(a.into());
    }
    args.push(out.into());
    let code = zfactor::run(args).expect("the table runs");
    divan::black_box(code);
}

#[divan::bench(sample_count = 3)]
fn pr_z_1000x1000(bencher: divan::Bencher) {
    let dir = tempfile::tempdir().expect("a temporary folder");
    let out = dir.path().join("t.csv");
    bencher.bench_local(|| {
        table(
            &["--mix", GAS],
            "pr",
            "330..479.85 K n 1000",
            "1..200.8 bar n 1000",
            &out,
        )
    });
}

#[divan::bench(sample_count = 3)]
fn if97_z_300x300(bencher: divan::Bencher) {
    let dir = tempfile::tempdir().expect("a temporary folder");
    let out = dir.path().join("t.csv");
    bencher.bench_local(|| {
        table(
            &["--fluid", "water"],
            "if97",
            "300..800 K n 300",
            "1..200 bar n 300",
            &out,
        )
    });
}

#[divan::bench(sample_count = 3)]
fn iapws95_z_300x300(bencher: divan::Bencher) {
    let dir = tempfile::tempdir().expect("a temporary folder");
    let out = dir.path().join("t.csv");
    bencher.bench_local(|| {
        table(
            &["--fluid", "water"],
            "reference",
            "300..800 K n 300",
            "1..200 bar n 300",
            &out,
        )
    });
}
