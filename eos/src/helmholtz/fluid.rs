//! A pure fluid described by one Helmholtz formulation, as an [`crate::Model`].
//!
//! The formulation gives p = rho R_f T (1 + delta phir_d) with its own gas constant R_f, while
//! the crate's property layer ([`crate::properties::evaluate`]) uses R = [`crate::constants::R`].
//! So that the pressures, heat capacities and energies reported through the trait are exactly
//! the formulation's, the trait's residual is written with k = R_f/R:
//!
//! ```text
//! alpha  = k phir + (k - 1) ln delta           (so that Z = 1 + a_d = k (1 + delta phir_d))
//! a_d    = k delta phir_d + (k - 1)
//! a_dd   = k delta^2 phir_dd - (k - 1)
//! a_t    = -k tau phir_t
//! a_tt   = k (tau^2 phir_tt + 2 tau phir_t)
//! a_dt   = -k delta tau phir_dt
//! ```
//!
//! and the ideal part handed to the property layer is the formulation's phi0, shifted to the
//! crate's convention (h = 0 and s = 0 for the formulation's ideal gas at T_REF, P_REF):
//!
//! ```text
//! cp0/R = 1 - k tau^2 phi0_tt
//! h0/R  = T (1 + k tau phi0_t) - k T_REF (1 + tau phi0_t)|T_REF
//! s0/R  = k (tau phi0_t - phi0^) + ln(rhoc R T / P_REF) + c,  phi0^ = phi0 - ln delta,
//!         c = -k (tau phi0_t - phi0)  at (T_REF, delta_ref = P_REF / (R_f T_REF rhoc))
//! ```
//!
//! With these, every property of [`crate::properties::evaluate`] equals the formulation's,
//! with h and s shifted by constants. The direct (T, rho) functions of [`HelmholtzFluid`]
//! report the formulation's own convention instead.
//!
//! Water is the exception to the crate's zero: every model of water, here and elsewhere, is on
//! the steam-table zero (IAPWS R6-95(2018): u = 0 and s = 0 for the saturated liquid at the
//! triple point), which is IAPWS-95's published one. For it the shift above is undone: h0/R
//! and s0/R of the ideal gas at T_REF, P_REF are IAPWS-95's ([`super::registry::steam_table_zero`]), and the
//! other models of water carry the same values in their ideal-gas heat capacity
//! ([`crate::IdealGasCp::with_zero`]).

use super::branch_hint;
use super::density::{self, Branch};
use super::formulation::{Formulation, Tier, Validity};
use super::properties;
use super::saturation::{self, Saturation};
use crate::component::Component;
use crate::constants::{P_REF, R, T_REF};
use crate::error::{positive, Error, Result};
use crate::ideal_cp::{IdealGasCp, IdealGasValues};
use crate::model::{DensityRoots, Model};
use crate::properties::Properties;
use crate::residual::Residual;

/// A pure fluid with a Helmholtz formulation.
#[derive(Debug, Clone)]
pub struct HelmholtzFluid {
    form: &'static Formulation,
    comps: Vec<Component>,
    /// R_f / R.
    k: f64,
    /// h0/R at T_REF in the trait's form, K.
    h_ref: f64,
    /// Entropy constant c.
    s_const: f64,
    /// h0/R (K) and s0/R of the ideal gas at T_REF, P_REF on the fluid's zero: (0, 0) but
    /// for water, whose zero is the steam-table one.
    zero: (f64, f64),
    /// Highest density handled, mol/m3.
    rho_max: f64,
}

impl HelmholtzFluid {
    /// The fluid of a formulation.
    pub fn new(form: &'static Formulation) -> Self {
        let k = form.r / R;
        let tau_ref = form.tc / T_REF;
        let i_ref = form.ideal(tau_ref, 1.0);
        // h of the formulation's ideal gas at T_REF over R: the trait's zero of enthalpy.
        let h_ref = k * T_REF * (1.0 + tau_ref * i_ref.t);
        let delta_ref = P_REF / (form.r * T_REF * form.rhoc);
        let i_ref_d = form.ideal(tau_ref, delta_ref);
        let s_const = -k * (tau_ref * i_ref_d.t - i_ref_d.a);
        let omega = form
            .ps_anc
            .as_ref()
            .map(|a| -1.0 - (a.reduced(0.7 * form.tc, form.tc)).log10())
            .unwrap_or(0.0);
        let cp_ref = 1.0 - k * tau_ref * tau_ref * i_ref.tt;
        // The published zero of IAPWS-95 is the steam-table zero, kept for water.
        let zero = if form.key == STEAM_TABLE_KEY {
            (h_ref, -s_const)
        } else {
            (0.0, 0.0)
        };
        let comp = Component::new(form.fluid, form.molar_mass, form.tc, form.pc, omega)
            .with_vc(1.0 / form.rhoc)
            .with_cp(IdealGasCp::constant(cp_ref).with_zero(zero.0, zero.1));
        let rho_max = max_density(form);
        HelmholtzFluid {
            form,
            comps: vec![comp],
            k,
            h_ref,
            s_const,
            zero,
            rho_max,
        }
    }

    /// Enthalpy (J/mol) and entropy (J/(mol K)) to add to the formulation's own convention
    /// (that of [`HelmholtzFluid::properties`]) to put them on the fluid's zero, the one
    /// every model of the fluid reports: zero for water (IAPWS-95's published zero is the
    /// steam-table zero); for the other fluids the shift to h = 0, s = 0 of the ideal gas at
    /// T_REF, P_REF.
    pub fn zero_shift(&self) -> (f64, f64) {
        (
            R * (self.zero.0 - self.h_ref),
            R * (self.zero.1 + self.s_const),
        )
    }

    /// The formulation (constants, terms, ancillaries, range of validity).
    pub fn formulation(&self) -> &'static Formulation {
        self.form
    }

    /// The range of validity stated by the paper.
    pub fn validity(&self) -> Validity {
        self.form.validity
    }

    /// Ok when (T, p) is inside the range of validity, else [`Error::OutOfRange`].
    pub fn check_range(&self, t: f64, p: f64) -> Result<()> {
        let v = self.form.validity;
        if !(t >= v.t_min && t <= v.t_max && p > 0.0 && p <= v.p_max) {
            return Err(Error::OutOfRange {
                model: self.form.title.to_string(),
                what: "state",
                detail: format!(
                    "T = {t} K, p = {p} Pa is outside {} to {} K, up to {} Pa",
                    v.t_min, v.t_max, v.p_max
                ),
            });
        }
        Ok(())
    }

    /// Every property at T (K) and molar density rho (mol/m3) in the formulation's own
    /// convention.
    pub fn properties(&self, t: f64, rho: f64) -> Result<Properties> {
        positive("temperature (K)", t)?;
        positive("molar density (mol/m3)", rho)?;
        Ok(properties::evaluate(self.form, t, rho))
    }

    /// Pressure (Pa) at T (K) and rho (mol/m3).
    pub fn pressure(&self, t: f64, rho: f64) -> Result<f64> {
        positive("temperature (K)", t)?;
        positive("molar density (mol/m3)", rho)?;
        Ok(self.form.pressure(t, rho))
    }

    /// Second virial coefficient B(T), m3/mol.
    pub fn second_virial(&self, t: f64) -> Result<f64> {
        positive("temperature (K)", t)?;
        Ok(properties::second_virial(self.form, t))
    }

    /// The density roots (mol/m3, ascending) at T (K) and p (Pa).
    pub fn density_roots(&self, t: f64, p: f64) -> Result<DensityRoots> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        let (r, n) = density::roots(self.form, t, p);
        Ok(DensityRoots::from_slice(&r[..n]))
    }

    /// The stable density (mol/m3) at T (K) and p (Pa): of several roots, the one of lowest
    /// Gibbs energy. Where the vapour-pressure ancillary already tells which root is stable
    /// ([`super::branch_hint`]), only that branch is solved.
    pub fn density(&self, t: f64, p: f64) -> Result<f64> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        if let Some(rho) = Model::stable_density(self, t, p, &[]) {
            return Ok(rho);
        }
        let roots = self.density_roots(t, p)?;
        let tau = self.form.tc / t;
        let g = |rho: f64| {
            let delta = rho / self.form.rhoc;
            let r = self.form.residual(tau, delta);
            delta.ln() + r.a + delta * r.d
        };
        roots
            .as_slice()
            .iter()
            .copied()
            .min_by(|a, b| g(*a).total_cmp(&g(*b)))
            .ok_or_else(|| {
                Error::NoSolution(format!(
                    "{} has no density root at T = {t} K, p = {p} Pa",
                    self.form.title
                ))
            })
    }

    /// All properties at T (K) and p (Pa) for the stable root.
    pub fn properties_tp(&self, t: f64, p: f64) -> Result<Properties> {
        let rho = self.density(t, p)?;
        self.properties(t, rho)
    }

    /// Saturation (vapour pressure and both densities) at T (K).
    pub fn saturation_t(&self, t: f64) -> Result<Saturation> {
        saturation::at_t(self.form, t)
    }

    /// Saturation (temperature and both densities) at p (Pa).
    pub fn saturation_p(&self, p: f64) -> Result<Saturation> {
        saturation::at_p(self.form, p)
    }
}

/// The formulation whose published zero of enthalpy and entropy is the steam-table zero.
pub(crate) const STEAM_TABLE_KEY: &str = "water-iapws95";

impl HelmholtzFluid {
    /// h0/R (K) and s0/R of the ideal gas at T_REF, P_REF on the fluid's zero.
    pub(crate) fn zero(&self) -> (f64, f64) {
        self.zero
    }
}

/// Highest density handled: the largest liquid density on the p_max isobar over the range of
/// validity (sampled at eight temperatures), the densest state the paper covers.
fn max_density(f: &Formulation) -> f64 {
    let v = f.validity;
    let mut best: f64 = 0.0;
    for i in 0..8 {
        let t = v.t_min + (v.t_max - v.t_min) * i as f64 / 7.0;
        let (r, n) = density::roots(f, t, v.p_max);
        if n > 0 {
            best = best.max(r[n - 1]);
        }
    }
    if best > 0.0 {
        best
    } else {
        4.0 * f.rhoc
    }
}

impl Model for HelmholtzFluid {
    fn id(&self) -> &str {
        match self.form.tier {
            Tier::Reference => "reference",
            Tier::Technical => "sw12",
        }
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    fn residual(&self, t: f64, rho: f64, _x: &[f64]) -> Residual {
        let (tau, delta) = self.form.reduce(t, rho);
        let r = self.form.residual(tau, delta);
        let k = self.k;
        Residual {
            a: k * r.a + (k - 1.0) * delta.ln(),
            a_d: k * delta * r.d + (k - 1.0),
            a_dd: k * delta * delta * r.dd - (k - 1.0),
            a_t: -k * tau * r.t,
            a_tt: k * (tau * tau * r.tt + 2.0 * tau * r.t),
            a_dt: -k * delta * tau * r.dt,
        }
    }

    fn ln_phi(&self, t: f64, rho: f64, x: &[f64], out: &mut [f64]) {
        let r = self.residual(t, rho, x);
        let z = r.z();
        if let Some(o) = out.first_mut() {
            *o = r.a + z - 1.0 - z.ln();
        }
    }

    fn densities(&self, t: f64, p: f64, _x: &[f64]) -> DensityRoots {
        let (r, n) = density::roots(self.form, t, p);
        DensityRoots::from_slice(&r[..n])
    }

    /// Below Tc and away from the saturation line, the vapour-pressure ancillary names the
    /// stable branch ([`super::branch_hint`]), and only that branch is searched, from the same
    /// start as in [`Model::densities`], so the root is the same to the bit.
    fn stable_density(&self, t: f64, p: f64, _x: &[f64]) -> Option<f64> {
        match branch_hint::stable_branch(self.form, t, p)? {
            Branch::Vapour => density::vapour_root(self.form, t, p),
            Branch::Liquid => density::liquid_root(self.form, t, p),
        }
    }

    fn max_density(&self, _x: &[f64]) -> f64 {
        self.rho_max
    }

    fn ideal_gas(&self, t: f64, _x: &[f64]) -> IdealGasValues {
        let f = self.form;
        let k = self.k;
        let tau = f.tc / t;
        let i = f.ideal(tau, 1.0); // at delta = 1, phi0 has no ln(delta) part
        IdealGasValues {
            cp_r: 1.0 - k * tau * tau * i.tt,
            h_r: t * (1.0 + k * tau * i.t) - self.h_ref + self.zero.0,
            s_r: k * (tau * i.t - i.a) + (f.rhoc * R * t / P_REF).ln() + self.s_const + self.zero.1,
        }
    }

    fn critical_z(&self) -> f64 {
        self.form.pc / (self.form.rhoc * self.form.r * self.form.tc)
    }

    fn molar_mass(&self, _x: &[f64]) -> f64 {
        self.form.molar_mass
    }
}
