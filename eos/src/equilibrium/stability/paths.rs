//! Memory of the iterates of the stability test's earlier trial phases.
//!
//! Successive substitution in the tangent-plane stability test maps the trial mole numbers W
//! to exp(d_i - ln phi_i(x)), with x = W / sum W: the next iterate depends on the normalised
//! composition x alone. Two trials that reach the same x go on identically, to the same
//! stationary point or to the same trivial solution. A trial whose composition comes within
//! [`PATH_TOLERANCE`] (in every ln x_i) of an iterate of an earlier trial therefore follows
//! that trial's path, whose outcome is already known, and is stopped there.
//!
//! Where liquid-like starting guesses (the Wilson liquid and the heaviest component almost
//! pure) lead down the same long descent towards the trivial solution of a stable gas, this
//! halves the work of the test.

use crate::equilibrium::phase_eval::SMALL_COMPONENTS;

/// Largest |ln x_i - ln y_i| over the components at which two trial compositions count as
/// the same point of one path.
pub const PATH_TOLERANCE: f64 = 1e-2;

/// Number of stored values (iterates times components): the size of the caller's buffer.
pub const CAPACITY: usize = 64 * SMALL_COMPONENTS;

/// The iterates (normalised ln x of the components present) of the trials run so far, in a
/// buffer of the caller's (on its stack: this is on the path of every stability test).
pub(crate) struct TrialPaths<'a> {
    lnx: &'a mut [f64],
    /// Components present in the feed (the length of each stored iterate).
    m: usize,
    /// Stored iterates.
    len: usize,
    /// Index of the current trial's first iterate.
    trial_start: usize,
}

impl<'a> TrialPaths<'a> {
    /// An empty memory in `buffer` for iterates of `m` present components; mixtures of more
    /// than [`SMALL_COMPONENTS`] components are not remembered (every trial then runs to its
    /// end).
    pub(crate) fn new(buffer: &'a mut [f64], m: usize) -> Self {
        Self {
            lnx: buffer,
            m,
            len: 0,
            trial_start: 0,
        }
    }

    /// Marks the start of a new trial.
    pub(crate) fn begin_trial(&mut self) {
        self.trial_start = self.len;
    }

    /// Stores the current trial's iterate (ln W_i of the present components in `lnw`, with
    /// ln sum W in `ln_total`) and returns true when it lies on an earlier trial's path.
    pub(crate) fn record(&mut self, lnw: impl Iterator<Item = f64>, ln_total: f64) -> bool {
        let m = self.m;
        if m > SMALL_COMPONENTS {
            return false;
        }
        let mut x = [0.0; SMALL_COMPONENTS];
        for (xi, l) in x.iter_mut().zip(lnw) {
            *xi = l - ln_total;
        }
        let x = &x[..m];
        let seen = self.lnx[..self.trial_start * m]
            .chunks_exact(m)
            .any(|stored| {
                stored
                    .iter()
                    .zip(x)
                    .all(|(s, v)| (v - s).abs() < PATH_TOLERANCE)
            });
        if (self.len + 1) * m <= self.lnx.len() {
            self.lnx[self.len * m..(self.len + 1) * m].copy_from_slice(x);
            self.len += 1;
        }
        seen
    }
}

#[cfg(test)]
mod tests {
    use super::{TrialPaths, CAPACITY, PATH_TOLERANCE};

    #[test]
    fn a_trial_meeting_an_earlier_path_is_recognised_and_its_own_points_are_not() {
        let mut buffer = [0.0; CAPACITY];
        let mut paths = TrialPaths::new(&mut buffer, 2);
        paths.begin_trial();
        let ln2 = 2.0_f64.ln();
        // First trial: x = (0.5, 0.5) given as W = (1, 1).
        assert!(!paths.record([0.0, 0.0].into_iter(), ln2));
        // Its own next point equal to the first is not "an earlier trial".
        assert!(!paths.record([0.0, 0.0].into_iter(), ln2));
        paths.begin_trial();
        // Second trial: W = (2, 2.01) is x within 0.5 % of (0.5, 0.5).
        let (a, b) = (2.0_f64, 2.01_f64);
        assert!(paths.record([a.ln(), b.ln()].into_iter(), (a + b).ln()));
        // W = (2, 2.1): x differs by about 2.4 % in ln x, beyond the tolerance.
        let b = 2.1_f64;
        let off = (b.ln() - (a + b).ln() - 0.5_f64.ln()).abs();
        assert!(off > PATH_TOLERANCE);
        assert!(!paths.record([a.ln(), b.ln()].into_iter(), (a + b).ln()));
    }
}
