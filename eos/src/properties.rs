//! Every property of a single-phase state, derived once from any [`Model`].
//!
//! With alpha the reduced residual Helmholtz energy (see [`crate::residual`]) the relations are
//! those of Span (2000), *Multiparameter Equations of State*, Springer, table 3.9, written in T
//! and molar density:
//!
//! - Z = 1 + a_d, P = rho R T Z
//! - h_res/(RT) = a_d - a_t, s_res/R = -alpha - a_t + ln Z (departures at the same T and P)
//! - g_res/(RT) = alpha + Z - 1 - ln Z (= ln phi of a pure fluid)
//! - cv = cv0 - R (a_tt + 2 a_t), cp = cv + T (dP/dT)^2 / (rho^2 dP/drho)
//! - w^2 = (cp/cv)(dP/drho)/M, mu_JT = (T (dP/dT)/(rho^2 dP/drho) - 1/rho)/cp
//!   = (a_dt - a_d - a_dd) / ((1 + 2 a_d + a_dd) rho cp)
//! - isentropic exponent k = -(v/P)(dP/dv)_s = (rho/P)(cp/cv)(dP/drho)_T
//!
//! Ideal-gas enthalpy and entropy are relative to [`crate::constants::T_REF`] and
//! [`crate::constants::P_REF`], with the ideal entropy of mixing -R sum x ln x.

use crate::constants::{P_REF, R};
use crate::model::Model;
use crate::need::Need;

/// All properties of one single-phase state. Molar quantities are per mole of mixture.
#[derive(Debug, Clone, PartialEq)]
pub struct Properties {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Molar density, mol/m3.
    pub rho: f64,
    /// Compressibility factor P/(rho R T).
    pub z: f64,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
    /// Residual (departure) enthalpy at the same T and P, J/mol.
    pub h_res: f64,
    /// Residual (departure) entropy at the same T and P, J/(mol K).
    pub s_res: f64,
    /// Residual (departure) Gibbs energy at the same T and P, J/mol.
    pub g_res: f64,
    /// Enthalpy, J/mol.
    pub h: f64,
    /// Entropy, J/(mol K).
    pub s: f64,
    /// Internal energy, J/mol.
    pub u: f64,
    /// Gibbs energy h - T s, J/mol.
    pub g: f64,
    /// Isochoric heat capacity, J/(mol K).
    pub cv: f64,
    /// Isobaric heat capacity, J/(mol K); `None` where the state is mechanically unstable
    /// (dP/drho <= 0, inside the spinodal).
    pub cp: Option<f64>,
    /// Speed of sound, m/s; `None` where the state is mechanically unstable.
    pub w: Option<f64>,
    /// Joule-Thomson coefficient, K/Pa; `None` where the state is mechanically unstable.
    pub jt: Option<f64>,
    /// Real-gas isentropic exponent -(v/P)(dP/dv)_s; `None` where mechanically unstable.
    pub isentropic_exponent: Option<f64>,
    /// (dP/drho)_T, Pa m3/mol.
    pub dp_drho: f64,
    /// (dP/dT)_rho, Pa/K.
    pub dp_dt: f64,
    /// ln of each component's fugacity coefficient.
    pub ln_phi: Vec<f64>,
    /// What was computed. With [`Need::Volumetric`] only t, p, rho, z, molar_mass and
    /// dp_drho hold values; the energies, heat capacities and dp_dt are NaN, cp, w, jt and
    /// the isentropic exponent `None`, and ln_phi empty.
    pub computed: Need,
}

impl Properties {
    /// Molar volume, m3/mol.
    pub fn molar_volume(&self) -> f64 {
        1.0 / self.rho
    }

    /// Mass density, kg/m3.
    pub fn mass_density(&self) -> f64 {
        self.rho * self.molar_mass
    }

    /// A state of which only the volumetric part is computed ([`Need::Volumetric`]); `dp_drho`
    /// NaN where the model does not have it at no extra cost.
    pub fn volumetric(t: f64, p: f64, rho: f64, z: f64, molar_mass: f64, dp_drho: f64) -> Self {
        Properties {
            t,
            p,
            rho,
            z,
            molar_mass,
            h_res: f64::NAN,
            s_res: f64::NAN,
            g_res: f64::NAN,
            h: f64::NAN,
            s: f64::NAN,
            u: f64::NAN,
            g: f64::NAN,
            cv: f64::NAN,
            cp: None,
            w: None,
            jt: None,
            isentropic_exponent: None,
            dp_drho,
            dp_dt: f64::NAN,
            ln_phi: Vec::new(),
            computed: Need::Volumetric,
        }
    }

    /// The same state on another zero of energy and entropy: h and u moved by `dh` (J/mol),
    /// s by `ds` (J/(mol K)), and so g by dh - T ds.
    pub fn shifted(mut self, dh: f64, ds: f64) -> Properties {
        self.u += dh;
        self.h += dh;
        self.s += ds;
        self.g += dh - self.t * ds;
        self
    }
}

/// Evaluates every property at T (K), molar density rho (mol/m3) and mole fractions x. The
/// caller has validated the inputs.
pub fn evaluate(model: &dyn Model, t: f64, rho: f64, x: &[f64]) -> Properties {
    evaluate_need(model, t, rho, x, Need::All)
}

/// Evaluates what `need` asks for (see [`Properties::computed`]); the values computed are
/// those of [`evaluate`], bit for bit.
pub fn evaluate_need(model: &dyn Model, t: f64, rho: f64, x: &[f64], need: Need) -> Properties {
    if need == Need::Volumetric {
        let r = model.residual(t, rho, x);
        let z = r.z();
        return Properties::volumetric(
            t,
            rho * R * t * z,
            rho,
            z,
            model.molar_mass(x),
            R * t * r.dp_drho_rt(),
        );
    }
    let r = model.residual(t, rho, x);
    let ig = model.ideal_gas(t, x);
    let z = r.z();
    let p = rho * R * t * z;
    let ln_z = z.ln();
    let h_res_rt = r.a_d - r.a_t;
    let s_res_r = -r.a - r.a_t + ln_z;
    let g_res_rt = r.a + z - 1.0 - ln_z;
    let mixing: f64 = x
        .iter()
        .filter(|&&xi| xi > 0.0)
        .map(|&xi| xi * xi.ln())
        .sum();
    let h = R * ig.h_r + R * t * h_res_rt;
    let s = R * (ig.s_r - (p / P_REF).ln() - mixing) + R * s_res_r;
    let cv = R * (ig.cp_r - 1.0 - r.a_tt - 2.0 * r.a_t);
    let dp_drho = R * t * r.dp_drho_rt();
    let dp_dt = rho * R * r.dp_dt_rho_r();
    let molar_mass = model.molar_mass(x);
    let stable = dp_drho > 0.0;
    let cp = stable.then(|| cv + t * dp_dt * dp_dt / (rho * rho * dp_drho));
    let w = cp.and_then(|cp| {
        let w2 = cp / cv * dp_drho / molar_mass;
        (w2 > 0.0).then(|| w2.sqrt())
    });
    // T (dP/dT)/(rho dP/drho) - 1 written in residual terms, so that it is exactly zero for
    // the ideal gas instead of a difference of two rounded equal numbers.
    let jt = cp.map(|cp| (r.a_dt - r.a_d - r.a_dd) / r.dp_drho_rt() / (rho * cp));
    let isentropic_exponent = cp.map(|cp| rho / p * cp / cv * dp_drho);
    let mut ln_phi = vec![0.0; x.len()];
    model.ln_phi(t, rho, x, &mut ln_phi);
    Properties {
        t,
        p,
        rho,
        z,
        molar_mass,
        h_res: R * t * h_res_rt,
        s_res: R * s_res_r,
        g_res: R * t * g_res_rt,
        h,
        s,
        u: h - p / rho,
        g: h - t * s,
        cv,
        cp,
        w,
        jt,
        isentropic_exponent,
        dp_drho,
        dp_dt,
        ln_phi,
        computed: Need::All,
    }
}
