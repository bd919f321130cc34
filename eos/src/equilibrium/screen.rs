//! Phase screening of many (T, P) states of one feed by its traced phase envelope.
//!
//! For a feed of fixed composition, the states where it splits into vapour and liquid are
//! those inside its phase envelope, the locus of the states where an incipient phase first
//! appears ([`super::envelope`], M. L. Michelsen, Fluid Phase Equilib. 4 (1980) 1-10). A
//! grid of states can therefore leave out the stability test where a state lies clearly
//! outside the traced envelope, and run it everywhere else.
//!
//! A state at temperature T is tested when its pressure lies, widened by [`LN_P_MARGIN`] in
//! ln P on both sides, within a two-phase interval of the isotherm T or of the isotherms
//! T - [`T_MARGIN`] and T + [`T_MARGIN`] (the crossings of the traced envelope, interpolated
//! linearly in ln P between its points), or below the pressure where the trace starts and
//! ends. The trace runs from a dew point at that pressure round to a bubble point at it, so
//! an isotherm colder than the first dew point crosses it once fewer: its two-phase interval
//! then reaches down to the lowest pressures. Every state is tested
//!
//! - at an isotherm that crosses the trace an odd number of times while warmer than its
//!   first dew point (which a closed envelope does not do);
//! - when the envelope could not be traced to its end (then no screen is made).
//!
//! What the envelope does not hold is not screened out by this either: a liquid-liquid split
//! away from the vapour-liquid envelope (mixtures with water, or CO2 with heavy ends at low
//! temperature) is not on the traced envelope, so the screen is meant for gases and light
//! hydrocarbon mixtures, where the test suite checks it state by state against the
//! stability test (`eos/tests/screen.rs`).

use super::envelope::{self, EnvelopeOptions, EnvelopeStop};
use crate::model::Model;

/// Half-width of the band around the envelope in which states are always tested, in ln P
/// (5 %).
pub const LN_P_MARGIN: f64 = 0.05;

/// Neighbouring isotherms also consulted, K on either side.
pub const T_MARGIN: f64 = 3.0;

/// A feed's traced phase envelope, as a polyline in (T, ln P).
#[derive(Debug, Clone)]
pub struct EnvelopeScreen {
    points: Vec<(f64, f64)>,
    /// ln of the pressure where the trace starts and ends; below it every state is tested.
    ln_p_start: f64,
}

/// Where on one isotherm states must be tested.
#[derive(Debug, Clone, PartialEq)]
pub enum TestRegion {
    /// At every pressure.
    Everywhere,
    /// Within these pressure intervals, Pa (sorted, disjoint); elsewhere the feed is one
    /// phase.
    Within(Vec<(f64, f64)>),
}

impl TestRegion {
    /// True when a state at pressure `p` (Pa) must be tested.
    pub fn contains(&self, p: f64) -> bool {
        match self {
            TestRegion::Everywhere => true,
            TestRegion::Within(iv) => iv.iter().any(|&(lo, hi)| p >= lo && p <= hi) || p.is_nan(),
        }
    }
}

impl EnvelopeScreen {
    /// Traces the envelope of feed `z` with `model` from the dew point at `p_low` (Pa, the
    /// lowest pressure of the states to screen, at most 1 bar); `None` when the envelope
    /// cannot be traced to its end (every state must then be tested).
    pub fn trace(model: &dyn Model, z: &[f64], p_low: f64) -> Option<Self> {
        let p_start = if p_low.is_finite() && p_low > 0.0 {
            p_low.min(1e5)
        } else {
            1e5
        };
        let e = envelope::trace(
            model,
            z,
            EnvelopeOptions {
                p_start,
                ..EnvelopeOptions::default()
            },
        )
        .ok()?;
        if e.stop != EnvelopeStop::Complete || e.points.len() < 3 {
            return None;
        }
        let points: Vec<(f64, f64)> = e.points.iter().map(|p| (p.t, p.p.ln())).collect();
        if points
            .iter()
            .any(|(t, lp)| !(t.is_finite() && lp.is_finite()))
        {
            return None;
        }
        Some(Self {
            points,
            ln_p_start: p_start.ln(),
        })
    }

    /// Where states at temperature `t` (K) must be tested.
    pub fn region(&self, t: f64) -> TestRegion {
        if t.is_nan() {
            return TestRegion::Everywhere;
        }
        let t_first_dew = self.points[0].0;
        let mut iv: Vec<(f64, f64)> = vec![(f64::NEG_INFINITY, self.ln_p_start + LN_P_MARGIN)];
        for tt in [t - T_MARGIN, t, t + T_MARGIN] {
            let mut cross: Vec<f64> = self
                .points
                .windows(2)
                .filter(|w| {
                    (w[0].0 - tt) * (w[1].0 - tt) <= 0.0 && w[0].0.total_cmp(&w[1].0).is_ne()
                })
                .map(|w| w[0].1 + (tt - w[0].0) / (w[1].0 - w[0].0) * (w[1].1 - w[0].1))
                .collect();
            if cross.len() % 2 == 1 {
                if tt >= t_first_dew {
                    return TestRegion::Everywhere;
                }
                // The dew branch of this isotherm lies below the starting pressure.
                cross.push(f64::NEG_INFINITY);
            }
            cross.sort_by(f64::total_cmp);
            for pair in cross.chunks(2) {
                iv.push((pair[0] - LN_P_MARGIN, pair[1] + LN_P_MARGIN));
            }
        }
        iv.sort_by(|a, b| a.0.total_cmp(&b.0));
        let mut merged: Vec<(f64, f64)> = Vec::with_capacity(iv.len());
        for (lo, hi) in iv {
            match merged.last_mut() {
                Some(last) if lo <= last.1 => last.1 = last.1.max(hi),
                _ => merged.push((lo, hi)),
            }
        }
        TestRegion::Within(
            merged
                .into_iter()
                .map(|(a, b)| (a.exp(), b.exp()))
                .collect(),
        )
    }
}

#[cfg(test)]
mod tests {
    use super::{EnvelopeScreen, TestRegion, LN_P_MARGIN, T_MARGIN};

    /// A loop traced from the dew point (200 K, 1 bar) round to the bubble point (190 K,
    /// 0.9 bar), cricondentherm 300 K.
    fn screen() -> EnvelopeScreen {
        let pts = [
            (200.0, 1e5),
            (250.0, 10e5),
            (300.0, 30e5),
            (250.0, 50e5),
            (190.0, 0.9e5),
        ];
        EnvelopeScreen {
            points: pts.iter().map(|&(t, p)| (t, f64::ln(p))).collect(),
            ln_p_start: 1e5_f64.ln(),
        }
    }

    #[test]
    fn states_far_outside_are_screened_out_and_the_band_is_kept() {
        let s = screen();
        assert_eq!(s.region(f64::NAN), TestRegion::Everywhere);
        // Below the starting pressure, always tested.
        assert!(s.region(350.0).contains(0.5e5));
        // Colder than the first dew point: one crossing (the bubble curve, about 1.27 bar at
        // 195 K by the interpolation), the two-phase interval reaching down to the lowest
        // pressures; above it, liquid.
        let r = s.region(195.0);
        assert!(r.contains(1.2e5));
        assert!(!r.contains(2e5) && !r.contains(50e5));
        let r = s.region(250.0);
        // Crossings at 250 K: 10 bar and 50 bar, widened by the margin and by the
        // neighbouring isotherms.
        assert!(r.contains(10e5) && r.contains(30e5) && r.contains(50e5));
        assert!(r.contains(10e5 * (-LN_P_MARGIN * 0.9_f64).exp()));
        assert!(!r.contains(5e5) && !r.contains(100e5));
        // Beyond the cricondentherm and its margin, nothing to test above the start.
        assert!(!s.region(310.0).contains(30e5));
        // Within the margin of the cricondentherm the neighbouring isotherm counts.
        assert!(s.region(301.0).contains(30e5));
        assert!(s.region(300.0 + T_MARGIN * 0.9).contains(30e5));
    }
}
