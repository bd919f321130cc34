//! The reduced-density roots d = 1/Vr of one Lee-Kesler fluid at (Tr, Pr): every d in
//! (0, D_MAX] with Pr(Tr, d) = Pr (see [`super::isotherm`] for Pr(d)).
//!
//! The roots are, by definition, those of a scan of f(d) = Pr(d) - Pr on the grid
//! d_k = k D_STEP (D_STEP = 0.02, up to D_MAX = 25): a root is reported in every grid cell
//! where f changes sign, ascending, at most [`MAX_ROOTS`], each polished by a safeguarded
//! Newton iteration inside its cell. Below about Tr = 0.4 an isotherm can cross a low
//! pressure five times (the equation's loops between the vapour and the liquid): all five
//! are kept, so that the liquid is the densest root (at Tr = 0.30 and Pr = 0.01 the third
//! root gives Z = 0.0108, the fifth the tables' 0.0029). The scan is not run point by point:
//!
//! - Above the critical temperature (Tr > MONOTONIC_TR) the isotherm rises monotonically over
//!   the whole range (tested in `fluid`), so there is at most one root; it is found by a
//!   safeguarded Newton iteration on the bracket (0, D_MAX) started from the truncated
//!   density series Z = 1 + B d + C2 d^2 (C2 = C + beta c4/Tr^3, the d^2 part of the
//!   exponential term): its pressure form Z = 1 + B x + (C2 - B^2) x^2 at x = Pr/Tr gives d,
//!   refined once by d = x/(1 + B d + C2 d^2). D_MAX is checked to bracket the root only if
//!   the iteration is driven there.
//! - Otherwise grid points are skipped where a bound proves f keeps its sign. With
//!   F = f(a), G = f'(a) and M >= |f''| on [a, a + w] (`Isotherm::curvature_bound`), Taylor's
//!   theorem gives s f(a + t) >= |F| + s G t - M t^2/2 with s = sign F, which stays positive
//!   for t < t* = (s G + sqrt(G^2 + 2 M |F|))/M (equivalently 2|F|/(sqrt(G^2 + 2 M |F|) - s G)).
//!   Every grid point within 0.999 min(t*, w) of a has the sign of f(a), so the sign changes
//!   found, the cells they are in and the polished roots are the point-by-point scan's own;
//!   where the bound proves nothing the next grid point is evaluated as the scan would.

use super::isotherm::{Isotherm, Sample};
use crate::error::{Error, Result};

/// Highest reduced density scanned (Vr = 0.04, denser than any liquid of either fluid).
pub const D_MAX: f64 = 25.0;
/// Scan step in reduced density.
pub const D_STEP: f64 = 0.02;
/// Reduced temperature above which the isotherms are monotonic (a margin above Tr = 1).
pub const MONOTONIC_TR: f64 = 1.001;
/// Iteration cap of the Newton iterations.
const MAX_ITER: usize = 100;
/// Fraction of the proven sign-keeping distance that is used (a margin for round-off).
const SAFETY: f64 = 0.999;
/// Widest interval over which the curvature is bounded in one step.
const MAX_WINDOW: f64 = 2.0;

/// Most roots of one isotherm at one pressure.
pub const MAX_ROOTS: usize = 5;

/// Up to [`MAX_ROOTS`] reduced densities d = 1/Vr with Pr(Tr, d) = Pr, ascending.
#[derive(Debug, Clone, Copy, Default)]
pub struct Roots {
    pub len: usize,
    pub d: [f64; MAX_ROOTS],
    /// The isotherm sampled at each root (the root finder's last evaluation there).
    at: [Sample; MAX_ROOTS],
}

impl Roots {
    /// The roots found.
    pub fn as_slice(&self) -> &[f64] {
        &self.d[..self.len]
    }

    /// Z, dZ/dd and E at the `i`-th root.
    pub fn sample(&self, i: usize) -> Option<Sample> {
        self.at[..self.len].get(i).copied()
    }

    fn push(&mut self, (d, s): (f64, Sample)) {
        if self.len < MAX_ROOTS {
            self.d[self.len] = d;
            self.at[self.len] = s;
            self.len += 1;
        }
    }
}

/// Every root at reduced pressure `pr` on the isotherm `iso` (module docs).
pub fn roots(iso: &Isotherm, pr: f64) -> Result<Roots> {
    let mut out = Roots::default();
    if iso.tr > MONOTONIC_TR {
        if let Some(found) = monotonic_root(iso, pr)? {
            out.push(found);
            return Ok(out);
        }
    }
    scan(iso, pr, &mut out)?;
    if out.len == 0 {
        return Err(Error::NoSolution(format!(
            "Lee-Kesler fluid has no volume root at Tr = {}, Pr = {pr}",
            iso.tr
        )));
    }
    Ok(out)
}

/// The one root of a monotonic isotherm (Tr > [`MONOTONIC_TR`]) with the isotherm sampled
/// there, or `None` when Pr(D_MAX) < pr.
#[inline]
pub fn monotonic_root(iso: &Isotherm, pr: f64) -> Result<Option<(f64, Sample)>> {
    let (mut lo, mut hi) = (0.0, D_MAX);
    let mut hi_checked = false;
    // Z = 1 + B d + C2 d^2 + ... with C2 = C + k beta (the exponential term's d^2 part)
    // inverted to Z = 1 + B x + (C2 - B^2) x^2 in x = Pr/Tr, then one substitution.
    let x = pr / iso.tr;
    let c2 = iso.c + iso.k * iso.fluid.beta;
    let z0 = 1.0 + iso.b * x + (c2 - iso.b * iso.b) * x * x;
    let mut d = if z0 > 0.1 { x / z0 } else { x };
    let z1 = 1.0 + iso.b * d + c2 * d * d;
    if z1 > 0.1 {
        d = x / z1;
    }
    if !(d > lo && d < hi) {
        d = 0.5 * (lo + hi);
    }
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let s = iso.sample(d);
        let (p, dp) = iso.pr_of(d, &s);
        let r = p - pr;
        last = r;
        if r.abs() <= 1e-14 * pr.max(1e-300) {
            return Ok(Some((d, s)));
        }
        if r < 0.0 {
            lo = d;
        } else {
            hi = d;
            hi_checked = true;
        }
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            if !hi_checked && iso.pr(D_MAX).0 < pr {
                return Ok(None);
            }
            return Ok(Some((d, s)));
        }
        d = safeguarded_step(d, r, dp, lo, hi);
    }
    Err(not_converged(last))
}

/// Grid cells from `a` (where f = `f`, f' = `g`) over which f provably keeps its sign, and
/// the curvature window to try next.
fn sign_keeping_cells(iso: &Isotherm, a: f64, f: f64, g: f64, window: f64) -> (usize, f64) {
    let w = window.min(D_MAX - a);
    if w.is_nan() || w <= 0.0 || f == 0.0 {
        return (0, window);
    }
    let m = iso.curvature_bound(a, a + w);
    let fa = f.abs();
    let sg = if f < 0.0 { -g } else { g };
    let root = (g * g + 2.0 * m * fa).sqrt();
    let t = if sg >= 0.0 {
        if m > 0.0 {
            (sg + root) / m
        } else {
            f64::INFINITY
        }
    } else {
        2.0 * fa / (root - sg)
    };
    let next = if t >= w {
        (2.0 * w).min(MAX_WINDOW)
    } else {
        (2.0 * t).max(4.0 * D_STEP)
    };
    let t = SAFETY * t.min(w);
    if !(t.is_finite() && t > 0.0) {
        return (0, next);
    }
    ((t / D_STEP).floor() as usize, next)
}

/// The grid scan of the module docs, skipping proven sign-keeping stretches.
fn scan(iso: &Isotherm, pr: f64, out: &mut Roots) -> Result<()> {
    let mut k = 0usize;
    let mut lo = 0.0;
    let mut f_lo = -pr;
    let mut g_lo = iso.pr(0.0).1;
    let mut window = MAX_WINDOW;
    // Each pass advances k by at least one grid cell, and k * D_STEP <= D_MAX.
    let cap = (D_MAX / D_STEP) as usize + 2;
    for _ in 0..cap {
        if out.len >= MAX_ROOTS {
            break;
        }
        let (skip, next) = sign_keeping_cells(iso, lo, f_lo, g_lo, window);
        window = next;
        let step = skip.max(1);
        let hi = (k + step) as f64 * D_STEP;
        if hi > D_MAX {
            // Past the last grid point, or f keeps its sign up to beyond it.
            break;
        }
        let (p_hi, g_hi) = iso.pr(hi);
        let f_hi = p_hi - pr;
        if f_lo.is_nan() || f_hi.is_nan() {
            break;
        }
        if (f_lo < 0.0) != (f_hi < 0.0) {
            if step > 1 {
                // The bound was beaten by round-off: go back to single cells from here.
                window = 0.0;
                continue;
            }
            out.push(polish(iso, pr, lo, hi, f_lo < 0.0)?);
        }
        k += step;
        lo = hi;
        f_lo = f_hi;
        g_lo = g_hi;
    }
    Ok(())
}

/// Safeguarded Newton iteration for f(d) = 0 inside a cell [lo, hi] where f changes sign
/// (`rising`: f(lo) < 0).
pub fn polish(
    iso: &Isotherm,
    pr: f64,
    mut lo: f64,
    mut hi: f64,
    rising: bool,
) -> Result<(f64, Sample)> {
    let mut d = 0.5 * (lo + hi);
    let mut last = f64::INFINITY;
    for _ in 0..MAX_ITER {
        let s = iso.sample(d);
        let (p, dp) = iso.pr_of(d, &s);
        let r = p - pr;
        last = r;
        if r.abs() <= 1e-14 * pr.max(1e-300) || hi - lo <= 4.0 * f64::EPSILON * hi {
            return Ok((d, s));
        }
        if (r < 0.0) == rising {
            lo = d;
        } else {
            hi = d;
        }
        d = safeguarded_step(d, r, dp, lo, hi);
    }
    Err(not_converged(last))
}

/// The Newton step d - r/r' where it stays inside the bracket (lo, hi), its midpoint
/// otherwise.
fn safeguarded_step(d: f64, r: f64, dp: f64, lo: f64, hi: f64) -> f64 {
    let newton = d - r / dp;
    if newton > lo && newton < hi {
        newton
    } else {
        0.5 * (lo + hi)
    }
}

/// The error of a Newton iteration that used up its iterations, with its last residual.
fn not_converged(residual: f64) -> Error {
    Error::NotConverged {
        solver: "Lee-Kesler reduced volume",
        iterations: MAX_ITER,
        residual,
    }
}
