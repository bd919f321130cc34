//! The speed target of a phase-checked comparison grid: a 10-component natural gas with
//! Peng-Robinson over a 1000 x 1000 T-P grid (200-400 K, 1-300 bar, where about a tenth of
//! the states split into two phases), every state phase-checked
//! (`zfactor::compare::engine::evaluate`: the envelope screen, a flash where a state is
//! inside or near the envelope, the state's properties otherwise) on all cores.
//! Run: `cargo bench --bench phase_checked_grid` (target: <= 3 s on 2 cores).

use divan::Bencher;
use eos::phase::Phase;
use zfactor::cli::Basis;
use zfactor::compare::engine::{evaluate, Against, Answer, PointInput};

/// The 10-component gas of the speed yardstick, by component name (mole fractions).
const GAS: &str = "nitrogen=0.015,carbon dioxide=0.01,methane=0.855,ethane=0.07,\
propane=0.03,isobutane=0.005,n-butane=0.007,isopentane=0.002,n-pentane=0.002,n-hexane=0.004";

fn main() {
    divan::main();
}

fn points() -> Vec<PointInput> {
    let mut v = Vec::with_capacity(1_000_000);
    for i in 0..1000 {
        for j in 0..1000 {
            v.push(PointInput {
                t: 200.0 + 0.2 * i as f64,
                p: 1e5 + 299e5 * j as f64 / 999.0,
                data: None,
                two_phase: false,
            });
        }
    }
    v
}

#[divan::bench(sample_count = 3, sample_size = 1)]
fn peng_robinson_10_components(bencher: Bencher) {
    let feed = zfactor::feed::parse_mix(GAS, Basis::Mole, false).unwrap();
    let pr = zfactor::models::build("pr", &feed).unwrap();
    let pts = points();
    let (r, screened) = evaluate(&[&pr], &Against::Nothing, &pr, &feed.mole, &pts, || {});
    let split = r
        .iter()
        .filter(|p| {
            matches!(
                p.answers[0],
                Answer::Ok {
                    phase: Phase::TwoPhase,
                    ..
                }
            )
        })
        .count();
    eprintln!(
        "{} states, {split} two-phase, envelope screen {screened}",
        r.len()
    );
    bencher.bench(|| {
        evaluate(&[&pr], &Against::Nothing, &pr, &feed.mole, &pts, || {})
            .0
            .len()
    });
}
