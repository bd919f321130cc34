//! The mechanical-stability limits (spinodals) of an isotherm at fixed composition.
//!
//! Below its critical temperature a model's isotherm P(rho) has a van der Waals loop: dP/drho
//! falls from RT at rho -> 0 to a negative minimum and rises again towards the co-volume
//! limit. The loop ends are the spinodals, dP/drho = 0 (J. W. Gibbs' limit of intrinsic
//! stability). Every saturation state lies between them: the vapour density below the
//! vapour spinodal, the liquid above the liquid spinodal, and the saturation pressure
//! between the two spinodal pressures.
//!
//! The minimum of (dP/drho)/(RT) = 1 + 2 a_d + a_dd is found by golden-section search over
//! rho in (0, rho_max) (J. Kiefer, Proc. Am. Math. Soc. 4 (1953) 502), and the spinodal
//! densities by Brent's method on either side of it. When the minimum is not negative, the
//! isotherm is at or above the critical temperature and there is no loop.

use super::brent;
use crate::constants::R;
use crate::model::Model;

/// Ends of the van der Waals loop of one isotherm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spinodals {
    /// Vapour spinodal density (the lower one), mol/m3.
    pub rho_vapor: f64,
    /// Pressure at the vapour spinodal, Pa (the highest pressure a vapour root exists at).
    pub p_vapor: f64,
    /// Liquid spinodal density (the higher one), mol/m3.
    pub rho_liquid: f64,
    /// Pressure at the liquid spinodal, Pa (may be negative).
    pub p_liquid: f64,
    /// Density of the steepest descent of P, between the two, mol/m3.
    pub rho_inflection: f64,
}

fn slope(model: &dyn Model, t: f64, rho: f64, x: &[f64]) -> f64 {
    model.residual(t, rho, x).dp_drho_rt()
}

/// Density (mol/m3) of the minimum of (dP/drho)/(RT) along the isotherm and the minimum.
pub fn min_slope(model: &dyn Model, t: f64, x: &[f64]) -> (f64, f64) {
    let rho_max = model.max_density(x);
    let rho_max = if rho_max.is_finite() { rho_max } else { 1e6 };
    let g = 0.5 * (5.0_f64.sqrt() - 1.0);
    let (mut a, mut b) = (0.0, rho_max * (1.0 - 1e-9));
    let mut c = b - g * (b - a);
    let mut d = a + g * (b - a);
    let (mut fc, mut fd) = (slope(model, t, c, x), slope(model, t, d, x));
    for _ in 0..120 {
        if fc < fd {
            b = d;
            d = c;
            fd = fc;
            c = b - g * (b - a);
            fc = slope(model, t, c, x);
        } else {
            a = c;
            c = d;
            fc = fd;
            d = a + g * (b - a);
            fd = slope(model, t, d, x);
        }
        if b - a <= 1e-15 * b {
            break;
        }
    }
    if fc < fd {
        (c, fc)
    } else {
        (d, fd)
    }
}

/// The spinodals of the isotherm at T (K) and composition x, or `None` when the isotherm has
/// no loop (T at or above the model's critical temperature for this composition).
pub fn spinodals(model: &dyn Model, t: f64, x: &[f64]) -> Option<Spinodals> {
    let (rho_m, m) = min_slope(model, t, x);
    if m.is_nan() || m >= 0.0 {
        return None;
    }
    let rho_max = model.max_density(x);
    let rho_max = if rho_max.is_finite() { rho_max } else { 1e6 };
    let f = |rho: f64| slope(model, t, rho, x);
    let rho_v = brent::solve("vapour spinodal", 1e-12 * rho_m, rho_m, 1e-15, 0.0, f).ok()?;
    let mut hi = rho_m + 0.5 * (rho_max - rho_m);
    let mut k = 0;
    while f(hi) <= 0.0 && k < 60 {
        hi = 0.5 * (rho_max + hi);
        k += 1;
    }
    let rho_l = brent::solve("liquid spinodal", rho_m, hi, 1e-15, 0.0, f).ok()?;
    let p = |rho: f64| rho * R * t * model.residual(t, rho, x).z();
    Some(Spinodals {
        rho_vapor: rho_v,
        p_vapor: p(rho_v),
        rho_liquid: rho_l,
        p_liquid: p(rho_l),
        rho_inflection: rho_m,
    })
}
