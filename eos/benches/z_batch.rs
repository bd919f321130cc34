//! Peng-Robinson Z at (T, P) over the yardstick's two 1000 x 1000 workloads
//! (shared/bench/yardstick_pr.py): per state (a(T) recomputed for every state, as the
//! yardstick does) and temperature repeated (`ZBatch::z_grid`, a(T) once per isotherm), on one
//! core and on all cores. The checksums are verified before timing.
//! Run: `cargo bench -p eos --bench z_batch`.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use divan::counter::ItemsCount;
use divan::Bencher;
use eos::batch::{BatchRoot, ZBatch};
use yardstick as y;

const N: usize = 1000;

fn main() {
    divan::main();
}

fn run(model: &eos::cubic::Cubic, x: &[f64], root: BatchRoot, want: f64, bencher: Bencher) {
    run_with(model, x, root, want, bencher, false)
}

fn run_with(
    model: &eos::cubic::Cubic,
    x: &[f64],
    root: BatchRoot,
    want: f64,
    bencher: Bencher,
    parallel: bool,
) {
    let (t, p) = y::grid(N, N);
    let batch = ZBatch::new(model, x).unwrap();
    let mut z = vec![0.0; t.len()];
    batch.z_tp(&t, &p, root, &mut z).unwrap();
    let sum = y::fsum(&z);
    assert!(
        ((sum - want) / want).abs() < 1e-9,
        "checksum {sum} vs yardstick {want}"
    );
    bencher.counter(ItemsCount::new(t.len())).bench_local(|| {
        if parallel {
            batch.z_tp_par(&t, &p, root, &mut z).unwrap()
        } else {
            batch.z_tp(&t, &p, root, &mut z).unwrap()
        }
    });
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn pure_largest(bencher: Bencher) {
    let (m, x) = y::pure();
    run(&m, &x, BatchRoot::Largest, y::SUM_PURE, bencher);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn pure_gibbs(bencher: Bencher) {
    let (m, x) = y::pure();
    run(&m, &x, BatchRoot::LowestGibbs, y::SUM_PURE, bencher);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn mix10_largest(bencher: Bencher) {
    let (m, x) = y::mix();
    run(&m, &x, BatchRoot::Largest, y::SUM_MIX_LARGEST, bencher);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn mix10_gibbs(bencher: Bencher) {
    let (m, x) = y::mix();
    run(&m, &x, BatchRoot::LowestGibbs, y::SUM_MIX_GIBBS, bencher);
}

/// Both workloads on every core (rayon): the target is 1.8x the one-core figure on 2 cores.
#[divan::bench(sample_count = 10, sample_size = 1)]
fn pure_largest_all_cores(bencher: Bencher) {
    let (m, x) = y::pure();
    run_with(&m, &x, BatchRoot::Largest, y::SUM_PURE, bencher, true);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn mix10_largest_all_cores(bencher: Bencher) {
    let (m, x) = y::mix();
    run_with(
        &m,
        &x,
        BatchRoot::Largest,
        y::SUM_MIX_LARGEST,
        bencher,
        true,
    );
}

/// Temperature repeated: the same grid as axes, a(T) once per isotherm.
fn run_grid(model: &eos::cubic::Cubic, x: &[f64], want: f64, bencher: Bencher, parallel: bool) {
    let (t, p) = y::grid(N, N);
    let t_axis: Vec<f64> = t.iter().step_by(N).copied().collect();
    let p_axis = &p[..N];
    let batch = ZBatch::new(model, x).unwrap();
    let mut z = vec![0.0; t.len()];
    batch
        .z_grid(&t_axis, p_axis, BatchRoot::Largest, &mut z)
        .unwrap();
    let sum = y::fsum(&z);
    assert!(
        ((sum - want) / want).abs() < 1e-9,
        "checksum {sum} vs yardstick {want}"
    );
    bencher.counter(ItemsCount::new(t.len())).bench_local(|| {
        if parallel {
            batch.z_grid_par(&t_axis, p_axis, BatchRoot::Largest, &mut z)
        } else {
            batch.z_grid(&t_axis, p_axis, BatchRoot::Largest, &mut z)
        }
        .unwrap()
    });
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn pure_grid_largest(bencher: Bencher) {
    let (m, x) = y::pure();
    run_grid(&m, &x, y::SUM_PURE, bencher, false);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn mix10_grid_largest(bencher: Bencher) {
    let (m, x) = y::mix();
    run_grid(&m, &x, y::SUM_MIX_LARGEST, bencher, false);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn pure_grid_largest_all_cores(bencher: Bencher) {
    let (m, x) = y::pure();
    run_grid(&m, &x, y::SUM_PURE, bencher, true);
}

#[divan::bench(sample_count = 10, sample_size = 1)]
fn mix10_grid_largest_all_cores(bencher: Bencher) {
    let (m, x) = y::mix();
    run_grid(&m, &x, y::SUM_MIX_LARGEST, bencher, true);
}
