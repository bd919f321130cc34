//! The tangent plane of a feed at (T, P), against which every trial phase of the stability
//! test is measured: tm at a trial W, the trivial solution, and the memory of trial paths.

use super::paths::TrialPaths;
use crate::equilibrium::phase_eval::{ln_phi_tp, RootSel};
use crate::model::Model;

/// The feed's tangent plane: the model, (T, P), the feed z with ln z_i and
/// d_i = ln z_i + ln phi_i(z).
pub(super) struct TangentPlane<'a> {
    pub model: &'a dyn Model,
    pub t: f64,
    pub p: f64,
    pub z: &'a [f64],
    pub lnz: &'a [f64],
    pub d: &'a [f64],
}

/// How a trial ended.
pub(super) struct TrialResult {
    /// tm at a non-trivial stationary point or at an iterate proving instability.
    pub tm: Option<f64>,
    /// Density of the trial phase there, mol/m3.
    pub rho: f64,
    /// Evaluations of ln phi spent.
    pub iterations: usize,
}

impl TrialResult {
    /// A trial that ended without a result of its own (trivial solution, an earlier trial's
    /// path, or no density root), at density `rho`.
    pub fn none(rho: f64, iterations: usize) -> Self {
        Self {
            tm: None,
            rho,
            iterations,
        }
    }

    /// A trial that ended at tm = `tm` with density `rho`.
    pub fn at(tm: f64, rho: f64, iterations: usize) -> Self {
        Self {
            tm: Some(tm),
            rho,
            iterations,
        }
    }
}

impl TangentPlane<'_> {
    /// Number of components.
    pub fn n(&self) -> usize {
        self.z.len()
    }

    /// tm at W (given with ln W, so that no logarithm is taken here) and the phase's density;
    /// fills `lnphi`. None when the model has no density root for W.
    pub fn tm_at(&self, w: &[f64], lnw: &[f64], lnphi: &mut [f64]) -> Option<(f64, f64)> {
        let ph = ln_phi_tp(self.model, self.t, self.p, w, RootSel::LowestGibbs, lnphi)?;
        let d = self.d;
        let mut tm = 1.0;
        for i in 0..w.len() {
            if w[i] > 0.0 {
                tm += w[i] * (lnw[i] + lnphi[i] - d[i] - 1.0);
            }
        }
        Some((tm, ph.rho))
    }

    /// True when normalised W (ln sum W in `ln_s`) is within the trivial-solution distance of
    /// z.
    pub fn is_trivial(&self, w: &[f64], lnw: &[f64], ln_s: f64) -> bool {
        let (z, lnz) = (self.z, self.lnz);
        let mut dist = 0.0;
        for i in 0..z.len() {
            if z[i] > 0.0 && w[i] > 0.0 {
                let r = lnw[i] - ln_s - lnz[i];
                dist += r * r;
            }
        }
        dist < 1e-8
    }

    /// True when W has reached the trivial solution or the path of an earlier trial; records
    /// W in `paths`.
    pub fn ends_here(&self, w: &[f64], lnw: &[f64], paths: &mut TrialPaths) -> bool {
        let z = self.z;
        let ln_s = w.iter().sum::<f64>().ln();
        let present = (0..z.len()).filter(|&i| z[i] > 0.0).map(|i| lnw[i]);
        let seen = paths.record(present, ln_s);
        seen || self.is_trivial(w, lnw, ln_s)
    }

    /// Sets W from ln W (absent components stay at zero).
    pub fn set_w(&self, lnw: &[f64], w: &mut [f64]) {
        let z = self.z;
        for i in 0..z.len() {
            w[i] = if z[i] > 0.0 { lnw[i].exp() } else { 0.0 };
        }
    }

    /// tm at the point ln W = `lnw` (W into `w`, ln phi into `lnphi`); None when the point is
    /// out of range or the model has no root there.
    pub fn try_point(&self, lnw: &[f64], w: &mut [f64], lnphi: &mut [f64]) -> Option<(f64, f64)> {
        // W beyond e^700 (or NaN) is no phase.
        if lnw
            .iter()
            .zip(self.z)
            .any(|(v, &zi)| zi > 0.0 && (v.is_nan() || *v >= 700.0))
        {
            return None;
        }
        self.set_w(lnw, w);
        self.tm_at(w, lnw, lnphi)
    }
}
