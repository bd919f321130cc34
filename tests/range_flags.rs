//! The range and solid flags of a whole array of states (`StateCheck::flags`, as the Python
//! binding takes them) are exactly the flags state by state, whether a block of states is
//! passed over as clear or checked one by one.

use zfactor::cli::{Basis, FluidArgs};
use zfactor::range::StateCheck;

fn check(fluid: &str, model: &str) -> StateCheck {
    let args = FluidArgs {
        fluid: Some(fluid.to_string()),
        mix: None,
        mix_file: None,
        basis: Basis::Mole,
        normalize: false,
        kij: None,
        kij_file: None,
    };
    let feed = zfactor::feed_input::read(&args).unwrap();
    let built = zfactor::models::build(model, &feed).unwrap();
    StateCheck::new(&built, &feed)
}

/// A grid of n x n states over [t0, t1] x [p0, p1] (K, Pa), with a compression factor that
/// varies, so that the virial series' density limit is crossed somewhere.
fn grid(n: usize, t0: f64, t1: f64, p0: f64, p1: f64) -> (Vec<f64>, Vec<f64>, Vec<f64>) {
    let (mut t, mut p, mut z) = (Vec::new(), Vec::new(), Vec::new());
    for i in 0..n {
        for j in 0..n {
            let (fi, fj) = (i as f64 / (n - 1) as f64, j as f64 / (n - 1) as f64);
            t.push(t0 + (t1 - t0) * fi);
            p.push(p0 + (p1 - p0) * fj);
            z.push(1.0 - 0.9 * fj * (1.0 - 0.5 * fi));
        }
    }
    (t, p, z)
}

#[test]
fn flags_of_an_array_equal_the_flags_state_by_state() {
    // Each case has states inside and outside the model's stated range or the solid region
    // (common practice: CO2 is solid below 216.59 K above its sublimation pressure, water
    // freezes below 273.16 K at 1 bar, and the reference equations state a temperature and
    // pressure range), and blocks that lie wholly inside.
    let cases = [
        ("co2", "reference", grid(300, 150.0, 1200.0, 1e4, 900e6)),
        ("co2", "pr", grid(300, 150.0, 400.0, 1e4, 300e6)),
        ("water", "reference", grid(300, 250.0, 1400.0, 1e3, 1500e6)),
        ("water", "if97", grid(300, 250.0, 2400.0, 1e3, 150e6)),
        ("methane", "virial", grid(300, 150.0, 400.0, 1e4, 30e6)),
        ("nitrogen", "pr", grid(300, 50.0, 300.0, 1e4, 3000e6)),
        ("methane", "pr", grid(300, 200.0, 400.0, 1e5, 30e6)),
    ];
    for (fluid, model, (t, p, z)) in cases {
        let c = check(fluid, model);
        let one_by_one: Vec<(usize, String)> = (0..t.len())
            .filter_map(|i| {
                c.flag(t[i], p[i], p[i] / (z[i] * eos::constants::R * t[i]))
                    .map(|f| (i, f))
            })
            .collect();
        let all = c.flags(&t, &p, &z);
        assert_eq!(all, one_by_one, "{fluid} {model}");
        if fluid != "methane" || model != "pr" {
            assert!(
                !all.is_empty(),
                "{fluid} {model}: the grid was meant to cross a limit"
            );
        } else {
            assert!(
                all.is_empty(),
                "methane with pr above 200 K is clear everywhere"
            );
        }
    }
}
