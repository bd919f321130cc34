//! Batch evaluation: Z of many (T, P) states of one cubic model and one composition, with no
//! allocation per state.
//!
//! Everything that depends only on the composition is folded once into a [`ZBatch`]. For the
//! Soave-type alpha functions (SRK, PR 1976 and 1978; van der Waals with alpha = 1)
//! s_i(T) = sqrt(a_i(T)) = sqrt(a_ci)(1 + m_i) - sqrt(a_ci) m_i sqrt(T/Tc_i) = c0_i + c1_i sqrt(T)
//! is linear in sqrt(T), so the van der Waals one-fluid mixing sum is a quadratic in sqrt(T):
//!
//! a(T) = sum_i sum_{j >= i} w_ij s_i(T) s_j(T),  w_ij = (2 - delta_ij) x_i x_j (1 - k_ij),
//!      = q0 + q1 sqrt(T) + q2 T,
//! q0 = sum w_ij c0_i c0_j,  q1 = sum w_ij (c0_i c1_j + c1_i c0_j),  q2 = sum w_ij c1_i c1_j.
//!
//! q0, q1, q2 and b_mix = sum_i x_i b_i are computed once, so a(T) costs one square root and
//! two multiply-adds whatever the number of components (the O(n^2) mixing rule is paid once
//! per batch, not per state). The rounding of a(T) grows with the cancellation between the
//! three terms, to a few units in the last place at the highest reduced temperatures.
//!
//! Two entry points share one kernel:
//! - per state, [`ZBatch::z_tp`]: any list of (T, P) pairs; a(T), a/(RT)^2 and b/(RT) are
//!   computed for every state;
//! - temperature repeated, [`ZBatch::z_isotherm`] and [`ZBatch::z_grid`]: a/(RT)^2 and b/(RT)
//!   are computed once per temperature (a square root and two divisions saved per state), and
//!   A = P a/(RT)^2, B = P b/(RT) for every pressure of the isotherm.
//!
//! Both evaluate these in the same order of operations and hand every state to the same lane
//! code (a short final block is padded rather than sent to a scalar path), so a state's Z is
//! the same bit for bit whichever entry point, block position or thread computed it.
//!
//! The cubic in Z is not solved in closed form here: every physical root satisfies
//! B < Z <= 1 + B (the attractive term is positive for v > b, so P <= RT/(v - b)), and the
//! cubic is increasing and convex to the right of its inflection point, so an iteration
//! started at 1 + B comes down onto the largest root. The lanes take Halley's step,
//! f f' / (f'^2 - f f''/2), which converges cubically (one division a step, as Newton's; over
//! the yardstick's grids 4.6 to 4.8 steps a state against 6.6 to 6.8 for Newton's method). It
//! is not monotone: near the root it can step just past it, which the certification below
//! accepts, and far from it, where it could jump to another root, the certification refuses.
//! Each lane stops (keeps its value) once its step falls below 1e-13 Z, so what a lane
//! returns depends on its own state only; a block stops when all its lanes have. The result
//! is then certified: Z is the largest root when the slope is positive there and the
//! quadratic left after dividing it out has no real root above it (complex roots, or a
//! vertex at or below Z). The other two roots, where they exist, come from that quadratic. A
//! state that is not certified (an iteration that strayed onto another root, or did not
//! settle within the step cap, as next to a double root) falls back to Newton's method on
//! its own and then to the closed form of [`crate::cubic::roots::solve_cubic`]; all give the
//! same roots to rounding.

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

/// States evaluated together by the lane kernel.
const LANES: usize = 16;

/// Most Halley steps a lane takes before it falls back to the closed form; from 1 + B the
/// descent reaches machine precision in three to six steps for states away from a spinodal
/// (over the yardstick's grids the mean is 4.6 for the pure fluid and 4.8 for the
/// 10-component gas, against 6.6 and 6.8 Newton steps).
const HALLEY_STEPS: usize = 10;

/// A lane has converged when its step is below this fraction of Z.
const STEP_TOL: f64 = 1e-13;

/// States per task in the parallel entry points (whole lane blocks).
const CHUNK: usize = LANES * 512;

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
#[inline(always)]
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

/// Where the lanes start: one substitution of Z = 1 into the equation of state solved for Z,
/// Z = Z/(Z - B) - A Z/(Z^2 + u B Z + w B^2), that is 1/(1 - B) - A/(1 + u B + w B^2) (one
/// division), when it lies between B and 1 + B; 1 + B (the bound above every physical
/// root) otherwise. Over the yardstick's grids it saves about one Halley step a state.
#[inline(always)]
fn start(aa: f64, bb: f64, u: f64, w: f64) -> f64 {
    let d = 1.0 + u * bb + w * bb * bb;
    let s = 1.0 - bb;
    let guess = (d - aa * s) / (s * d);
    let top = 1.0 + bb;
    if (guess > bb) & (guess < top) & (s > 0.0) & (d > 0.0) {
        guess
    } else {
        top
    }
}

/// True when, in some lane, the quadratic left after dividing the root z out of the cubic
/// has real roots (the test that opens [`other_root_lane`]): a block of states with one real
/// root each (every supercritical state, most gas states) skips the search for a second.
#[allow(clippy::needless_range_loop)]
#[inline(always)]
fn any_real_pair(c2: &[f64; LANES], c1: &[f64; LANES], z: &[f64; LANES]) -> bool {
    let mut real = [0_u64; LANES];
    for l in 0..LANES {
        let e1 = c2[l] + z[l];
        let e0 = c1[l] + z[l] * e1;
        real[l] = mask(e1 * e1 - 4.0 * e0 >= 0.0);
    }
    any(&real)
}

/// [`smallest_other_root`] without branches, for the lane kernel: the root, and whether it
/// exists (both roots of the quadratic real, the smaller below `zl`). Where it does not, the
/// value is meaningless. The same operations in the same order, so the same bits.
#[inline(always)]
fn other_root_lane(c2: f64, c1: f64, c0: f64, zl: f64) -> (f64, bool) {
    let e1 = c2 + zl;
    let e0 = c1 + zl * e1;
    let disc = e1 * e1 - 4.0 * e0;
    let real = disc >= 0.0;
    let q = -0.5 * (e1 + disc.max(0.0).sqrt().copysign(e1));
    let zero = q == 0.0;
    let r2 = e0 / if zero { 1.0 } else { q };
    let (r1, r2) = if zero { (0.0, 0.0) } else { (q, r2) };
    let mut z = r1.min(r2);
    let below = z < zl;
    for _ in 0..2 {
        let f = ((z + c2) * z + c1) * z + c0;
        let df = (3.0 * z + 2.0 * c2) * z + c1;
        let dz = f / if df == 0.0 { 1.0 } else { df };
        z = if df == 0.0 { z } else { z - dz };
    }
    (z, real & below)
}

/// A lane flag: every bit set when `b`, none otherwise.
#[inline(always)]
fn mask(b: bool) -> u64 {
    (b as u64).wrapping_neg()
}

/// True when every lane's flag is set.
#[inline(always)]
fn all(flags: &[u64; LANES]) -> bool {
    flags.iter().fold(u64::MAX, |a, f| a & f) != 0
}

/// True when some lane's flag is set.
#[inline(always)]
fn any(flags: &[u64; LANES]) -> bool {
    flags.iter().fold(0, |a, f| a | f) != 0
}

/// States validated and then computed together, so that the input is read from memory once
/// (a multiple of LANES).
const PIECE: usize = LANES * 256;

/// The running test that every value seen is finite and positive, kept across the lanes so
/// that it vectorises: the smallest value must be above zero, and x * 0 is NaN exactly when
/// x is infinite or NaN (a NaN never replaces the minimum, but it does poison the sum).
struct Screen {
    lo: [f64; LANES],
    poison: [f64; LANES],
}

impl Screen {
    #[inline(always)]
    fn new() -> Self {
        Screen {
            lo: [f64::INFINITY; LANES],
            poison: [0.0; LANES],
        }
    }

    #[allow(clippy::needless_range_loop)]
    #[inline(always)]
    fn add(&mut self, v: &[f64; LANES]) {
        for l in 0..LANES {
            self.lo[l] = if v[l] < self.lo[l] { v[l] } else { self.lo[l] };
            self.poison[l] += v[l] * 0.0;
        }
    }

    #[inline(always)]
    fn valid(&self) -> bool {
        self.lo.iter().all(|m| *m > 0.0) && self.poison.iter().all(|q| *q == 0.0)
    }
}

/// True when every value is finite and positive.
fn all_valid(v: &[f64]) -> bool {
    let mut screen = Screen::new();
    let mut chunks = v.chunks_exact(LANES);
    for c in &mut chunks {
        screen.add(c.try_into().unwrap_or(&[1.0; LANES]));
    }
    let rest = chunks.remainder();
    if let Some(last) = rest.last() {
        let mut block = [*last; LANES];
        block[..rest.len()].copy_from_slice(rest);
        screen.add(&block);
    }
    screen.valid()
}

/// Refuses states that are not finite and positive.
fn check_states(t: &[f64], p: &[f64]) -> Result<()> {
    if all_valid(t) && all_valid(p) {
        return Ok(());
    }
    let bad = t
        .iter()
        .chain(p)
        .copied()
        .find(|v| !(v.is_finite() && *v > 0.0))
        .unwrap_or(f64::NAN);
    Err(Error::invalid(
        "state in batch",
        bad,
        "finite, positive temperatures (K) and pressures (Pa)",
    ))
}

fn length_error(got: usize, want: &'static str) -> Error {
    Error::invalid("batch length", got as f64, want)
}

/// A cubic model bound to one composition, ready to evaluate Z at many states.
#[derive(Debug, Clone)]
pub struct ZBatch {
    /// a(T) = q0 + q1 sqrt(T) + q2 T (the mixing sum folded at construction).
    q: [f64; 3],
    n: usize,
    b: f64,
    d1: f64,
    d2: f64,
}

/// Defines `$at(&self, level, args...)`, which runs the kernel `$body` compiled for the
/// given instruction-set level when the processor has it (`$v3`: x86-64-v3, `$v4`: v4; see
/// [`crate::cpu`]), and at the baseline otherwise.
macro_rules! leveled {
    ($(#[$doc:meta])* $at:ident, $v3:ident, $v4:ident, $body:ident,
     ($($arg:ident: $ty:ty),*) -> $ret:ty) => {
        $(#[$doc])*
        fn $at(&self, level: crate::cpu::Level, $($arg: $ty),*) -> $ret {
            #[cfg(target_arch = "x86_64")]
            {
                use crate::cpu::Level;
                let top = crate::cpu::level();
                if level == Level::Avx512 && top >= Level::Avx512 {
                    // SAFETY: the processor has the x86-64-v4 features (checked at run time
                    // by `cpu::level`), the only condition for running code compiled for
                    // them.
                    #[allow(unsafe_code)]
                    return unsafe { self.$v4($($arg),*) };
                }
                if level >= Level::Avx2 && top >= Level::Avx2 {
                    // SAFETY: the processor has the x86-64-v3 features (checked at run time
                    // by `cpu::level`).
                    #[allow(unsafe_code)]
                    return unsafe { self.$v3($($arg),*) };
                }
            }
            #[cfg(not(target_arch = "x86_64"))]
            let _ = level;
            self.$body($($arg),*)
        }

        /// The kernel compiled for x86-64-v4 (AVX-512).
        #[cfg(target_arch = "x86_64")]
        #[target_feature(
            enable = "avx512f,avx512dq,avx512cd,avx512bw,avx512vl,avx2,fma,bmi1,bmi2,lzcnt,popcnt,movbe"
        )]
        #[allow(unsafe_code)]
        unsafe fn $v4(&self, $($arg: $ty),*) -> $ret {
            self.$body($($arg),*)
        }

        /// The kernel compiled for x86-64-v3 (AVX2).
        #[cfg(target_arch = "x86_64")]
        #[target_feature(enable = "avx2,fma,bmi1,bmi2,lzcnt,popcnt,movbe")]
        #[allow(unsafe_code)]
        unsafe fn $v3(&self, $($arg: $ty),*) -> $ret {
            self.$body($($arg),*)
        }
    };
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
        let mut q = [0.0; 3];
        for i in 0..n {
            for j in i..n {
                let f = if i == j { 1.0 } else { 2.0 };
                let w = f * x[i] * x[j] * omk[i * n + j];
                q[0] += w * c0[i] * c0[j];
                q[1] += w * (c0[i] * c1[j] + c1[i] * c0[j]);
                q[2] += w * c1[i] * c1[j];
            }
        }
        let b = x.iter().zip(model.covolumes()).map(|(x, b)| x * b).sum();
        Ok(ZBatch {
            q,
            n,
            b,
            d1: spec.d1,
            d2: spec.d2,
        })
    }

    /// Number of components.
    pub fn len(&self) -> usize {
        self.n
    }

    /// Always false: a batch has at least one component.
    pub fn is_empty(&self) -> bool {
        self.n == 0
    }

    /// a_mix at T: q0 + sqrt(T) (q1 + q2 sqrt(T)).
    #[inline(always)]
    fn a_mix(&self, t: f64) -> f64 {
        let st = t.sqrt();
        self.q[0] + st * (self.q[1] + self.q[2] * st)
    }

    /// ka = a/(RT)^2 and kb = b/(RT) at LANES temperatures, in the order of operations of
    /// [`ZBatch::a_mix`] and [`ZBatch::reduced`].
    #[allow(clippy::needless_range_loop)]
    #[inline(always)]
    fn k_lanes(&self, t: &[f64; LANES]) -> ([f64; LANES], [f64; LANES]) {
        let (mut ka, mut kb) = ([0.0; LANES], [0.0; LANES]);
        for l in 0..LANES {
            let st = t[l].sqrt();
            let a = self.q[0] + st * (self.q[1] + self.q[2] * st);
            let inv = 1.0 / (R * t[l]);
            ka[l] = a * inv * inv;
            kb[l] = self.b * inv;
        }
        (ka, kb)
    }

    /// Residual Gibbs energy over RT of root z (composition terms left out).
    #[inline(always)]
    fn g_res(&self, z: f64, aa: f64, bb: f64) -> f64 {
        let conf = if (self.d1 - self.d2).abs() < 1e-12 {
            aa / z
        } else {
            aa / (bb * (self.d1 - self.d2)) * ((z + self.d1 * bb) / (z + self.d2 * bb)).ln()
        };
        z - 1.0 - (z - bb).ln() - conf
    }

    /// The root `root` asks for, given the largest root `zl`.
    #[inline(always)]
    fn choose(&self, root: BatchRoot, zl: f64, zs: Option<f64>, aa: f64, bb: f64) -> f64 {
        match (root, zs) {
            (BatchRoot::LowestGibbs, Some(zs))
                if zs > bb && self.g_res(zs, aa, bb) < self.g_res(zl, aa, bb) =>
            {
                zs
            }
            _ => zl,
        }
    }

    /// a/(RT)^2 and b/(RT) at T, given a(T): A = ka P and B = kb P along the isotherm.
    #[inline(always)]
    fn reduced(&self, a: f64, t: f64) -> (f64, f64) {
        let inv = 1.0 / (R * t);
        (a * inv * inv, self.b * inv)
    }

    /// Z of one state from ka = a/(RT)^2 and kb = b/(RT), by the scalar path (the fallback
    /// of the lane kernel).
    fn z_scalar(&self, ka: f64, kb: f64, p: f64, root: BatchRoot) -> f64 {
        let aa = ka * p;
        let bb = kb * p;
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
        self.choose(root, zl, zs, aa, bb)
    }

    /// Z of LANES states from their ka = a/(RT)^2, kb = b/(RT) and P. Every loop runs across
    /// the lanes, so the compiler can keep the lanes in vector registers. Lanes whose Halley
    /// descent is not certified fall back to the scalar path.
    #[allow(clippy::needless_range_loop)]
    #[inline(always)]
    fn lanes(
        &self,
        ka: &[f64; LANES],
        kb: &[f64; LANES],
        p: &[f64; LANES],
        root: BatchRoot,
    ) -> [f64; LANES] {
        let (u, w) = (self.d1 + self.d2, self.d1 * self.d2);
        let (mut aa, mut bb) = ([0.0; LANES], [0.0; LANES]);
        let (mut c2, mut c1, mut c0) = ([0.0; LANES], [0.0; LANES], [0.0; LANES]);
        let mut z = [0.0; LANES];
        for l in 0..LANES {
            aa[l] = ka[l] * p[l];
            bb[l] = kb[l] * p[l];
            c2[l] = (u - 1.0) * bb[l] - 1.0;
            c1[l] = aa[l] + (w - u) * bb[l] * bb[l] - u * bb[l];
            c0[l] = -(aa[l] * bb[l] + w * bb[l] * bb[l] + w * bb[l] * bb[l] * bb[l]);
            z[l] = start(aa[l], bb[l], u, w);
        }
        // done: all bits set once the lane's step fell below STEP_TOL Z; its value is then
        // frozen. Lane flags are whole-word masks, so that setting one is an OR (never a masked
        // store) and "every lane" is an AND across the lanes, both of which vectorise.
        let mut done = [0_u64; LANES];
        for _ in 0..HALLEY_STEPS {
            for l in 0..LANES {
                let zl = z[l];
                let f = ((zl + c2[l]) * zl + c1[l]) * zl + c0[l];
                let df = (3.0 * zl + 2.0 * c2[l]) * zl + c1[l];
                let d2f = 6.0 * zl + 2.0 * c2[l];
                let step = f * df / (df * df - 0.5 * f * d2f);
                let zn = zl - step;
                let d = done[l];
                done[l] = d | mask(step.abs() <= STEP_TOL * zn);
                z[l] = if d != 0 { zl } else { zn };
            }
            if all(&done) {
                break;
            }
        }
        // Certification after the fact: z is the largest root when the slope there is positive
        // and the quadratic left after dividing it out, Z^2 + e1 Z + e0, has no real root
        // above z (complex roots, or its vertex -e1/2 at or below z). An iteration that
        // strayed onto another root, or did not settle, fails and goes to the scalar path.
        let mut certified = [0_u64; LANES];
        for l in 0..LANES {
            let zl = z[l];
            let df = (3.0 * zl + 2.0 * c2[l]) * zl + c1[l];
            let e1 = c2[l] + zl;
            let e0 = c1[l] + zl * e1;
            let top = (e1 * e1 < 4.0 * e0) | (-e1 <= 2.0 * zl);
            certified[l] = done[l] & mask((df > 0.0) & top);
        }
        // The other root where the lowest Gibbs energy is asked for: computed across the
        // lanes (as `smallest_other_root`), so that only the lanes with a second root above B
        // pay for the logarithms of the Gibbs comparison.
        let mut zs = [0.0; LANES];
        let mut second = [0_u64; LANES];
        if root == BatchRoot::LowestGibbs && any_real_pair(&c2, &c1, &z) {
            for l in 0..LANES {
                let (r, found) = other_root_lane(c2[l], c1[l], c0[l], z[l]);
                zs[l] = r;
                second[l] = mask(found & (r > bb[l]));
            }
        }
        let mut out = z;
        if all(&certified) && !any(&second) {
            return out;
        }
        for l in 0..LANES {
            if certified[l] == 0 {
                out[l] = self.z_scalar(ka[l], kb[l], p[l], root);
            } else if second[l] != 0
                && self.g_res(zs[l], aa[l], bb[l]) < self.g_res(z[l], aa[l], bb[l])
            {
                out[l] = zs[l];
            }
        }
        out
    }

    /// Z at each (t[k], p[k]) into `out[k]`. The slices must have equal lengths; every T and
    /// P must be finite and positive (on an invalid state the error is returned and `out` is
    /// left partly written). States are independent and every one goes through the same
    /// arithmetic, so any split of the slices (for example across threads) gives identical
    /// results.
    pub fn z_tp(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        self.z_tp_at(crate::cpu::level(), t, p, root, out)
    }

    leveled!(
        /// One piece of [`ZBatch::z_tp`] at a given instruction-set level (as
        /// [`ZBatch::isotherm_at`]).
        piece_at, piece_v3, piece_v4, piece_body,
        (t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> bool
    );

    /// The (T, P) kernel; inlined into each compiled level. Returns whether every state was
    /// finite and positive, screened on the way (one pass over the input, not two); where
    /// not, `out` holds whatever the arithmetic gave and the caller reports the error.
    #[inline(always)]
    fn piece_body(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> bool {
        let mut screen = Screen::new();
        let mut tc = t.chunks_exact(LANES);
        let mut pc = p.chunks_exact(LANES);
        let mut oc = out.chunks_exact_mut(LANES);
        for ((tb, pb), ob) in (&mut tc).zip(&mut pc).zip(&mut oc) {
            let tb: &[f64; LANES] = tb.try_into().unwrap_or(&[1.0; LANES]);
            let pb: &[f64; LANES] = pb.try_into().unwrap_or(&[1.0; LANES]);
            screen.add(tb);
            screen.add(pb);
            let (ka, kb) = self.k_lanes(tb);
            ob.copy_from_slice(&self.lanes(&ka, &kb, pb, root));
        }
        let (tr, pr, or) = (tc.remainder(), pc.remainder(), oc.into_remainder());
        if !tr.is_empty() {
            // Pad the short block with copies of its last state.
            let (mut tb, mut pb) = ([tr[tr.len() - 1]; LANES], [pr[pr.len() - 1]; LANES]);
            tb[..tr.len()].copy_from_slice(tr);
            pb[..pr.len()].copy_from_slice(pr);
            screen.add(&tb);
            screen.add(&pb);
            let (ka, kb) = self.k_lanes(&tb);
            let z = self.lanes(&ka, &kb, &pb, root);
            or.copy_from_slice(&z[..or.len()]);
        }
        screen.valid()
    }

    /// Like [`ZBatch::z_tp`], split across all cores (rayon) in chunks of whole lane blocks.
    /// Every state is computed exactly as in the single-threaded call, so the results are
    /// identical, in the same order.
    pub fn z_tp_par(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        use rayon::prelude::*;
        if t.len() != p.len() || t.len() != out.len() {
            return self.z_tp(t, p, root, out);
        }
        out.par_chunks_mut(CHUNK)
            .zip(t.par_chunks(CHUNK).zip(p.par_chunks(CHUNK)))
            .try_for_each(|(o, (tc, pc))| self.z_tp(tc, pc, root, o))
    }

    /// Z along one isotherm: at temperature `t` and each pressure `p[k]` into `out[k]`.
    /// a(T) is computed once. The result is bit for bit that of [`ZBatch::z_tp`] on the same
    /// states.
    pub fn z_isotherm(&self, t: f64, p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        if p.len() != out.len() {
            return Err(length_error(
                p.len(),
                "equal lengths of pressures and output",
            ));
        }
        check_states(&[t], p)?;
        self.isotherm_unchecked(t, p, root, out);
        Ok(())
    }

    fn isotherm_unchecked(&self, t: f64, p: &[f64], root: BatchRoot, out: &mut [f64]) {
        self.isotherm_at(crate::cpu::level(), t, p, root, out);
    }

    leveled!(
        /// [`ZBatch::isotherm_unchecked`] at a given instruction-set level, which must be one
        /// this processor runs ([`crate::cpu::available`]); a higher one is run at the
        /// baseline.
        isotherm_at, isotherm_v3, isotherm_v4, isotherm_body,
        (t: f64, p: &[f64], root: BatchRoot, out: &mut [f64]) -> ()
    );

    /// The isotherm kernel; inlined into each compiled level.
    #[inline(always)]
    fn isotherm_body(&self, t: f64, p: &[f64], root: BatchRoot, out: &mut [f64]) {
        let (ka, kb) = self.reduced(self.a_mix(t), t);
        let (ka, kb) = ([ka; LANES], [kb; LANES]);
        let mut pc = p.chunks_exact(LANES);
        let mut oc = out.chunks_exact_mut(LANES);
        for (pb, ob) in (&mut pc).zip(&mut oc) {
            let pb: &[f64; LANES] = pb.try_into().unwrap_or(&[1.0; LANES]);
            ob.copy_from_slice(&self.lanes(&ka, &kb, pb, root));
        }
        let (pr, or) = (pc.remainder(), oc.into_remainder());
        if !pr.is_empty() {
            let mut pb = [pr[pr.len() - 1]; LANES];
            pb[..pr.len()].copy_from_slice(pr);
            let z = self.lanes(&ka, &kb, &pb, root);
            or.copy_from_slice(&z[..or.len()]);
        }
    }

    /// Z over the grid of every temperature `t[i]` with every pressure `p[j]`, into
    /// `out[i * p.len() + j]` (temperature outer, pressure inner). a(T) is computed once per
    /// temperature; the result is bit for bit that of [`ZBatch::z_tp`] on the flattened grid.
    pub fn z_grid(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        self.z_grid_at(crate::cpu::level(), t, p, root, out)
    }

    /// [`ZBatch::z_grid`] with the kernel compiled for a given instruction-set level, for
    /// tests and benchmarks that compare the levels ([`crate::cpu::available`]); a level the
    /// processor lacks runs at the baseline. Every level gives the same bits.
    pub fn z_grid_at(
        &self,
        level: crate::cpu::Level,
        t: &[f64],
        p: &[f64],
        root: BatchRoot,
        out: &mut [f64],
    ) -> Result<()> {
        self.check_grid(t, p, out)?;
        if p.is_empty() {
            return Ok(());
        }
        for (row, &ti) in out.chunks_exact_mut(p.len()).zip(t) {
            self.isotherm_at(level, ti, p, root, row);
        }
        Ok(())
    }

    /// [`ZBatch::z_tp`] with the kernel compiled for a given instruction-set level (as
    /// [`ZBatch::z_grid_at`]).
    pub fn z_tp_at(
        &self,
        level: crate::cpu::Level,
        t: &[f64],
        p: &[f64],
        root: BatchRoot,
        out: &mut [f64],
    ) -> Result<()> {
        if t.len() != p.len() || t.len() != out.len() {
            return Err(length_error(
                t.len(),
                "equal lengths of temperatures, pressures and output",
            ));
        }
        for ((tc, pc), oc) in t
            .chunks(PIECE)
            .zip(p.chunks(PIECE))
            .zip(out.chunks_mut(PIECE))
        {
            if !self.piece_at(level, tc, pc, root, oc) {
                // The same test state by state, to name the value.
                check_states(tc, pc)?;
            }
        }
        Ok(())
    }

    /// Like [`ZBatch::z_grid`], split across all cores (rayon): isotherms are shared out, and
    /// long isotherms are cut into chunks of whole lane blocks. The results are identical to
    /// the single-threaded call, in the same order.
    pub fn z_grid_par(&self, t: &[f64], p: &[f64], root: BatchRoot, out: &mut [f64]) -> Result<()> {
        use rayon::prelude::*;
        self.check_grid(t, p, out)?;
        if p.is_empty() {
            return Ok(());
        }
        out.par_chunks_mut(p.len())
            .zip(t.par_iter())
            .for_each(|(row, &ti)| {
                if row.len() <= CHUNK {
                    self.isotherm_unchecked(ti, p, root, row);
                } else {
                    row.par_chunks_mut(CHUNK)
                        .zip(p.par_chunks(CHUNK))
                        .for_each(|(o, pc)| self.isotherm_unchecked(ti, pc, root, o));
                }
            });
        Ok(())
    }

    fn check_grid(&self, t: &[f64], p: &[f64], out: &[f64]) -> Result<()> {
        if t.len().checked_mul(p.len()) != Some(out.len()) {
            return Err(length_error(
                out.len(),
                "an output of (number of temperatures) x (number of pressures)",
            ));
        }
        check_states(t, p)
    }
}
