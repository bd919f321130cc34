//! Timing of every shipped Helmholtz formulation at one supercritical or gas state each:
//! properties at (T, rho) (one evaluation of phi0, phir and their derivatives) and at (T, p)
//! (the density solve first). `args` is the formulation key (`eos::helmholtz::keys`).
//! Run: `cargo bench -p eos --bench reference_formulations`.

use divan::black_box;
use divan::Bencher;
use eos::helmholtz::{formulation, HelmholtzFluid};

const KEYS: [&str; 11] = [
    "water-iapws95",
    "nitrogen-span2000",
    "carbon-dioxide-span-wagner1996",
    "methane-setzmann-wagner1991",
    "argon-tegeler1999",
    "hydrogen-normal-leachman2009",
    "hydrogen-para-leachman2009",
    "nitrogen-sw2003",
    "carbon-dioxide-sw2003",
    "methane-sw2003",
    "argon-sw2003",
];

fn main() {
    divan::main();
}

/// (T in K, p in Pa) of the timed state: superheated steam for water, 10 MPa at 350 K for
/// carbon dioxide (supercritical), 10 MPa at 300 K for the others.
fn state(key: &str) -> (f64, f64) {
    match key {
        "water-iapws95" => (500.0, 1e6),
        k if k.starts_with("carbon-dioxide") => (350.0, 10e6),
        _ => (300.0, 10e6),
    }
}

fn fluid(key: &str) -> HelmholtzFluid {
    HelmholtzFluid::new(formulation(key).unwrap())
}

#[divan::bench(args = KEYS)]
fn t_rho(bencher: Bencher, key: &str) {
    let f = fluid(key);
    let (t, p) = state(key);
    let rho = f.density(t, p).unwrap();
    bencher.bench_local(|| {
        let s = f.properties(black_box(t), black_box(rho)).unwrap();
        s.p + s.h + s.cp.unwrap_or(0.0)
    });
}

#[divan::bench(args = KEYS)]
fn t_p(bencher: Bencher, key: &str) {
    let f = fluid(key);
    let (t, p) = state(key);
    bencher.bench_local(|| {
        let s = f.properties_tp(black_box(t), black_box(p)).unwrap();
        s.rho + s.h
    });
}
