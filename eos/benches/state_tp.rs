//! Peng-Robinson per state: Z at (T, P) through the general single-state API
//! (`State::at_tp`, every property and the phase name) against the batch kernel
//! (`ZBatch::z_tp`, Z only), for the yardstick's pure fluid and 10-component gas; and the
//! fugacity coefficients of the 10-component gas (`Model::ln_phi`). Each sample evaluates
//! the same 64 states spread over the yardstick's range (200-400 K, 1-300 bar); divan
//! reports the time per state (items). Grouped by size: `args` is the number of components.
//! Run: `cargo bench -p eos --bench state_tp`.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use divan::black_box;
use divan::counter::ItemsCount;
use divan::Bencher;
use eos::batch::{BatchRoot, ZBatch};
use eos::cubic::Cubic;
use eos::state::{RootChoice, State};
use eos::Model;
use yardstick as y;

const SIZES: [usize; 2] = [1, 10];

fn main() {
    divan::main();
}

fn model(n: usize) -> (Cubic, Vec<f64>) {
    if n == 1 {
        y::pure()
    } else {
        y::mix()
    }
}

/// 8 temperatures x 8 pressures of the yardstick's range.
fn states() -> (Vec<f64>, Vec<f64>) {
    let (t, p) = y::grid(8, 8);
    (t, p)
}

#[divan::bench(args = SIZES)]
fn state_at_tp(bencher: Bencher, n: usize) {
    let (m, x) = model(n);
    let (t, p) = states();
    bencher.counter(ItemsCount::new(t.len())).bench_local(|| {
        let mut acc = 0.0;
        for (&tk, &pk) in black_box(&t).iter().zip(&p) {
            acc += State::at_tp(&m, tk, pk, &x, RootChoice::LowestGibbs)
                .map(|s| s.props.z)
                .unwrap_or(0.0);
        }
        acc
    });
}

#[divan::bench(args = SIZES)]
fn batch_per_state(bencher: Bencher, n: usize) {
    let (m, x) = model(n);
    let (t, p) = states();
    let b = ZBatch::new(&m, &x).unwrap();
    let mut z = vec![0.0; t.len()];
    bencher.counter(ItemsCount::new(t.len())).bench_local(|| {
        b.z_tp(black_box(&t), &p, BatchRoot::LowestGibbs, &mut z)
            .unwrap();
        z[0]
    });
}

#[divan::bench(args = SIZES)]
fn ln_phi(bencher: Bencher, n: usize) {
    let (m, x) = model(n);
    let (t, p) = states();
    let rho: Vec<f64> = t
        .iter()
        .zip(&p)
        .map(|(&tk, &pk)| {
            State::at_tp(&m, tk, pk, &x, RootChoice::LowestGibbs)
                .unwrap()
                .props
                .rho
        })
        .collect();
    let mut out = vec![0.0; n];
    bencher.counter(ItemsCount::new(t.len())).bench_local(|| {
        let mut acc = 0.0;
        for (&tk, &rk) in black_box(&t).iter().zip(&rho) {
            m.ln_phi(tk, rk, &x, &mut out);
            acc += out[0];
        }
        acc
    });
}
