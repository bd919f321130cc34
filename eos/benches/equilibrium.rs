//! Timing of the phase-equilibrium solvers on the 10-component natural gas of the yardstick
//! (eos/tests/support/yardstick.rs, Peng-Robinson with its k_ij), one core:
//!
//! - a two-phase (T, P) flash from a cold start (stability test, substitution, Newton);
//! - the stability test alone on a stable feed (the pipeline state 300 K, 70 bar);
//! - the full phase envelope from 1 bar round the critical point.
//!
//! Each workload checks its answer before it is timed. Run:
//! `cargo bench -p eos --bench equilibrium`.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use divan::black_box;
use eos::cubic::Cubic;
use eos::equilibrium::{envelope, flash, stability, EnvelopeOptions, EnvelopeStop};
use std::sync::LazyLock;

static GAS: LazyLock<(Cubic, Vec<f64>)> = LazyLock::new(yardstick::mix);

/// A state inside the gas's envelope (PR puts its cricondentherm near 280 K): about 8 %
/// liquid at 230 K and 40 bar (vapour fraction 0.92).
const SPLIT_T: f64 = 230.0;
const SPLIT_P: f64 = 40e5;

/// The pipeline state, single-phase gas.
const STABLE_T: f64 = 300.0;
const STABLE_P: f64 = 70e5;

fn main() {
    let (m, z) = &*GAS;
    match flash::tp(m, SPLIT_T, SPLIT_P, z).unwrap() {
        flash::FlashResult::TwoPhase(s) => eprintln!(
            "flash at {SPLIT_T} K, {} bar: vapour fraction {:.4}, {} iterations",
            SPLIT_P / 1e5,
            s.vapor_fraction,
            s.iterations
        ),
        flash::FlashResult::SinglePhase(_) => panic!("the split state is one phase"),
    }
    let st = stability::test(m, STABLE_T, STABLE_P, z).unwrap();
    assert!(st.stable);
    eprintln!(
        "stability at {STABLE_T} K, {} bar: stable, {} trials, {} iterations",
        STABLE_P / 1e5,
        st.trials,
        st.iterations
    );
    let e = envelope::trace(m, z, EnvelopeOptions::default()).unwrap();
    assert_eq!(e.stop, EnvelopeStop::Complete);
    eprintln!(
        "envelope: {} points, {} Newton iterations, cricondentherm {:.2} K",
        e.points.len(),
        e.iterations,
        e.cricondentherm.t
    );
    divan::main();
}

#[divan::bench]
fn flash_tp_two_phase_10_components() -> f64 {
    let (m, z) = &*GAS;
    match flash::tp(m, black_box(SPLIT_T), black_box(SPLIT_P), z) {
        Ok(flash::FlashResult::TwoPhase(s)) => s.vapor_fraction,
        _ => f64::NAN,
    }
}

#[divan::bench]
fn stability_test_stable_feed_10_components() -> bool {
    let (m, z) = &*GAS;
    stability::test(m, black_box(STABLE_T), black_box(STABLE_P), z).is_ok_and(|s| s.stable)
}

#[divan::bench(sample_count = 20)]
fn envelope_10_components() -> usize {
    let (m, z) = &*GAS;
    envelope::trace(m, black_box(z), EnvelopeOptions::default()).map_or(0, |e| e.points.len())
}
