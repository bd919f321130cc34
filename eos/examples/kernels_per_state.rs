//! Timing for the speed report's overhead ratios (`.ci/speed-report`): each model family's
//! kernel on one thread over the grids of the `zfactor table` commands the report times, so
//! that command time / kernel time is what the command path adds (parsing, set-up, range
//! flags, CSV) per state. Z only, the root of lowest Gibbs energy:
//!
//! - `if97`: water, `eos::if97::props_tp` (every property of the region's equation),
//!   300-600 K x 1-200 bar, 300 x 300;
//! - `iapws95`: water, `HelmholtzFluid::density` (the branch named by the ancillary, both
//!   where it cannot tell), same grid;
//! - `pr`: the yardstick's methane-like fluid (its constants differ from the component
//!   table's methane in the fourth digit; the work per state is the same), the batch kernel
//!   over the grid (`ZBatch::z_grid`), 200-400 K x 1-200 bar, 300 x 300;
//! - `lk`: the same fluid, `LeeKesler::state_tp`, same grid.
//!
//! One line per family, `key=value`: `kernel family=if97 states=90000 median_s=...
//! per_state_s=... runs=N checksum=...`. Run: `cargo run --release -p eos --example
//! kernels_per_state -- [--runs N]`.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use eos::batch::{BatchRoot, ZBatch};
use eos::helmholtz::{formulation, HelmholtzFluid};
use eos::lee_kesler::LeeKesler;
use eos::state::RootChoice;
use eos::Model;
use std::hint::black_box;
use std::time::Instant;

/// `n` values from `lo` to `hi`, both included (as the command line's "lo..hi n N").
fn axis(lo: f64, hi: f64, n: usize) -> Vec<f64> {
    (0..n)
        .map(|k| lo + (hi - lo) * k as f64 / (n - 1) as f64)
        .collect()
}

/// The sum of `f(t, p)` over every temperature with every pressure, states one at a time.
fn over_grid(t: &[f64], p: &[f64], f: impl Fn(f64, f64) -> f64) -> f64 {
    let mut sum = 0.0;
    for &ti in t {
        for &pj in p {
            sum += f(ti, pj);
        }
    }
    sum
}

fn median(mut v: Vec<f64>) -> f64 {
    v.sort_by(f64::total_cmp);
    v[v.len() / 2]
}

/// Median time of `runs` calls of `f` after one untimed call, and the last call's result.
fn time(runs: usize, mut f: impl FnMut() -> f64) -> (f64, f64) {
    let mut sum = f();
    let mut times = Vec::with_capacity(runs);
    for _ in 0..runs {
        let start = Instant::now();
        sum = black_box(f());
        times.push(start.elapsed().as_secs_f64());
    }
    (median(times), sum)
}

fn report(family: &str, states: usize, runs: usize, (m, sum): (f64, f64)) {
    println!(
        "kernel family={family} states={states} median_s={m:.6e} per_state_s={:.6e} runs={runs} \
         checksum={sum}",
        m / states as f64
    );
}

fn main() {
    let mut runs = 5;
    let mut args = std::env::args().skip(1);
    while let Some(flag) = args.next() {
        match (
            flag.as_str(),
            args.next().and_then(|v| v.parse::<usize>().ok()),
        ) {
            ("--runs", Some(n)) if n > 0 => runs = n,
            _ => {
                eprintln!("usage: kernels_per_state [--runs N]");
                std::process::exit(2);
            }
        }
    }
    let (tw, pw) = (axis(300.0, 600.0, 300), axis(1e5, 200e5, 300));
    let (tm, pm) = (axis(200.0, 400.0, 300), axis(1e5, 200e5, 300));
    let n = tw.len() * pw.len();

    report(
        "if97",
        n,
        runs,
        time(runs, || {
            over_grid(&tw, &pw, |t, p| {
                eos::if97::props_tp(t, p).map_or(0.0, |s| s.z)
            })
        }),
    );

    let water = HelmholtzFluid::new(formulation("water-iapws95").expect("IAPWS-95 is shipped"));
    let rw = water.formulation().r;
    report(
        "iapws95",
        n,
        runs,
        time(runs, || {
            over_grid(&tw, &pw, |t, p| {
                water.density(t, p).map_or(0.0, |rho| p / (rho * rw * t))
            })
        }),
    );

    let (pr, x) = yardstick::pure();
    let batch = ZBatch::new(&pr, &x).expect("PR is a batch member");
    let mut z = vec![0.0; n];
    report(
        "pr",
        n,
        runs,
        time(runs, || {
            batch
                .z_grid(&tm, &pm, BatchRoot::LowestGibbs, &mut z)
                .map_or(0.0, |()| z.iter().sum())
        }),
    );

    let lk = LeeKesler::new(pr.components(), None).expect("Lee-Kesler for the fluid");
    report(
        "lk",
        n,
        runs,
        time(runs, || {
            over_grid(&tm, &pm, |t, p| {
                lk.state_tp(t, p, &[1.0], RootChoice::LowestGibbs)
                    .map_or(0.0, |s| s.z)
            })
        }),
    );
}
