//! Every property of a single-phase state at (T, rho) straight from a formulation, in the
//! formulation's own reference convention (for IAPWS-95: u = s = 0 for the saturated liquid at
//! the triple point), as the [`Properties`] every model fills. The residual (departure)
//! parts at the same T and P are h_res/(R T) = tau phir_t + delta phir_d, s_res/R =
//! tau phir_t - phir + ln Z and g_res/(R T) = phir + delta phir_d - ln Z.
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
use crate::properties::Properties;

/// All properties at T (K) and rho (mol/m3) from the two parts' derivatives. The caller has
/// checked T > 0 and rho > 0.
pub fn evaluate(f: &Formulation, t: f64, rho: f64) -> Properties {
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
) -> Properties {
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
    let p = rho * rt * z;
    let cv = f.r * cv_r;
    let dp_drho = rt * k;
    let ln_z = z.ln();
    Properties {
        t,
        p,
        rho,
        z,
        molar_mass: f.molar_mass,
        h_res: rt * (tau * r.t + dr_d),
        s_res: f.r * (tau * r.t - r.a + ln_z),
        g_res: rt * (r.a + dr_d - ln_z),
        h: rt * (1.0 + tau_t + dr_d),
        s: f.r * (tau_t - a_rt),
        u: rt * tau_t,
        g: rt * (1.0 + a_rt + dr_d),
        cv,
        cp,
        w,
        jt,
        isentropic_exponent: cp.map(|cp| rho / p * cp / cv * dp_drho),
        dp_drho,
        dp_dt: rho * f.r * x,
        ln_phi: vec![r.a + dr_d - ln_z],
        computed: crate::need::Need::All,
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
