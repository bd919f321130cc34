//! The envelope screen against the stability test, state by state: no state that the screen
//! leaves out (as clearly outside the traced envelope) is unstable. Two natural gases with
//! heavy ends (the demo gas of `common`, a composition of our own, and the yardstick's
//! 10-component gas) and a four-component light hydrocarbon mixture of our own,
//! Peng-Robinson, a 120 x 120 grid over 100-450 K and 0.5-400 bar.

mod common;
#[path = "support/yardstick.rs"]
mod yardstick;

use common::{demo_gas, pr_model};
use eos::equilibrium::{stability, EnvelopeScreen};

#[test]
fn states_screened_out_are_stable() {
    let (names, z) = demo_gas();
    let light = ["methane", "ethane", "propane", "n-butane"];
    let cases = [
        ("demo gas", pr_model(&names), z),
        {
            let (m, z) = yardstick::mix();
            ("yardstick gas", m, z)
        },
        (
            "C1-C4 mixture",
            pr_model(&light),
            vec![0.6, 0.2, 0.12, 0.08],
        ),
    ];
    for (label, m, z) in &cases {
        let (nt, np) = (120, 120);
        let p_low = 0.5e5;
        let screen = EnvelopeScreen::trace(m, z, p_low).expect("envelope traced");
        let (mut skipped, mut tested, mut unstable) = (0, 0, 0);
        for i in 0..nt {
            let t = 100.0 + 350.0 * i as f64 / (nt - 1) as f64;
            let region = screen.region(t);
            for j in 0..np {
                let p = p_low + (400e5 - p_low) * j as f64 / (np - 1) as f64;
                let s = stability::test(m, t, p, z).unwrap();
                if region.contains(p) {
                    tested += 1;
                    unstable += usize::from(!s.stable);
                } else {
                    skipped += 1;
                    assert!(
                        s.stable,
                        "{label}: {t} K, {} bar left out but unstable",
                        p / 1e5
                    );
                }
            }
        }
        println!("{label}: {skipped} states left out, {tested} tested ({unstable} unstable)");
        // The screen is worth having: most of this grid lies clearly outside the envelope.
        assert!(skipped > nt * np / 2, "{label}: only {skipped} left out");
        assert!(unstable > 0);
    }
}
