//! The speed target of the grid commands: Z of a 10-component Peng-Robinson mixture over a
//! 1000 x 1000 T-P grid on all cores (`zfactor::zgrid::z_grid`), against the same grid on
//! one thread, and on one thread with the baseline kernel. Run: `cargo bench --bench z_grid`
//! (target: <= 0.5 s on 2 cores).

use divan::Bencher;
use zfactor::cli::Basis;
use zfactor::zgrid;

/// An invented 10-component natural gas (mole fractions).
const GAS: &str = "methane=0.80,ethane=0.06,propane=0.03,n-butane=0.01,isobutane=0.01,\
n-pentane=0.005,nitrogen=0.04,co2=0.03,h2s=0.005,n-hexane=0.01";

fn main() {
    divan::main();
}

fn axes() -> (Vec<f64>, Vec<f64>) {
    let t = (0..1000).map(|i| 250.0 + 0.15 * i as f64).collect();
    let p = (0..1000).map(|j| 1e5 + 2e4 * j as f64).collect();
    (t, p)
}

#[divan::bench(sample_count = 5)]
fn parallel(bencher: Bencher) {
    let feed = zfactor::feed::parse_mix(GAS, Basis::Mole, false).unwrap();
    let batch = zgrid::batch_model("pr", &feed).unwrap();
    let (t, p) = axes();
    bencher.bench(|| zgrid::z_grid(&batch, &t, &p, |_| {}).unwrap());
}

#[divan::bench(sample_count = 5)]
fn serial(bencher: Bencher) {
    let feed = zfactor::feed::parse_mix(GAS, Basis::Mole, false).unwrap();
    let batch = zgrid::batch_model("pr", &feed).unwrap();
    let (t, p) = axes();
    bencher.bench(|| zgrid::z_grid_serial(&batch, &t, &p).unwrap());
}

/// The same single-threaded grid with the kernel compiled for the x86-64 baseline only: the
/// gain of the run-time dispatch (`eos::cpu`) is `serial_baseline / serial`.
#[divan::bench(sample_count = 5)]
fn serial_baseline(bencher: Bencher) {
    let feed = zfactor::feed::parse_mix(GAS, Basis::Mole, false).unwrap();
    let batch = zgrid::batch_model("pr", &feed).unwrap();
    let (t, p) = axes();
    let mut out = vec![0.0; t.len() * p.len()];
    bencher.bench_local(|| {
        batch
            .z_grid_at(
                eos::cpu::Level::Base,
                &t,
                &p,
                eos::batch::BatchRoot::LowestGibbs,
                &mut out,
            )
            .unwrap()
    });
}
