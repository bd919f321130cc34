//! The Lee-Kesler corresponding-states model for given components, on a (T, P) API.
//!
//! For a fluid (or a mixture's pseudo-fluid) of acentric factor omega at Tr = T/Tc,
//! Pr = P/Pc, every quantity interpolates linearly in omega between the simple fluid (0) and
//! the reference fluid (r), each solved at its own reduced volume (Lee & Kesler 1975, Eq. 1):
//!
//! X = X0 + (omega / omega_r)(X_r - X0), X in {Z, (H - H_ig)/(R Tc), (S - S_ig)/R, ln(f/P)}.
//!
//! The interpolation is at fixed (Tr, Pr), not at fixed density, so the mixture has no
//! closed-form residual Helmholtz energy in (T, rho) and the model does not implement
//! [`crate::Model`]; this type gives Z, departures and fugacity coefficients from (T, P).
//!
//! Component fugacity coefficients of a mixture, ln phi_i = d(n ln phi)/dn_i at fixed T, P,
//! are taken by a central difference of the closed-form mixture ln(f/P) through the mixing
//! rules (step 1e-5 in mole numbers); Sum x_i ln phi_i = ln phi holds to about 1e-9.

use super::constants::{OMEGA_R, REFERENCE, SIMPLE};
use super::fluid::{Branch, FluidPoint};
use super::mixing::{zc, PairTerms, PseudoCritical};
use crate::component::Component;
use crate::component_check::{self, OmegaRule};
use crate::composition;
use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::state::RootChoice;

/// Most components the model accepts (stack arrays of this size per state).
pub const MAX_COMPONENTS: usize = 32;
/// Lowest reduced temperature of the Lee-Kesler tables.
pub const TR_MIN: f64 = 0.3;
/// Highest reduced temperature of the Lee-Kesler tables.
pub const TR_MAX: f64 = 4.0;
/// Highest reduced pressure of the Lee-Kesler tables.
pub const PR_MAX: f64 = 10.0;

/// Model id.
pub const ID: &str = "lk";

/// A Lee-Kesler state at (T, P, x).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LkState {
    /// Pseudo-critical constants used.
    pub crit: PseudoCritical,
    /// Reduced temperature and pressure.
    pub tr: f64,
    pub pr: f64,
    /// Simple-fluid solution.
    pub simple: FluidPoint,
    /// Reference-fluid solution.
    pub reference: FluidPoint,
    /// Compressibility factor.
    pub z: f64,
    /// Molar density, mol/m3.
    pub rho: f64,
    /// Residual (departure) enthalpy H - H_ig at the same T and P, J/mol.
    pub h_dep: f64,
    /// Residual (departure) entropy S - S_ig at the same T and P, J/(mol K).
    pub s_dep: f64,
    /// ln of the mixture (pseudo-pure) fugacity coefficient.
    pub ln_phi: f64,
}

/// The Lee-Kesler model with the Plocker-Knapp-Prausnitz mixing rules.
#[derive(Debug, Clone)]
pub struct LeeKesler {
    comps: Vec<Component>,
    pairs: PairTerms,
}

impl LeeKesler {
    /// The model for `comps`; `kstar` is the n x n matrix of the mixing-rule parameter k*_jk
    /// (row-major, symmetric, ones on the diagonal; all ones when `None`).
    pub fn new(comps: &[Component], kstar: Option<&[f64]>) -> Result<Self> {
        component_check::check(
            comps,
            MAX_COMPONENTS,
            &OmegaRule {
                ok: |omega| omega.is_finite() && zc(omega) > 0.0,
                accepted: "a finite number below 3.4 (Zc = 0.2905 - 0.085 omega > 0)",
            },
        )?;
        let n = comps.len();
        let kstar = match kstar {
            None => vec![1.0; n * n],
            Some(k) => {
                crate::pair_matrix::check(
                    k,
                    n,
                    &crate::pair_matrix::PairRule {
                        name: "k*_jk",
                        diagonal: 1.0,
                        positive: true,
                        below: f64::INFINITY,
                        accepted: "positive, symmetric, one on the diagonal",
                    },
                )?;
                k.to_vec()
            }
        };
        let tc: Vec<f64> = comps.iter().map(|c| c.tc).collect();
        let omega: Vec<f64> = comps.iter().map(|c| c.omega).collect();
        let vc_cbrt: Vec<f64> = comps
            .iter()
            .map(|c| (zc(c.omega) * R * c.tc / c.pc).cbrt())
            .collect();
        Ok(LeeKesler {
            pairs: PairTerms::new(&tc, &omega, &vc_cbrt, &kstar),
            comps: comps.to_vec(),
        })
    }

    /// The components.
    pub fn components(&self) -> &[Component] {
        &self.comps
    }

    /// Pseudo-critical constants of composition x.
    pub fn pseudo_critical(&self, x: &[f64]) -> PseudoCritical {
        self.pairs.pseudo_critical(x)
    }

    /// The state at `t` (K), `p` (Pa), mole fractions `x`. `root` picks the volume root of each
    /// Lee-Kesler fluid (lowest Gibbs energy, liquid-like or vapour-like). Outside
    /// 0.3 <= Tr <= 4 or Pr > 10 (the range of the Lee-Kesler tables) the answer is an
    /// [`Error::OutOfRange`].
    pub fn state_tp(&self, t: f64, p: f64, x: &[f64], root: RootChoice) -> Result<LkState> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        composition::check(x, self.comps.len())?;
        self.unchecked(t, p, x, root)
    }

    fn unchecked(&self, t: f64, p: f64, x: &[f64], root: RootChoice) -> Result<LkState> {
        let crit = self.pseudo_critical(x);
        let (tr, pr) = (t / crit.tc, p / crit.pc);
        if !(TR_MIN..=TR_MAX).contains(&tr) || pr > PR_MAX {
            return Err(Error::OutOfRange {
                model: ID.into(),
                what: "reduced temperature or pressure",
                detail: format!(
                    "Tr = {tr:.4}, Pr = {pr:.4}: the Lee-Kesler equation is fitted for \
                     {TR_MIN} <= Tr <= {TR_MAX} and Pr <= {PR_MAX}"
                ),
            });
        }
        let branch = match root {
            RootChoice::LowestGibbs => Branch::Stable,
            RootChoice::Liquid => Branch::Liquid,
            RootChoice::Vapor => Branch::Vapor,
        };
        let (s, _) = SIMPLE.solve(tr, pr, branch)?;
        let (r, _) = REFERENCE.solve(tr, pr, branch)?;
        let f = crit.omega / OMEGA_R;
        let mix = |a: f64, b: f64| a + f * (b - a);
        let z = mix(s.z, r.z);
        if !(z.is_finite() && z > 0.0) {
            return Err(Error::NoSolution(format!(
                "Lee-Kesler interpolation gives Z = {z} at Tr = {tr}, Pr = {pr}, omega = {}",
                crit.omega
            )));
        }
        Ok(LkState {
            crit,
            tr,
            pr,
            simple: s,
            reference: r,
            z,
            rho: p / (z * R * t),
            h_dep: R * crit.tc * mix(s.h_dep, r.h_dep),
            s_dep: R * mix(s.s_dep, r.s_dep),
            ln_phi: mix(s.ln_phi, r.ln_phi),
        })
    }

    /// ln phi_i of every component at (T, P, x) into `out`, and the state. See the module
    /// docs for the method.
    pub fn ln_phi(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
        out: &mut [f64],
    ) -> Result<LkState> {
        let state = self.state_tp(t, p, x, root)?;
        let n = x.len();
        if out.len() != n {
            return Err(Error::invalid(
                "length of the ln phi output",
                out.len() as f64,
                format!("one per component ({n})"),
            ));
        }
        if n == 1 {
            out[0] = state.ln_phi;
            return Ok(state);
        }
        const H: f64 = 1e-5;
        let mut xp = [0.0; MAX_COMPONENTS];
        for (i, o) in out.iter_mut().enumerate() {
            // n ln phi at mole numbers x + h e_i, normalised: x' = (x + h e_i)/(1 + h).
            let mut g = [0.0; 2];
            for (k, h) in [H, -H].into_iter().enumerate() {
                for j in 0..n {
                    xp[j] = (x[j] + if j == i { h } else { 0.0 }) / (1.0 + h);
                }
                g[k] = (1.0 + h) * self.unchecked(t, p, &xp[..n], root)?.ln_phi;
            }
            *o = (g[0] - g[1]) / (2.0 * H);
        }
        Ok(state)
    }
}
