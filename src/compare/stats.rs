//! Deviation statistics of one model against a reference over a set of points.
//!
//! With d_k = 100 (rho_model,k / rho_ref,k - 1) the density deviation of point k in percent,
//! over the N points used:
//!
//! - mean absolute deviation  MAD  = (1/N) sum |d_k|
//! - maximum absolute deviation     = max |d_k|, with where it occurs (the point's index or
//!   its state, as the caller chooses; the first such point when several tie)
//! - bias                           = (1/N) sum d_k
//!
//! These are the usual summary statistics of equation-of-state comparisons (average absolute
//! deviation, bias and maximum deviation; common practice). Non-finite deviations are never
//! accumulated: the caller counts them as failed points.

use serde::Serialize;

/// Running statistics; add points with [`Accumulator::add`], read with
/// [`Accumulator::finish`].
#[derive(Debug, Clone, Copy)]
pub struct Accumulator<P: Copy = usize> {
    n: usize,
    sum_abs: f64,
    sum: f64,
    max_abs: f64,
    max_at: Option<P>,
}

impl<P: Copy> Default for Accumulator<P> {
    fn default() -> Self {
        Self {
            n: 0,
            sum_abs: 0.0,
            sum: 0.0,
            max_abs: 0.0,
            max_at: None,
        }
    }
}

/// The summary of one model over one set of points.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct DeviationStats<P: Copy = usize> {
    /// Number of points used.
    pub points: usize,
    /// Mean absolute deviation, percent.
    pub mean_abs_dev_pct: f64,
    /// Maximum absolute deviation, percent.
    pub max_abs_dev_pct: f64,
    /// Mean signed deviation, percent.
    pub bias_pct: f64,
    /// Where the maximum is (an index into the caller's point list, or a state).
    pub max_at: P,
}

impl<P: Copy> Accumulator<P> {
    /// A new, empty accumulator.
    pub fn new() -> Self {
        Self::default()
    }

    /// Adds deviation `dev_pct` of the point at `at`; returns false (and adds nothing) when
    /// the deviation is not finite.
    pub fn add(&mut self, at: P, dev_pct: f64) -> bool {
        if !dev_pct.is_finite() {
            return false;
        }
        self.n += 1;
        self.sum += dev_pct;
        self.sum_abs += dev_pct.abs();
        if self.max_at.is_none() || dev_pct.abs() > self.max_abs {
            self.max_abs = dev_pct.abs();
            self.max_at = Some(at);
        }
        true
    }

    /// The statistics, or `None` when no point was added.
    pub fn finish(&self) -> Option<DeviationStats<P>> {
        let max_at = self.max_at?;
        let n = self.n as f64;
        Some(DeviationStats {
            points: self.n,
            mean_abs_dev_pct: self.sum_abs / n,
            max_abs_dev_pct: self.max_abs,
            bias_pct: self.sum / n,
            max_at,
        })
    }
}

/// Density deviation in percent of a model from a reference at the same T and P, from the
/// two compression factors: rho = P/(Z R T), so rho_model/rho_ref - 1 = Z_ref/Z_model - 1.
pub fn density_dev_pct_from_z(z_model: f64, z_ref: f64) -> f64 {
    100.0 * (z_ref / z_model - 1.0)
}

/// Density deviation in percent of `rho_model` from `rho_ref` (same units).
pub fn density_dev_pct(rho_model: f64, rho_ref: f64) -> f64 {
    100.0 * (rho_model / rho_ref - 1.0)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn statistics_of_a_hand_computed_set() {
        // By hand: deviations 1, -3, 2, -0.5 -> MAD = 6.5/4 = 1.625, max 3 at index 1,
        // bias = -0.5/4 = -0.125.
        let mut a = Accumulator::new();
        for (i, d) in [1.0, -3.0, 2.0, -0.5].into_iter().enumerate() {
            assert!(a.add(i, d));
        }
        assert!(!a.add(9, f64::NAN));
        assert!(!a.add(9, f64::INFINITY));
        let s = a.finish().unwrap();
        assert_eq!(s.points, 4);
        assert_relative_eq!(s.mean_abs_dev_pct, 1.625);
        assert_relative_eq!(s.max_abs_dev_pct, 3.0);
        assert_relative_eq!(s.bias_pct, -0.125);
        assert_eq!(s.max_at, 1);
        assert!(Accumulator::<usize>::new().finish().is_none());
    }

    #[test]
    fn density_deviation_from_compression_factors() {
        // rho = P/(Z R T): a model Z 1 % above the reference gives a density 1/1.01 - 1 low.
        assert_relative_eq!(
            density_dev_pct_from_z(1.01, 1.0),
            100.0 * (1.0 / 1.01 - 1.0),
            max_relative = 1e-14
        );
        assert_relative_eq!(density_dev_pct(105.0, 100.0), 5.0, max_relative = 1e-13);
    }
}
