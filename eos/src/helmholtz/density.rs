//! Density from (T, p) for a formulation: a safeguarded Newton iteration on each branch of the
//! isotherm.
//!
//! p(rho) = rho R T (1 + delta phir_d), dp/drho = R T (1 + 2 delta phir_d + delta^2 phir_dd).
//!
//! - Vapour-like branch: Newton from the ideal-gas density p/(RT), with a bracket [lo, hi] kept
//!   from the signs of p - p_target (bisection when a step leaves it). Below Tc the iterates
//!   stay below rhoc; meeting dp/drho <= 0 means the vapour spinodal lies between the last
//!   stable point and the iterate, found by bisection on the sign of dp/drho; if p there is below
//!   the target there is no vapour root.
//! - Liquid-like branch (below Tc): the same from the saturated-liquid ancillary density,
//!   staying above rhoc, with the liquid spinodal as the lower bound.
//!
//! Every root found is returned (up to two: stable and metastable), so that the caller can pick
//! the one of lowest Gibbs energy. Iterations are capped.

use super::formulation::Formulation;

/// Cap of Newton/bisection iterations per branch.
pub const MAX_ITER: usize = 200;

/// Which branch of an isotherm.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Branch {
    /// Low density (vapour or supercritical gas).
    Vapour,
    /// High density (liquid).
    Liquid,
}

/// p (Pa) and dp/drho (Pa m3/mol) at (T, rho).
#[inline]
pub fn p_dp(f: &Formulation, t: f64, rho: f64) -> (f64, f64) {
    let (tau, delta) = f.reduce(t, rho);
    let r = f.residual(tau, delta);
    let rt = f.r * t;
    (
        rho * rt * (1.0 + delta * r.d),
        rt * (1.0 + 2.0 * delta * r.d + delta * delta * r.dd),
    )
}

/// Relative width of the spinodal bracket below which the isotherm is taken as a parabola
/// about its extremum (the tangent bound of [`spinodal`]).
const TANGENT_BRACKET: f64 = 1e-3;

/// Bisection on the sign of dp/drho between `stable` (dp/drho > 0) and `unstable` (<= 0):
/// a density next to the spinodal and its pressure. Stops early at a stable point whose
/// pressure passes `target` in the direction `above` (a root lies before it), at a stable
/// point within [`TANGENT_BRACKET`] of the unstable one whose tangent cannot reach the target
/// (no root on this side; the tangent's value is returned, beyond the spinodal's pressure), or
/// when the bracket is 1e-8 wide (p is flat at the spinodal, so its pressure is then known to
/// ~1e-16).
fn spinodal(
    f: &Formulation,
    t: f64,
    target: f64,
    above: bool,
    mut stable: f64,
    mut unstable: f64,
) -> (f64, f64) {
    let mut p_stable = p_dp(f, t, stable).0;
    for _ in 0..60 {
        let mid = 0.5 * (stable + unstable);
        if (unstable - stable).abs() <= 1e-8 * mid {
            break;
        }
        let (p, dp) = p_dp(f, t, mid);
        if dp > 0.0 {
            stable = mid;
            p_stable = p;
            if (above && p >= target) || (!above && p <= target) {
                break;
            }
            // Close to the spinodal the isotherm is locally a parabola about its extremum,
            // so p there lies within the tangent at this point: when even the tangent cannot
            // reach the target, no root lies on this side and the bracket need not shrink.
            let reach = p + dp * (unstable - stable);
            if (unstable - stable).abs() <= TANGENT_BRACKET * mid
                && ((above && reach < target) || (!above && reach > target))
            {
                return (stable, reach);
            }
        } else {
            unstable = mid;
        }
    }
    (stable, p_stable)
}

/// The root of p(rho) = `target` on `branch` at T, or `None` when that branch has none.
/// Below Tc the vapour branch is searched below rhoc and the liquid branch above it.
pub fn solve_branch(
    f: &Formulation,
    t: f64,
    target: f64,
    branch: Branch,
    start: f64,
) -> Option<f64> {
    solve_branch_split(f, t, target, branch, start, f.rhoc)
}

/// [`solve_branch`] with the density `split` that separates the branches below Tc (rhoc, or
/// the density of the least stable point of the isotherm).
pub fn solve_branch_split(
    f: &Formulation,
    t: f64,
    target: f64,
    branch: Branch,
    start: f64,
    split: f64,
) -> Option<f64> {
    let subcritical = t < f.tc;
    let (mut lo, mut hi) = match branch {
        Branch::Vapour => (0.0, if subcritical { split } else { f64::INFINITY }),
        Branch::Liquid => (split, f64::INFINITY),
    };
    let limit = hi;
    // Whether lo / hi are known stable points with p below / above the target.
    let mut lo_ok = branch == Branch::Vapour;
    let mut hi_ok = false;
    // The start, kept inside (lo, hi]; a start below the bracket (a very dilute gas) is
    // raised to its floor, a start that is not a number goes to the fallback below.
    let mut rho = if start.is_nan() {
        start
    } else {
        let r = start.max(lo + 1e-12 * f.rhoc);
        if hi.is_finite() {
            r.min(hi)
        } else {
            r
        }
    };
    if !(rho > lo && rho.is_finite()) {
        rho = if branch == Branch::Vapour {
            0.5 * (lo + hi.min(f.rhoc))
        } else {
            2.0 * f.rhoc
        };
    }
    for _ in 0..MAX_ITER {
        let (p, dp) = p_dp(f, t, rho);
        if !(p.is_finite() && dp.is_finite()) {
            hi = rho;
            rho = 0.5 * (lo + rho);
            continue;
        }
        if dp <= 0.0 {
            match branch {
                Branch::Vapour => {
                    let (rs, ps) = spinodal(f, t, target, true, lo, rho);
                    if ps < target {
                        return None;
                    }
                    hi = rs;
                    hi_ok = true;
                }
                Branch::Liquid => {
                    if !hi_ok {
                        // Started inside the unstable region: move up.
                        lo = rho;
                        rho *= 1.1;
                        continue;
                    }
                    let (rs, ps) = spinodal(f, t, target, false, hi, rho);
                    if ps > target {
                        return None;
                    }
                    lo = rs;
                    lo_ok = true;
                }
            }
            rho = 0.5 * (lo + hi);
            continue;
        }
        // Pinned against the split without reaching the target: no root on this branch.
        match branch {
            Branch::Vapour if p < target && rho > (1.0 - 1e-9) * limit => return None,
            Branch::Liquid if p > target && rho < (1.0 + 1e-9) * split => return None,
            _ => {}
        }
        // Converged to rounding in pressure.
        if (p - target).abs() <= 8.0 * f64::EPSILON * target {
            return Some(rho);
        }
        if p < target {
            lo = rho;
            lo_ok = true;
        } else {
            hi = rho;
            hi_ok = true;
        }
        let mut next = rho - (p - target) / dp;
        if !(next > lo && next < hi) {
            next = match (lo_ok, hi_ok && hi.is_finite()) {
                (true, true) => 0.5 * (lo + hi),
                (true, false) => (4.0 * rho).min(if hi.is_finite() {
                    0.5 * (rho + hi)
                } else {
                    f64::MAX
                }),
                (false, true) => (0.5 * rho).max(0.5 * (lo + rho)),
                (false, false) => 0.5 * (lo + hi),
            };
        }
        if (next - rho).abs() <= 1e-13 * rho || (lo_ok && hi_ok && hi - lo <= 1e-14 * hi) {
            return Some(next);
        }
        rho = next;
    }
    None
}

/// Every density root (mol/m3) at (T, p): up to two, ascending.
pub fn roots(f: &Formulation, t: f64, p: f64) -> ([f64; 2], usize) {
    let mut out = [0.0; 2];
    let mut n = 0;
    if let Some(v) = vapour_root(f, t, p) {
        out[n] = v;
        n += 1;
    }
    if let Some(l) = liquid_root(f, t, p) {
        if n == 0 || (l - out[0]).abs() > 1e-9 * l {
            out[n] = l;
            n += 1;
        }
    }
    (out, n)
}

/// The root on the vapour-like branch (the only branch at or above Tc), searched from the
/// ideal-gas density; `None` where there is none or the one found is spurious.
///
/// Below Tc a vapour, stable or metastable, exists only up to the vapour spinodal, whose
/// pressure stays below the critical pressure (the spinodal ends at the critical point): a
/// vapour-branch root at a pressure above pc (with a margin of [`PC_MARGIN`] for the
/// difference between the published critical point and the equation's own) lies on one of
/// the spurious loops inside the dome (Span, *Multiparameter Equations of State*, Springer
/// 2000, ch. 3). Found for compressed liquid methane by Setzmann & Wagner at 93 K and 79 bar:
/// a root at 10 061 mol/m3, just below the critical density.
pub fn vapour_root(f: &Formulation, t: f64, p: f64) -> Option<f64> {
    let rho = solve_branch(f, t, p, Branch::Vapour, p / (f.r * t))?;
    let spurious = t < f.tc && p > f.pc * (1.0 + PC_MARGIN);
    (!spurious).then_some(rho)
}

/// Relative margin above the published critical pressure before a vapour root below Tc is
/// taken as spurious.
const PC_MARGIN: f64 = 1e-3;

/// The root on the liquid branch below Tc, searched from the saturated-liquid ancillary
/// density; `None` at or above Tc, where there is none, or where the one found is spurious.
pub fn liquid_root(f: &Formulation, t: f64, p: f64) -> Option<f64> {
    if t >= f.tc {
        return None;
    }
    let start = match &f.rhol_anc {
        Some(a) => f.rhoc * a.reduced(t, f.tc),
        None => 2.0 * f.rhoc,
    };
    let l = solve_branch(f, t, p, Branch::Liquid, start.max(1.01 * f.rhoc))?;
    let spurious = dome_middle(f, t).is_some_and(|mid| l < mid);
    (!spurious).then_some(l)
}

/// The density halfway between the saturated vapour and liquid at T (from the ancillary
/// equations; `None` above Tc or without them). A "liquid" root below it lies in the middle
/// of the two-phase dome, on one of the spurious loops that multiparameter equations of state
/// have there (Span, *Multiparameter Equations of State*, Springer 2000, ch. 3); it is no
/// phase. Found at 597 K and about 10 bar in IAPWS-95 (a root at 343 kg/m3 with a positive
/// slope and the lowest Gibbs energy), where it ended a compressor calculation.
fn dome_middle(f: &Formulation, t: f64) -> Option<f64> {
    if t >= f.tc {
        return None;
    }
    let liquid = f.rhol_anc.as_ref()?.reduced(t, f.tc) * f.rhoc;
    let vapour = f.rhov_anc.as_ref()?.reduced(t, f.tc) * f.rhoc;
    Some(0.5 * (liquid + vapour))
}
