//! Batch evaluation: Z of many (T, P) states of one cubic model and one composition, with no
//! allocation per state.
//!
//! Everything that depends only on the composition is folded once into a [`ZBatch`]:
//! x_i x_j (1 - k_ij) sqrt(a_ci a_cj) for the attraction term and b_mix. For the Soave-type
//! alpha functions (SRK, PR 1976 and 1978) sqrt(a_i(T)) = sqrt(a_ci)(1 + m_i) -
//! sqrt(a_ci) m_i sqrt(T/Tc_i) is linear in sqrt(T), so each state costs one square root, n
//! multiply-adds for the sqrt(a_i) and n(n+1)/2 for the quadratic mixing sum: a(T) is
//! recomputed in full for every state.
//!
//! The cubic in Z is not solved in closed form here: every physical root satisfies
//! B < Z <= 1 + B (the attractive term is positive for v > b, so P <= RT/(v - b)), and the
//! cubic is increasing and convex to the right of its inflection point, so Newton's method
//! started at 1 + B descends monotonically onto the largest root. The other two roots, where
//! they exist, come from the deflated quadratic. Whenever that path cannot be trusted (an
//! iterate falls left of the inflection point, a vanishing slope, the iteration cap near a
//! double root), the state falls back to the closed form of
//! [`crate::cubic::roots::solve_cubic`]; both give the same roots to rounding.

use crate::composition;
use crate::constants::R;
use crate::cubic::roots::solve_cubic;
use crate::cubic::{Alpha, Cubic};
use crate::error::{Error, Result};
use crate::model::Model;

/// Which root a batch reports.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum BatchRoot {
    /// The largest real root (vapour-like).
    Largest,
    /// The root of lowest residual Gibbs energy among those above B.
    LowestGibbs,
}

/// States evaluated together in [`ZBatch::z_tp`].
const LANES: usize = 8;

/// Newton steps taken by every lane before its result is checked; from 1 + B the descent
/// reaches machine precision in five to seven steps for states away from a spinodal.
const NEWTON_STEPS: usize = 8;

/// Largest root of Z^3 + c2 Z^2 + c1 Z + c0 by Newton's method from `start`, an upper bound
/// of every root; `None` where the monotone descent cannot be guaranteed.
#[inline]
fn largest_root(c2: f64, c1: f64, c0: f64, start: f64) -> Option<f64> {
    let inflection = -c2 / 3.0;
    let mut z = start;
    if z <= inflection {
        return None;
    }
    for _ in 0..40 {
        let f = ((z + c2) * z + c1) * z + c0;
        let df = (3.0 * z + 2.0 * c2) * z + c1;
        if df <= 0.0 || f < 0.0 {
            return None;
        }
        let step = f / df;
        let zn = z - step;
        if step <= 4.0 * f64::EPSILON * z {
            return Some(zn);
        }
        if zn <= inflection {
            return None;
        }
        z = zn;
    }
    None
}

/// The smaller root of the quadratic left after dividing out the root `zl`, when both of its
/// roots are real and below `zl`; polished by Newton steps on the cubic.
#[inline]
fn smallest_other_root(c2: f64, c1: f64, c0: f64, zl: f64) -> Option<f64> {
    // Z^3 + c2 Z^2 + c1 Z + c0 = (Z - zl)(Z^2 + e1 Z + e0)
    let e1 = c2 + zl;
    let e0 = c1 + zl * e1;
    let disc = e1 * e1 - 4.0 * e0;
    if disc < 0.0 {
        return None;
    }
    // Stable quadratic formula: q = -(e1 + sign(e1) sqrt(disc))/2, roots q and e0/q.
    let q = -0.5 * (e1 + disc.sqrt().copysign(e1));
    let (r1, r2) = if q == 0.0 { (0.0, 0.0) } else { (q, e0 / q) };
    let mut z = r1.min(r2);
    if z >= zl {
        return None;
    }
    for _ in 0..2 {
        let f = ((z + c2) * z + c1) * z + c0;
        let df = (3.0 * z + 2.0 * c2) * z + c1;
        if df == 0.0 {
            break;
        }
        z -= f / df;
    }
    Some(z)
}

/// A cubic model bound to one composition, ready to evaluate Z at many states.
#[derive(Debug, Clone)]
pub struct ZBatch {
    /// Constant and sqrt(T) parts of sqrt(a_i(T)), one per component.
    c0: Vec<f64>,
    c1: Vec<f64>,
    /// Packed upper triangle of x_i x_j (1 - k_ij), with the off-diagonal terms doubled.
    w: Vec<f64>,
    n: usize,
    b: f64,
    d1: f64,
    d2: f64,
}

impl ZBatch {
    /// Prepares `model` at mole fractions `x`. Only members with a Soave-type alpha (or none)
    /// are supported: `srk`, `pr`, `pr78`, `vdw`.
    pub fn new(model: &Cubic, x: &[f64]) -> Result<Self> {
        let comps = model.components();
        let n = comps.len();
        composition::check(x, n)?;
        let spec = model.spec();
        let m = model.alpha_parameters();
        let sac = model.sqrt_ac();
        let (c0, c1): (Vec<f64>, Vec<f64>) = match spec.alpha {
            Alpha::Soave(_) => (0..n)
                .map(|i| (sac[i] * (1.0 + m[i]), -sac[i] * m[i] / comps[i].tc.sqrt()))
                .unzip(),
            Alpha::Constant => (sac.to_vec(), vec![0.0; n]),
            Alpha::InverseSqrtTr => {
                return Err(Error::OutOfRange {
                    model: spec.id.to_string(),
                    what: "batch evaluation",
                    detail: "the batch kernel serves members whose sqrt(alpha) is linear in \
                             sqrt(T) (vdw, srk, pr, pr78)"
                        .to_string(),
                })
            }
        };
        let omk = model.one_minus_kij();
        let mut w = Vec::with_capacity(n * (n + 1) / 2);
        for i in 0..n {
            for j in i..n {
                let f = if i == j { 1.0 } else { 2.0 };
                w.push(f * x[i] * x[j] * omk[i * n + j]);
            }
        }
        let b = x.iter().zip(model.covolumes()).map(|(x, b)| x * b).sum();
        Ok(ZBatch {
            c0,
            c1,
            w,
            n,
            b,
            d1: spec.d1,
            d2: spec.d2,
        })
    }

    /// a_mix at T.
    #[inline]
    fn a_mix(&self, t: f64, s: &mut [f64]) -> f64 {
        let st = t.sqrt();
        for ((si, c0), c1) in s.iter_mut().zip(&self.c0).zip(&self.c1) {
            *si = c0 + c1 * st;
        }
        let mut a = 0.0;
        let mut k = 0;
        for i in 0..self.n {
            let mut row = 0.0;
            for sj in &s[i..self.n] {
                row += self.w[k] * sj;
                k += 1;
            }
            a += s[i] * row;
        }
        a
    }

    /// Residual Gibbs energy over RT of root z (composition terms left out).
    #[inline]
    fn g_res(&self, z: f64, aa: f64, bb: f64) -> f64 {
        let conf = if (self.d1 - self.d2).abs() < 1e-12 {
            aa / z
        } else {
            aa / (bb * (self.d1 - self.d2)) * ((z + self.d1 * bb) / (z + self.d2 * bb)).ln()
        };
        z - 1.0 - (z - bb).ln() - conf
    }

    /// Z of one state.
    #[inline]
    fn z_one(&self, t: f64, p: f64, root: BatchRoot, s: &mut [f64]) -> f64 {
        let a = self.a_mix(t, s);
        let rt = R * t;
        let aa = a * p / (rt * rt);
        let bb = self.b * p / rt;
        let (u, w) = (self.d1 + self.d2, self.d1 * self.d2);
        let c2 = (u - 1.0) * bb - 1.0;
        let c1 = aa + (w - u) * bb * bb - u * bb;
        let c0 = -(aa * bb + w * bb * bb + w * bb * bb * bb);
        let (zl, zs) = match largest_root(c2, c1, c0, 1.0 + bb) {
            Some(zl) => (zl, smallest_other_root(c2, c1, c0, zl)),
            None => {
                let r = solve_cubic(c2, c1, c0);
                let zs = r.smallest();
                (r.largest(), (zs < r.largest()).then_some(zs))
            }
        };
        match (root, zs) {
            (BatchRoot::LowestGibbs, Some(zs))
                if zs > bb && self.g_res(zs, aa, bb) < self.g_res(zl, aa, bb) =>
            {
                zs
            }
            _ => zl,
        }
    }

    /// Z at each (t[k], p[k]) into `out[k]`. The slices must have equal lengths; every T and
    /// P must be finite and positive. States are independent, so any split of the slices
    /// (for example across threads) gives identical results.
    pub fn z_tp(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        if t.len() != p.len() || t.len() != out.len() {
            return Err(Error::invalid(
                "batch length",
                t.len() as f64,
                "equal lengths of temperatures, pressures and output",
            ));
        }
        if let Some(bad) = t.iter().chain(p).find(|v| !(v.is_finite() && **v > 0.0)) {
            return Err(Error::invalid(
                "state in batch",
                *bad,
                "finite, positive temperatures (K) and pressures (Pa)",
            ));
        }
        let mut tc = t.chunks_exact(LANES);
        let mut pc = p.chunks_exact(LANES);
        let mut oc = out.chunks_exact_mut(LANES);
        for ((tb, pb), ob) in (&mut tc).zip(&mut pc).zip(&mut oc) {
            self.block(tb, pb, ob, root);
        }
        let mut s = [0.0; crate::cubic::MAX_COMPONENTS];
        for ((&tk, &pk), o) in tc
            .remainder()
            .iter()
            .zip(pc.remainder())
            .zip(oc.into_remainder())
        {
            *o = self.z_one(tk, pk, root, &mut s[..self.n]);
        }
        Ok(())
    }

    /// Like [`ZBatch::z_tp`], split across all cores (rayon) in chunks of whole lane blocks.
    /// Every state is computed exactly as in the single-threaded call, so the results are
    /// identical, in the same order.
    pub fn z_tp_par(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        use rayon::prelude::*;
        if t.len() != p.len() || t.len() != out.len() {
            return self.z_tp(t, p, root, out);
        }
        const CHUNK: usize = LANES * 2048;
        out.par_chunks_mut(CHUNK)
            .zip(t.par_chunks(CHUNK).zip(p.par_chunks(CHUNK)))
            .try_for_each(|(o, (tc, pc))| self.z_tp(tc, pc, root, o))
    }

    /// Z of LANES states at once: every loop runs across the lanes, so the compiler can keep
    /// the lanes in vector registers. Lanes whose Newton descent is not certified fall back
    /// to the scalar path.
    // Lane loops index several arrays by the same lane number; iterator chains would hide
    // that structure from the reader and from the vectoriser alike.
    #[allow(clippy::needless_range_loop)]
    #[inline]
    fn block(&self, t: &[f64], p: &[f64], out: &mut [f64], root: BatchRoot) {
        let mut st = [0.0; LANES];
        for l in 0..LANES {
            st[l] = t[l].sqrt();
        }
        let mut a = [0.0; LANES];
        if self.n == 1 {
            for l in 0..LANES {
                let si = self.c0[0] + self.c1[0] * st[l];
                a[l] = self.w[0] * si * si;
            }
        } else {
            let mut s = [[0.0; LANES]; crate::cubic::MAX_COMPONENTS];
            for i in 0..self.n {
                for l in 0..LANES {
                    s[i][l] = self.c0[i] + self.c1[i] * st[l];
                }
            }
            let mut k = 0;
            for i in 0..self.n {
                for j in i..self.n {
                    let w = self.w[k];
                    k += 1;
                    for l in 0..LANES {
                        a[l] += w * s[i][l] * s[j][l];
                    }
                }
            }
        }
        let (u, w) = (self.d1 + self.d2, self.d1 * self.d2);
        let (mut aa, mut bb) = ([0.0; LANES], [0.0; LANES]);
        let (mut c2, mut c1, mut c0) = ([0.0; LANES], [0.0; LANES], [0.0; LANES]);
        let mut z = [0.0; LANES];
        for l in 0..LANES {
            let rt = R * t[l];
            aa[l] = a[l] * p[l] / (rt * rt);
            bb[l] = self.b * p[l] / rt;
            c2[l] = (u - 1.0) * bb[l] - 1.0;
            c1[l] = aa[l] + (w - u) * bb[l] * bb[l] - u * bb[l];
            c0[l] = -(aa[l] * bb[l] + w * bb[l] * bb[l] + w * bb[l] * bb[l] * bb[l]);
            z[l] = 1.0 + bb[l];
        }
        let mut ok = [true; LANES];
        let mut step = [0.0; LANES];
        for _ in 0..NEWTON_STEPS {
            for l in 0..LANES {
                let zl = z[l];
                let f = ((zl + c2[l]) * zl + c1[l]) * zl + c0[l];
                let df = (3.0 * zl + 2.0 * c2[l]) * zl + c1[l];
                step[l] = f / df;
                z[l] = zl - step[l];
                ok[l] &= df > 0.0 && 3.0 * z[l] > -c2[l];
            }
        }
        for l in 0..LANES {
            let certified = ok[l] && step[l].abs() <= 1e-13 * z[l];
            out[l] = if !certified {
                let mut s = [0.0; crate::cubic::MAX_COMPONENTS];
                self.z_one(t[l], p[l], root, &mut s[..self.n])
            } else {
                match root {
                    BatchRoot::Largest => z[l],
                    BatchRoot::LowestGibbs => {
                        match smallest_other_root(c2[l], c1[l], c0[l], z[l]) {
                            Some(zs)
                                if zs > bb[l]
                                    && self.g_res(zs, aa[l], bb[l])
                                        < self.g_res(z[l], aa[l], bb[l]) =>
                            {
                                zs
                            }
                            _ => z[l],
                        }
                    }
                }
            };
        }
    }
}
