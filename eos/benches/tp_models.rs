//! Timing of the (T, P)-explicit models per state: IAPWS-IF97 in regions 1 and 2
//! (`eos::if97::props_tp`, every property; target <= 0.3 us), and Z alone from the
//! correlations, Lee-Kesler (`LeeKesler::state_tp`), the truncated virial equation
//! (`Virial::z_pressure_explicit`, Tsonopoulos), Dranchuk-Abou-Kassem and Hall-Yarborough
//! (`gas_gravity::z_tp`, gravity 0.65, Sutton pseudo-critical point), against Peng-Robinson on
//! the same states (target: within 3x of Peng-Robinson's per-state cost). Every correlation
//! is timed on the same 64 gas states, 250-400 K and 10-50 bar, inside every model's range
//! (the virial series' density limit, the fitted range of DAK and HY); divan reports the time
//! per state (items). `args` is the number of components where a model takes a composition.
//! Run: `cargo bench -p eos --bench tp_models`.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use divan::black_box;
use divan::counter::ItemsCount;
use divan::Bencher;
use eos::batch::{BatchRoot, ZBatch};
use eos::cubic::Cubic;
use eos::gas_gravity::{z_tp, GasSpec, GravityCorrelation, ZCorrelation};
use eos::if97::{props_tp, region_tp, Region};
use eos::lee_kesler::LeeKesler;
use eos::state::{RootChoice, State};
use eos::virial::{Correlation, Virial};
use eos::Model;
use yardstick as y;

const SIZES: [usize; 2] = [1, 10];
const N: usize = 8;

fn main() {
    divan::main();
}

fn lin(lo: f64, hi: f64, k: usize) -> f64 {
    lo + (hi - lo) * k as f64 / (N - 1) as f64
}

/// N x N states, T in [t_lo, t_hi] K outer, P in [p_lo, p_hi] Pa inner.
fn states(t_lo: f64, t_hi: f64, p_lo: f64, p_hi: f64) -> Vec<(f64, f64)> {
    (0..N * N)
        .map(|k| (lin(t_lo, t_hi, k / N), lin(p_lo, p_hi, k % N)))
        .collect()
}

/// The correlations' common gas states.
fn gas() -> Vec<(f64, f64)> {
    states(250.0, 400.0, 10e5, 50e5)
}

fn cubic(n: usize) -> (Cubic, Vec<f64>) {
    if n == 1 {
        y::pure()
    } else {
        y::mix()
    }
}

fn per_state(bencher: Bencher, s: &[(f64, f64)], f: impl Fn(f64, f64) -> f64) {
    bencher.counter(ItemsCount::new(s.len())).bench_local(|| {
        let mut acc = 0.0;
        for &(t, p) in black_box(s) {
            acc += f(t, p);
        }
        acc
    });
}

mod if97 {
    use super::*;

    fn run(bencher: Bencher, s: Vec<(f64, f64)>, want: Region) {
        assert!(s.iter().all(|&(t, p)| region_tp(t, p).unwrap() == want));
        per_state(bencher, &s, |t, p| {
            props_tp(t, p).map(|s| s.rho).unwrap_or(0.0)
        });
    }

    /// Compressed liquid, 280-600 K, 20-80 MPa.
    #[divan::bench]
    fn region1(bencher: Bencher) {
        run(bencher, states(280.0, 600.0, 20e6, 80e6), Region::One);
    }

    /// Vapour, 400-800 K, 10-200 kPa.
    #[divan::bench]
    fn region2(bencher: Bencher) {
        run(bencher, states(400.0, 800.0, 10e3, 200e3), Region::Two);
    }
}

mod z_only {
    use super::*;

    #[divan::bench(args = SIZES)]
    fn pr_state_at_tp(bencher: Bencher, n: usize) {
        let (m, x) = cubic(n);
        per_state(bencher, &gas(), |t, p| {
            State::at_tp(&m, t, p, &x, RootChoice::LowestGibbs)
                .map(|s| s.props.z)
                .unwrap_or(0.0)
        });
    }

    #[divan::bench(args = SIZES)]
    fn pr_densities(bencher: Bencher, n: usize) {
        // The cubic's own density roots (closed form), the least a single-state Z needs.
        let (m, x) = cubic(n);
        per_state(bencher, &gas(), |t, p| {
            m.densities(t, p, &x)
                .as_slice()
                .first()
                .copied()
                .unwrap_or(0.0)
        });
    }

    #[divan::bench(args = SIZES)]
    fn pr_batch(bencher: Bencher, n: usize) {
        let (m, x) = cubic(n);
        let b = ZBatch::new(&m, &x).unwrap();
        let s = gas();
        let (t, p): (Vec<f64>, Vec<f64>) = s.iter().copied().unzip();
        let mut z = vec![0.0; s.len()];
        bencher.counter(ItemsCount::new(s.len())).bench_local(|| {
            b.z_tp(black_box(&t), &p, BatchRoot::LowestGibbs, &mut z)
                .unwrap();
            z[0]
        });
    }

    #[divan::bench(args = SIZES)]
    fn lee_kesler(bencher: Bencher, n: usize) {
        let (m, x) = cubic(n);
        let lk = LeeKesler::new(m.components(), None).unwrap();
        per_state(bencher, &gas(), |t, p| {
            lk.state_tp(t, p, &x, RootChoice::LowestGibbs)
                .map(|s| s.z)
                .unwrap_or(0.0)
        });
    }

    #[divan::bench(args = SIZES)]
    fn virial(bencher: Bencher, n: usize) {
        let (m, x) = cubic(n);
        let v = Virial::new(m.components(), Correlation::Tsonopoulos, None).unwrap();
        let s = gas();
        assert!(s
            .iter()
            .all(|&(t, p)| v.z_pressure_explicit(t, p, &x).is_ok()));
        per_state(bencher, &s, |t, p| {
            v.z_pressure_explicit(t, p, &x).unwrap_or(0.0)
        });
    }

    fn gravity(bencher: Bencher, z: ZCorrelation) {
        let spec = GasSpec {
            gravity: 0.65,
            y_co2: 0.0,
            y_h2s: 0.0,
            y_n2: 0.0,
            pseudo_critical: GravityCorrelation::Sutton,
            z,
        };
        let s = gas();
        // Inside the fitted range: no warning is raised (and none allocated).
        assert!(s
            .iter()
            .all(|&(t, p)| z_tp(&spec, t, p).unwrap().warnings.is_empty()));
        per_state(bencher, &s, |t, p| {
            z_tp(&spec, t, p).map(|g| g.z).unwrap_or(0.0)
        });
    }

    #[divan::bench]
    fn dak(bencher: Bencher) {
        gravity(bencher, ZCorrelation::Dak);
    }

    #[divan::bench]
    fn hall_yarborough(bencher: Bencher) {
        gravity(bencher, ZCorrelation::HallYarborough);
    }
}
