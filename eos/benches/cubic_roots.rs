//! Timing of the closed-form cubic solver `eos::cubic::roots::solve_cubic` alone, on three
//! sets of 256 monic cubics built from their roots: three well-separated real roots, one real
//! root with a complex pair, and a near-double pair beside a small root (a state next to a
//! spinodal). Divan reports the time per cubic (items).
//! Run: `cargo bench -p eos --bench cubic_roots`.

use divan::black_box;
use divan::counter::ItemsCount;
use divan::Bencher;
use eos::cubic::roots::solve_cubic;

const SET: usize = 256;

fn main() {
    divan::main();
}

/// Coefficients (c2, c1, c0) of (Z - r0)(Z - r1)(Z - r2).
fn from_roots(r: [f64; 3]) -> (f64, f64, f64) {
    (
        -(r[0] + r[1] + r[2]),
        r[0] * r[1] + r[0] * r[2] + r[1] * r[2],
        -r[0] * r[1] * r[2],
    )
}

fn frac(k: usize) -> f64 {
    k as f64 / SET as f64
}

fn three_real() -> Vec<(f64, f64, f64)> {
    (0..SET)
        .map(|k| {
            from_roots([
                0.01 + 0.05 * frac(k),
                0.2 + 0.2 * frac(k),
                0.6 + 0.4 * frac(k),
            ])
        })
        .collect()
}

fn one_real() -> Vec<(f64, f64, f64)> {
    // (Z - r)(Z^2 + 2 s Z + s^2 + e), e > 0: one real root r, a complex pair at -s +- i sqrt(e).
    (0..SET)
        .map(|k| {
            let (r, s, e) = (0.3 + 0.7 * frac(k), 0.05, 0.01 + 0.1 * frac(k));
            (2.0 * s - r, s * s + e - 2.0 * s * r, -r * (s * s + e))
        })
        .collect()
}

fn near_double() -> Vec<(f64, f64, f64)> {
    (0..SET)
        .map(|k| from_roots([0.05, 0.6, 0.6 + 1e-9 * (1 + k) as f64]))
        .collect()
}

fn run(bencher: Bencher, set: Vec<(f64, f64, f64)>) {
    bencher.counter(ItemsCount::new(SET)).bench_local(|| {
        let mut acc = 0.0;
        for &(c2, c1, c0) in black_box(&set) {
            acc += solve_cubic(c2, c1, c0).largest();
        }
        acc
    });
}

#[divan::bench]
fn three_real_roots(bencher: Bencher) {
    run(bencher, three_real());
}

#[divan::bench]
fn one_real_root(bencher: Bencher) {
    run(bencher, one_real());
}

#[divan::bench]
fn near_double_root(bencher: Bencher) {
    run(bencher, near_double());
}
