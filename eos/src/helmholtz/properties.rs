//! Every property of a single-phase state at (T, rho) straight from a formulation, in the
//! formulation's own reference convention (for IAPWS-95: u = s = 0 for the saturated liquid at
//! the triple point).
//!
//! With phi0, phi_r and their derivatives at (tau, delta) (IAPWS R6-95(2018), Table 3;
//! Span (2000), *Multiparameter Equations of State*, table 3.9):
//!
//! ```text
//! p/(rho R T)   = Z = 1 + delta phir_d
//! u/(R T)       = tau (phi0_t + phir_t)
//! h/(R T)       = 1 + tau (phi0_t + phir_t) + delta phir_d
//! s/R           = tau (phi0_t + phir_t) - phi0 - phir
//! g/(R T)       = 1 + phi0 + phir + delta phir_d
//! cv/R          = -tau^2 (phi0_tt + phir_tt)
//! cp/R          = cv/R + (1 + delta phir_d - delta tau phir_dt)^2 / (1 + 2 delta phir_d + delta^2 phir_dd)
//! w^2 M/(R T)   = 1 + 2 delta phir_d + delta^2 phir_dd - (1 + delta phir_d - delta tau phir_dt)^2 / (tau^2 (phi0_tt + phir_tt))
//! mu_JT R rho   = -(delta phir_d + delta^2 phir_dd + delta tau phir_dt)
//!                 / ((1 + delta phir_d - delta tau phir_dt)^2 - tau^2 (phi0_tt + phir_tt)(1 + 2 delta phir_d + delta^2 phir_dd))
//! ln phi        = phir + delta phir_d - ln(1 + delta phir_d)
//! B(T)          = lim_{delta -> 0} phir_d / rhoc
//! ```

use super::derivs::Derivs;
use super::formulation::Formulation;

/// Properties of one state, molar SI units (J/mol, J/(mol K), Pa, mol/m3).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FluidProperties {
    /// Temperature, K.
    pub t: f64,
    /// Molar density, mol/m3.
    pub rho: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Compressibility factor p/(rho R T) with the formulation's R.
    pub z: f64,
    /// Internal energy, J/mol.
    pub u: f64,
    /// Enthalpy, J/mol.
    pub h: f64,
    /// Entropy, J/(mol K).
    pub s: f64,
    /// Gibbs energy, J/mol.
    pub g: f64,
    /// Helmholtz energy, J/mol.
    pub a: f64,
    /// Isochoric heat capacity, J/(mol K).
    pub cv: f64,
    /// Isobaric heat capacity, J/(mol K); `None` where dp/drho <= 0 (mechanically unstable).
    pub cp: Option<f64>,
    /// Speed of sound, m/s; `None` where mechanically unstable.
    pub w: Option<f64>,
    /// Joule-Thomson coefficient, K/Pa; `None` where mechanically unstable.
    pub jt: Option<f64>,
    /// Natural logarithm of the fugacity coefficient.
    pub ln_phi: f64,
    /// (dp/drho)_T, Pa m3/mol.
    pub dp_drho: f64,
    /// (dp/dT)_rho, Pa/K.
    pub dp_dt: f64,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
}

impl FluidProperties {
    /// Mass density, kg/m3.
    pub fn mass_density(&self) -> f64 {
        self.rho * self.molar_mass
    }

    /// Fugacity coefficient.
    pub fn phi(&self) -> f64 {
        self.ln_phi.exp()
    }

    /// Fugacity, Pa.
    pub fn fugacity(&self) -> f64 {
        self.p * self.phi()
    }
}

/// All properties at T (K) and rho (mol/m3) from the two parts' derivatives. The caller has
/// checked T > 0 and rho > 0.
pub fn evaluate(f: &Formulation, t: f64, rho: f64) -> FluidProperties {
    let (tau, delta) = f.reduce(t, rho);
    let i = f.ideal(tau, delta);
    let r = f.residual(tau, delta);
    from_derivs(f, t, rho, tau, delta, &i, &r)
}

/// The properties from precomputed derivatives at (tau, delta) of (T, rho).
pub fn from_derivs(
    f: &Formulation,
    t: f64,
    rho: f64,
    tau: f64,
    delta: f64,
    i: &Derivs,
    r: &Derivs,
) -> FluidProperties {
    let rt = f.r * t;
    let dr_d = delta * r.d;
    let z = 1.0 + dr_d;
    let k = 1.0 + 2.0 * dr_d + delta * delta * r.dd; // (dp/drho)/(RT)
    let x = 1.0 + dr_d - delta * tau * r.dt; // (dp/dT)/(rho R)
    let tau_t = tau * (i.t + r.t);
    let cv_r = -tau * tau * (i.tt + r.tt);
    let stable = k > 0.0;
    let cp = stable.then(|| f.r * (cv_r + x * x / k));
    let w = stable
        .then(|| rt / f.molar_mass * (k + x * x / cv_r))
        .filter(|w2| *w2 > 0.0)
        .map(f64::sqrt);
    let jt = stable.then(|| {
        -(dr_d + delta * delta * r.dd + delta * tau * r.dt) / ((x * x + cv_r * k) * f.r * rho)
    });
    let a_rt = i.a + r.a;
    FluidProperties {
        t,
        rho,
        p: rho * rt * z,
        z,
        u: rt * tau_t,
        h: rt * (1.0 + tau_t + dr_d),
        s: f.r * (tau_t - a_rt),
        g: rt * (1.0 + a_rt + dr_d),
        a: rt * a_rt,
        cv: f.r * cv_r,
        cp,
        w,
        jt,
        ln_phi: r.a + dr_d - z.ln(),
        dp_drho: rt * k,
        dp_dt: rho * f.r * x,
        molar_mass: f.molar_mass,
    }
}

/// Second virial coefficient B(T) in m3/mol: the delta -> 0 limit of phir_d / rhoc, taken by
/// Richardson extrapolation of phir_d at delta = 1e-6 and 2e-6 (error of order 1e-12).
pub fn second_virial(f: &Formulation, t: f64) -> f64 {
    let tau = f.tc / t;
    let h = 1e-6;
    let d1 = f.residual(tau, h).d;
    let d2 = f.residual(tau, 2.0 * h).d;
    (2.0 * d1 - d2) / f.rhoc
}
