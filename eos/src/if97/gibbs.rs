//! Properties from a dimensionless Gibbs free energy gamma(pi, tau) = g/(RT), the form of
//! IF97 regions 1, 2 and 5 (IAPWS R7-97(2012), Tables 3, 12 and 39):
//!
//! - v = (RT/p) pi gamma_pi, u = RT (tau gamma_tau - pi gamma_pi), s = R (tau gamma_tau - gamma)
//! - h = RT tau gamma_tau, cp = -R tau^2 gamma_tautau
//! - cv = R [-tau^2 gamma_tautau + (gamma_pi - tau gamma_pitau)^2 / gamma_pipi]
//! - w^2 = RT gamma_pi^2 / [(gamma_pi - tau gamma_pitau)^2 / (tau^2 gamma_tautau) - gamma_pipi]
//!
//! gamma is the total (ideal + residual) function; the region-2 and region-5 formulas of the
//! release that split the two parts are the same expressions rearranged.

use super::{If97State, Region};

/// gamma and its derivatives with respect to pi and tau.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Gibbs {
    pub g: f64,
    pub g_p: f64,
    pub g_pp: f64,
    pub g_t: f64,
    pub g_tt: f64,
    pub g_pt: f64,
}

impl Gibbs {
    /// Properties at T (K), p (Pa), with pi and tau of the region and R in J/(kg K).
    pub fn properties(
        &self,
        region: Region,
        t: f64,
        p: f64,
        pi: f64,
        tau: f64,
        r: f64,
    ) -> If97State {
        let rt = r * t;
        let v = rt / p * pi * self.g_p;
        let tgt = tau * self.g_t;
        let pgp = pi * self.g_p;
        let cp = -r * tau * tau * self.g_tt;
        let x = self.g_p - tau * self.g_pt;
        let cv = r * (-tau * tau * self.g_tt + x * x / self.g_pp);
        let w2 = rt * self.g_p * self.g_p / (x * x / (tau * tau * self.g_tt) - self.g_pp);
        If97State {
            region,
            t,
            p,
            rho: 1.0 / v,
            v,
            h: rt * tgt,
            u: rt * (tgt - pgp),
            s: r * (tgt - self.g),
            cp,
            cv,
            w: w2.sqrt(),
            z: pgp,
        }
    }
}
