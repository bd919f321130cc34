//! The batch kernel reproduces the checksums of the Python/NumPy yardstick
//! (shared/bench/yardstick_pr.py, checksums in its README; another correct implementation
//! matches to about 1e-9 relative, a different root choice shows above 1e-6).

mod support;

use eos::batch::{BatchRoot, ZBatch};
use eos::state::{RootChoice, State};
use support::yardstick as y;

fn checksum(model: &eos::cubic::Cubic, x: &[f64], n: usize, root: BatchRoot) -> f64 {
    let (t, p) = y::grid(n, n);
    let mut z = vec![0.0; t.len()];
    ZBatch::new(model, x)
        .unwrap()
        .z_tp(&t, &p, root, &mut z)
        .unwrap();
    y::fsum(&z)
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn mixture_checksums_on_the_100_by_100_grid() {
    let (m, x) = y::mix();
    let s = checksum(&m, &x, 100, BatchRoot::Largest);
    assert!(rel(s, y::SUM_MIXLOOP_LARGEST) < 1e-9, "{s}");
    let s = checksum(&m, &x, 100, BatchRoot::LowestGibbs);
    assert!(rel(s, y::SUM_MIXLOOP_GIBBS) < 1e-9, "{s}");
}

#[test]
fn pure_checksum_on_the_1000_by_1000_grid() {
    let (m, x) = y::pure();
    let s = checksum(&m, &x, 1000, BatchRoot::Largest);
    assert!(rel(s, y::SUM_PURE) < 1e-9, "{s}");
}

#[test]
fn batch_agrees_with_the_single_state_path() {
    // Same model, two code paths: the batch kernel and State::at_tp with its root choice.
    let (m, x) = y::mix();
    let (t, p) = y::grid(23, 17);
    let mut z = vec![0.0; t.len()];
    ZBatch::new(&m, &x)
        .unwrap()
        .z_tp(&t, &p, BatchRoot::LowestGibbs, &mut z)
        .unwrap();
    for k in 0..t.len() {
        let s = State::at_tp(&m, t[k], p[k], &x, RootChoice::LowestGibbs).unwrap();
        assert!(
            (s.props.z - z[k]).abs() < 1e-12,
            "{} {}: {} vs {}",
            t[k],
            p[k],
            s.props.z,
            z[k]
        );
    }
}

#[test]
fn bad_states_in_a_batch_are_refused() {
    let (m, x) = y::pure();
    let b = ZBatch::new(&m, &x).unwrap();
    let mut out = [0.0; 2];
    assert!(b
        .z_tp(
            &[300.0, f64::NAN],
            &[1e5, 1e5],
            BatchRoot::Largest,
            &mut out
        )
        .is_err());
    assert!(b
        .z_tp(&[300.0], &[1e5, 1e5], BatchRoot::Largest, &mut out)
        .is_err());
}

#[test]
fn parallel_batch_is_identical_to_the_serial_one() {
    // Same states, same order, bit for bit (states are independent).
    let (m, x) = y::mix();
    let (t, p) = y::grid(211, 97);
    let b = ZBatch::new(&m, &x).unwrap();
    let (mut a, mut c) = (vec![0.0; t.len()], vec![0.0; t.len()]);
    b.z_tp(&t, &p, BatchRoot::LowestGibbs, &mut a).unwrap();
    b.z_tp_par(&t, &p, BatchRoot::LowestGibbs, &mut c).unwrap();
    assert!(a.iter().zip(&c).all(|(u, v)| u.to_bits() == v.to_bits()));
}

/// Axes of the yardstick grid (T outer, P inner), n_t x n_p.
fn axes(nt: usize, np: usize) -> (Vec<f64>, Vec<f64>) {
    let (t, p) = y::grid(nt, np);
    let t_axis = t.iter().step_by(np).copied().collect();
    (t_axis, p[..np].to_vec())
}

#[test]
fn temperature_repeated_grid_is_identical_to_the_per_state_kernel() {
    // a(T) once per isotherm against a(T) per state: the same arithmetic, so the same bits.
    // Sizes that are not multiples of the block (23 x 17, 5 x 3) exercise the padded blocks.
    for (m, x) in [y::pure(), y::mix()] {
        let b = ZBatch::new(&m, &x).unwrap();
        for (nt, np) in [(23, 17), (5, 3), (40, 64)] {
            let (t, p) = y::grid(nt, np);
            let (ta, pa) = axes(nt, np);
            for root in [BatchRoot::Largest, BatchRoot::LowestGibbs] {
                let (mut per_state, mut grid, mut grid_par) =
                    (vec![0.0; t.len()], vec![0.0; t.len()], vec![0.0; t.len()]);
                b.z_tp(&t, &p, root, &mut per_state).unwrap();
                b.z_grid(&ta, &pa, root, &mut grid).unwrap();
                b.z_grid_par(&ta, &pa, root, &mut grid_par).unwrap();
                for k in 0..t.len() {
                    assert_eq!(per_state[k].to_bits(), grid[k].to_bits(), "{k} {root:?}");
                    assert_eq!(grid[k].to_bits(), grid_par[k].to_bits(), "{k} {root:?}");
                }
            }
        }
    }
}

#[test]
fn temperature_repeated_grid_reproduces_the_mixture_checksums() {
    // Yardstick README checksums, 100 x 100 mixture grid, through the isotherm path.
    let (m, x) = y::mix();
    let b = ZBatch::new(&m, &x).unwrap();
    let (ta, pa) = axes(100, 100);
    let mut z = vec![0.0; 100 * 100];
    b.z_grid(&ta, &pa, BatchRoot::Largest, &mut z).unwrap();
    assert!(rel(y::fsum(&z), y::SUM_MIXLOOP_LARGEST) < 1e-9);
    b.z_grid(&ta, &pa, BatchRoot::LowestGibbs, &mut z).unwrap();
    assert!(rel(y::fsum(&z), y::SUM_MIXLOOP_GIBBS) < 1e-9);
}

#[test]
fn a_state_does_not_depend_on_its_neighbours() {
    // Each state alone (a padded block) gives the bits it gets inside a full batch.
    let (m, x) = y::mix();
    let b = ZBatch::new(&m, &x).unwrap();
    let (t, p) = y::grid(13, 11);
    let mut all = vec![0.0; t.len()];
    b.z_tp(&t, &p, BatchRoot::LowestGibbs, &mut all).unwrap();
    for k in 0..t.len() {
        let mut one = [0.0];
        b.z_tp(&t[k..=k], &p[k..=k], BatchRoot::LowestGibbs, &mut one)
            .unwrap();
        assert_eq!(one[0].to_bits(), all[k].to_bits(), "state {k}");
    }
}

#[test]
fn bad_grids_are_refused() {
    let (m, x) = y::pure();
    let b = ZBatch::new(&m, &x).unwrap();
    let mut out = [0.0; 4];
    assert!(b
        .z_grid(
            &[300.0, 310.0],
            &[1e5, 2e5],
            BatchRoot::Largest,
            &mut out[..3]
        )
        .is_err());
    assert!(b
        .z_grid(&[300.0, -1.0], &[1e5, 2e5], BatchRoot::Largest, &mut out)
        .is_err());
    assert!(b
        .z_grid_par(
            &[300.0, 310.0],
            &[1e5, f64::INFINITY],
            BatchRoot::Largest,
            &mut out
        )
        .is_err());
    assert!(b
        .z_isotherm(300.0, &[1e5, 2e5], BatchRoot::Largest, &mut out[..1])
        .is_err());
}

#[test]
fn every_kind_of_bad_state_is_refused_wherever_it_sits() {
    // Zero, negative zero, negatives, infinities and NaN, in T or in P, in a full block or in
    // the short tail; the smallest positive subnormal is a valid (if absurd) input.
    let (m, x) = y::pure();
    let b = ZBatch::new(&m, &x).unwrap();
    let n = 37;
    let mut out = vec![0.0; n];
    for bad in [0.0, -0.0, -1.0, f64::INFINITY, f64::NEG_INFINITY, f64::NAN] {
        for at in [0, 9, n - 1] {
            let (mut t, mut p) = (vec![300.0; n], vec![1e5; n]);
            t[at] = bad;
            assert!(b.z_tp(&t, &p, BatchRoot::Largest, &mut out).is_err());
            assert!(b.z_tp_par(&t, &p, BatchRoot::Largest, &mut out).is_err());
            t[at] = 300.0;
            p[at] = bad;
            assert!(b.z_tp(&t, &p, BatchRoot::Largest, &mut out).is_err());
            assert!(b
                .z_isotherm(300.0, &p, BatchRoot::Largest, &mut out)
                .is_err());
        }
    }
    let p = vec![f64::from_bits(1); n];
    assert!(b
        .z_tp(&vec![300.0; n], &p, BatchRoot::Largest, &mut out)
        .is_ok());
    // Ideal-gas limit: Z -> 1 as P -> 0.
    assert!(out.iter().all(|z| (z - 1.0).abs() < 1e-12));
}

#[test]
fn every_supported_member_agrees_with_the_single_state_path_up_to_high_temperature() {
    // The batch folds the mixing sum into a quadratic in sqrt(T); State::at_tp sums it term by
    // term (Cubic::mix). Same model, two code paths, over 150-2000 K (reduced temperatures up
    // to 16 for nitrogen, where the folded terms cancel most) and 0.1-500 bar.
    use eos::cubic::{Cubic, CubicKind};
    let (m, x) = y::mix();
    let comps = eos::Model::components(&m).to_vec();
    let kij: Vec<f64> = m.one_minus_kij().iter().map(|v| 1.0 - v).collect();
    for kind in [
        CubicKind::Vdw,
        CubicKind::Srk,
        CubicKind::Pr76,
        CubicKind::Pr78,
    ] {
        let model = Cubic::new(kind, &comps, Some(&kij)).unwrap();
        let b = ZBatch::new(&model, &x).unwrap();
        let t: Vec<f64> = (0..30).map(|i| 150.0 + 1850.0 * i as f64 / 29.0).collect();
        let p: Vec<f64> = (0..25)
            .map(|j| 1e4 * 5000f64.powf(j as f64 / 24.0))
            .collect();
        let mut z = vec![0.0; t.len() * p.len()];
        b.z_grid(&t, &p, BatchRoot::LowestGibbs, &mut z).unwrap();
        for (i, &ti) in t.iter().enumerate() {
            for (j, &pj) in p.iter().enumerate() {
                let s = State::at_tp(&model, ti, pj, &x, RootChoice::LowestGibbs).unwrap();
                let zb = z[i * p.len() + j];
                assert!(
                    (s.props.z - zb).abs() < 1e-11 * s.props.z,
                    "{kind:?} {ti} K {pj} Pa: {} vs {zb}",
                    s.props.z
                );
            }
        }
    }
}

#[test]
fn every_instruction_set_level_gives_the_same_bits() {
    // The kernels compiled for AVX2 and AVX-512 (run where this processor has them) must give
    // exactly the baseline's numbers: only the vector width differs, never the arithmetic.
    use eos::cpu::{available, Level};
    for (m, x) in [y::mix(), y::pure()] {
        let batch = ZBatch::new(&m, &x).unwrap();
        let (t, p) = y::grid(40, 37);
        let (ta, pa): (Vec<f64>, Vec<f64>) = {
            let ts: Vec<f64> = (0..40).map(|i| t[i * 37]).collect();
            (ts, p[..37].to_vec())
        };
        for root in [BatchRoot::Largest, BatchRoot::LowestGibbs] {
            let mut base = vec![0.0; t.len()];
            batch.z_tp_at(Level::Base, &t, &p, root, &mut base).unwrap();
            let mut base_grid = vec![0.0; ta.len() * pa.len()];
            batch
                .z_grid_at(Level::Base, &ta, &pa, root, &mut base_grid)
                .unwrap();
            for level in available() {
                let mut z = vec![0.0; t.len()];
                batch.z_tp_at(level, &t, &p, root, &mut z).unwrap();
                let mut g = vec![0.0; base_grid.len()];
                batch.z_grid_at(level, &ta, &pa, root, &mut g).unwrap();
                for k in 0..z.len() {
                    assert_eq!(z[k].to_bits(), base[k].to_bits(), "{level:?} state {k}");
                }
                for k in 0..g.len() {
                    assert_eq!(g[k].to_bits(), base_grid[k].to_bits(), "{level:?} grid {k}");
                }
            }
        }
    }
}
