//! Vapour-liquid saturation of a pure fluid: saturation pressure at T, saturation
//! temperature at P, with the properties of both phases.
//!
//! Equilibrium of a pure fluid is equal temperature, pressure and fugacity of liquid and
//! vapour: g(P) = ln phi_L(T, P) - ln phi_V(T, P) = 0. Since d ln phi / d ln P = Z - 1 for a
//! pure fluid, g'(ln P) = Z_L - Z_V < 0 and Newton's method on ln P reads
//!
//! ln P <- ln P - (ln phi_L - ln phi_V) / (Z_L - Z_V)
//!
//! It starts from the corresponding-states estimate P = Pc 10^(7/3 (1 + omega)(1 - Tc/T))
//! (Pitzer's acentric factor, K. S. Pitzer et al., J. Am. Chem. Soc. 77 (1955) 3433) and is
//! safeguarded by a bracket: the saturation pressure lies between the spinodal pressures of
//! the isotherm (see [`super::spinodal`]), where both a liquid and a vapour root exist and g
//! is monotone. A Newton step that leaves the bracket, or lands where the model has a single
//! root (close to the critical point the loop is narrow), is replaced by bisection; liquid
//! and vapour roots that coincide (the trivial solution) are never accepted, since the
//! bracket stays strictly inside the loop. No loop on the isotherm means T is at or above the
//! model's critical temperature: [`Error::OutOfRange`].
//!
//! For a pure fluid ln phi = alpha_res + Z - 1 - ln Z, with Z = P/(rho R T) exact at a root
//! of the pressure equation.
//!
//! The saturation temperature at P inverts this with Newton's method on 1/T using the
//! Clausius-Clapeyron equation in its exact form, d ln Psat / d(1/T) = -dh_vap / (R (Z_V -
//! Z_L)), bracketed between a temperature where Psat < P and the model's critical point.

use super::critical_point;
use super::spinodal::{spinodals, Spinodals};
use super::wilson;
use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::model::Model;
use crate::properties::{evaluate, Properties};

/// A saturation state of a pure fluid.
#[derive(Debug, Clone, PartialEq)]
pub struct Saturation {
    /// Temperature, K.
    pub t: f64,
    /// Saturation pressure, Pa.
    pub p: f64,
    /// Saturated liquid.
    pub liquid: Properties,
    /// Saturated vapour.
    pub vapor: Properties,
    /// Enthalpy of vaporisation h_V - h_L, J/mol.
    pub h_vap: f64,
    /// Newton/bisection iterations of the pressure solve.
    pub iterations: usize,
}

impl Saturation {
    /// Saturated-liquid molar density, mol/m3.
    pub fn rho_l(&self) -> f64 {
        self.liquid.rho
    }
    /// Saturated-vapour molar density, mol/m3.
    pub fn rho_v(&self) -> f64 {
        self.vapor.rho
    }
}

/// Largest |ln phi_L - ln phi_V| accepted at convergence.
pub const FUGACITY_TOLERANCE: f64 = 1e-12;
const MAX_ITER: usize = 200;

fn check_pure(model: &dyn Model) -> Result<()> {
    let n = model.components().len();
    if n != 1 {
        return Err(Error::invalid(
            "number of components",
            n as f64,
            "1 (saturation of a pure fluid; use bubble and dew points for mixtures)",
        ));
    }
    Ok(())
}

/// Liquid and vapour at (T, P): (g, Z_L, Z_V, rho_L, rho_V), or the side of the loop P is on
/// when the model has a single root there (Err(true): too low, only vapour).
fn both_phases(
    model: &dyn Model,
    t: f64,
    p: f64,
    sp: &Spinodals,
) -> std::result::Result<(f64, f64, f64, f64, f64), bool> {
    let x = [1.0];
    let roots = model.densities(t, p, &x);
    let r = roots.as_slice();
    if r.is_empty() {
        return Err(p < sp.p_vapor);
    }
    let (rv, rl) = (r[0], r[r.len() - 1]);
    if r.len() < 2 || rl - rv <= 1e-9 * rl {
        return Err(rv < sp.rho_inflection);
    }
    // ln phi = alpha_res + Z - 1 - ln Z with Z = P/(rho R T) exact at a root of P.
    let ln_phi = |rho: f64| {
        let z = p / (rho * R * t);
        (model.residual(t, rho, &x).a + z - 1.0 - z.ln(), z)
    };
    let (lv, zv) = ln_phi(rv);
    let (ll, zl) = ln_phi(rl);
    Ok((ll - lv, zl, zv, rl, rv))
}

/// Saturation pressure and both saturated phases of a pure fluid at temperature `t` (K).
pub fn pressure(model: &dyn Model, t: f64) -> Result<Saturation> {
    check_pure(model)?;
    positive("temperature (K)", t)?;
    let x = [1.0];
    let sp = spinodals(model, t, &x).ok_or_else(|| Error::OutOfRange {
        model: model.id().to_string(),
        what: "temperature",
        detail: format!(
            "T = {t} K is at or above the critical temperature of the model \
             (the isotherm has no vapour-liquid loop, so there is no saturation state)"
        ),
    })?;
    // Bracket on u = ln P: g > 0 at lo (vapour stable), g < 0 at hi (liquid stable).
    let mut hi = (sp.p_vapor * (1.0 - 1e-12)).ln();
    let mut lo = if sp.p_liquid > 0.0 {
        (sp.p_liquid * (1.0 + 1e-12)).ln()
    } else {
        let mut u = (sp.p_vapor * 1e-3).ln();
        let mut k = 0;
        while !matches!(both_phases(model, t, u.exp(), &sp), Ok((g, ..)) if g > 0.0) {
            u -= 3.0 * std::f64::consts::LN_10;
            k += 1;
            if k > 100 {
                return Err(Error::NoSolution(format!(
                    "{}: no pressure below the vapour spinodal at T = {t} K favours the vapour",
                    model.id()
                )));
            }
        }
        u
    };
    let guess = wilson::vapour_pressure(&model.components()[0], t).ln();
    let mut u = if guess > lo && guess < hi {
        guess
    } else {
        0.5 * (lo + hi)
    };
    // Best point so far: (|g|, ln P, rho_L, rho_V).
    let mut best = (f64::INFINITY, u, 0.0, 0.0);
    for it in 1..=MAX_ITER {
        let next = match both_phases(model, t, u.exp(), &sp) {
            Ok((g, zl, zv, rl, rv)) => {
                if g.abs() < best.0 {
                    best = (g.abs(), u, rl, rv);
                }
                if g > 0.0 {
                    lo = u;
                } else {
                    hi = u;
                }
                let step = -g / (zl - zv);
                if g.abs() <= FUGACITY_TOLERANCE {
                    return finish(model, t, u.exp(), rl, rv, it);
                }
                let un = u + step;
                if un > lo && un < hi && step.is_finite() && step.abs() > 1e-16 * u.abs() {
                    un
                } else {
                    0.5 * (lo + hi)
                }
            }
            Err(too_low) => {
                if too_low {
                    lo = u;
                } else {
                    hi = u;
                }
                0.5 * (lo + hi)
            }
        };
        if hi - lo <= 4.0 * f64::EPSILON * lo.abs().max(1.0)
            || (next - u).abs() <= f64::EPSILON * u.abs()
        {
            // The bracket has collapsed to rounding: the fugacity difference cannot be
            // resolved further (the liquid's ln phi carries the rounding of ln(Z - B) at low
            // reduced temperature). Accept the best point if it meets 1e-10.
            if best.0 <= 1e-10 {
                return finish(model, t, best.1.exp(), best.2, best.3, it);
            }
            return Err(Error::NotConverged {
                solver: "saturation pressure",
                iterations: it,
                residual: best.0,
            });
        }
        u = next;
    }
    Err(Error::NotConverged {
        solver: "saturation pressure",
        iterations: MAX_ITER,
        residual: best.0,
    })
}

fn finish(model: &dyn Model, t: f64, p: f64, rl: f64, rv: f64, it: usize) -> Result<Saturation> {
    let x = [1.0];
    let mut liquid = evaluate(model, t, rl, &x);
    let mut vapor = evaluate(model, t, rv, &x);
    // Both phases are at the converged pressure; P recomputed from each root differs from it
    // only by the cubic's rounding.
    liquid.p = p;
    vapor.p = p;
    let h_vap = vapor.h - liquid.h;
    Ok(Saturation {
        t,
        p,
        liquid,
        vapor,
        h_vap,
        iterations: it,
    })
}

/// Saturation temperature and both saturated phases of a pure fluid at pressure `p` (Pa).
pub fn temperature(model: &dyn Model, p: f64) -> Result<Saturation> {
    check_pure(model)?;
    positive("pressure (Pa)", p)?;
    let crit = critical_point::pure(model)?;
    if p >= crit.p {
        return Err(Error::OutOfRange {
            model: model.id().to_string(),
            what: "pressure",
            detail: format!(
                "P = {p} Pa is at or above the critical pressure of the model, {:.6e} Pa",
                crit.p
            ),
        });
    }
    let t_top = crit.t * (1.0 - 1e-10);
    let c = &model.components()[0];
    let guess = wilson::vapour_temperature(c, p).min(t_top * (1.0 - 1e-6));
    let guess = if guess.is_finite() && guess > 0.0 {
        guess
    } else {
        0.5 * t_top
    };
    // Bracket on w = 1/T: F(w) = ln Psat(1/w) - ln p, decreasing in w.
    let mut w_lo = 1.0 / t_top; // F > 0 (Psat near Pc > p) or no loop at all
    let mut t_low = guess;
    let mut k = 0;
    loop {
        match pressure(model, t_low) {
            Ok(s) if s.p < p => break,
            Ok(_) => {}
            Err(Error::OutOfRange { .. }) => {}
            Err(e) => return Err(e),
        }
        t_low *= 0.8;
        k += 1;
        if k > 60 {
            return Err(Error::NoSolution(format!(
                "{}: no temperature found with a vapour pressure below {p} Pa",
                model.id()
            )));
        }
    }
    let mut w_hi = 1.0 / t_low;
    let mut w = 1.0 / guess.max(t_low);
    let mut best = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let step = match pressure(model, 1.0 / w) {
            Ok(s) => {
                let f = (s.p / p).ln();
                best = best.min(f.abs());
                if f.abs() <= 1e-12 {
                    return Ok(s);
                }
                if f > 0.0 {
                    w_lo = w;
                } else {
                    w_hi = w;
                }
                let dz = s.vapor.z - s.liquid.z;
                let slope = -s.h_vap / (R * dz);
                -f / slope
            }
            Err(Error::OutOfRange { .. }) => {
                w_lo = w;
                f64::NAN
            }
            Err(e) => return Err(e),
        };
        let wn = w + step;
        w = if wn > w_lo && wn < w_hi && step.is_finite() {
            wn
        } else {
            0.5 * (w_lo + w_hi)
        };
        if w_hi - w_lo <= 4.0 * f64::EPSILON * w_hi {
            break;
        }
    }
    Err(Error::NotConverged {
        solver: "saturation temperature",
        iterations: MAX_ITER,
        residual: best,
    })
}
