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
