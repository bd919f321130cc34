//! Real roots of the monic cubic Z^3 + c2 Z^2 + c1 Z + c0 = 0 in closed form.
//!
//! The cubic is reduced to t^3 + p t + q = 0 (Z = t - c2/3). With the discriminant
//! D = (q/2)^2 + (p/3)^3: D > 0 gives one real root by Cardano's formula written without
//! cancellation (the cube root is taken of the larger-magnitude term, the other follows from
//! the product of the two terms, -p/3); D < 0 gives three real roots by the trigonometric
//! (Viete) form. A discriminant within rounding noise of zero is treated as a double root, and
//! p and q both within noise as a triple root, so that the critical point of an equation of
//! state (a triple root) and states next to a spinodal (two nearly equal roots) keep all their
//! roots. Every root is then polished by Newton steps that are kept only if they reduce the
//! residual.
//!
//! Reference: W. H. Press et al., *Numerical Recipes*, 3rd ed. (2007), section 5.6, for the
//! cancellation-free forms.

/// Real roots of a cubic, ascending.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CubicRoots {
    len: usize,
    z: [f64; 3],
}

impl CubicRoots {
    /// The real roots, smallest first (repeated roots are listed once per multiplicity).
    pub fn as_slice(&self) -> &[f64] {
        &self.z[..self.len]
    }

    /// The largest real root.
    pub fn largest(&self) -> f64 {
        self.z[self.len - 1]
    }

    /// The smallest real root.
    pub fn smallest(&self) -> f64 {
        self.z[0]
    }
}

/// Rounding noise allowed, in units of the machine epsilon times the size of the terms.
const NOISE: f64 = 64.0;

#[inline]
fn poly(c2: f64, c1: f64, c0: f64, z: f64) -> f64 {
    ((z + c2) * z + c1) * z + c0
}

#[inline]
fn polish(c2: f64, c1: f64, c0: f64, mut z: f64) -> f64 {
    let mut f = poly(c2, c1, c0, z);
    for _ in 0..3 {
        let df = (3.0 * z + 2.0 * c2) * z + c1;
        if df == 0.0 || f == 0.0 {
            break;
        }
        let zn = z - f / df;
        let fn_ = poly(c2, c1, c0, zn);
        if fn_.abs() >= f.abs() {
            break;
        }
        z = zn;
        f = fn_;
    }
    z
}

/// Real roots of Z^3 + c2 Z^2 + c1 Z + c0 = 0, ascending. Every cubic with real
/// coefficients has at least one real root, so the result is never empty (for finite input).
#[inline]
pub fn solve_cubic(c2: f64, c1: f64, c0: f64) -> CubicRoots {
    let sh = c2 / 3.0;
    let p = c1 - c2 * sh;
    let q = sh * (2.0 * sh * sh - c1) + c0;
    // Absolute rounding noise of p and q, from the size of the terms that formed them.
    let eps = f64::EPSILON * NOISE;
    let dp = eps * (c1.abs() + (c2 * sh).abs());
    let dq = eps * (c0.abs() + (sh * c1).abs() + 2.0 * (sh * sh * sh).abs());
    let hq = 0.5 * q;
    let p3 = p / 3.0;
    let d = hq * hq + p3 * p3 * p3;
    let dd = hq.abs() * dq + p3 * p3 * dp;

    let mut out = CubicRoots {
        len: 0,
        z: [0.0; 3],
    };
    if p.abs() <= dp && q.abs() <= dq {
        // Triple root.
        out.len = 3;
        out.z = [-sh; 3];
        let z = polish(c2, c1, c0, -sh);
        out.z = [z; 3];
        return out;
    }
    if d.abs() <= dd && p < 0.0 {
        // Double root: t = 3q/p once and -3q/(2p) twice.
        let t1 = 3.0 * q / p;
        let a = polish(c2, c1, c0, t1 - sh);
        // Deflate by the simple root a and solve the remaining quadratic Z^2 + e1 Z + e0:
        // a pair that only looks double beside a much larger root (two small, distinct
        // roots, as for a dense liquid at low pressure) is resolved; a true double root
        // gives a non-positive discriminant and stays double.
        let e1 = c2 + a;
        let e0 = if a.abs() > 0.0 { -c0 / a } else { c1 + a * e1 };
        let disc = e1 * e1 - 4.0 * e0;
        let (b1, b2) = if disc > 0.0 {
            let qq = -0.5 * (e1 + disc.sqrt().copysign(e1));
            let (r1, r2) = (qq, if qq == 0.0 { 0.0 } else { e0 / qq });
            (polish(c2, c1, c0, r1), polish(c2, c1, c0, r2))
        } else {
            (-0.5 * e1, -0.5 * e1)
        };
        let mut z = [a, b1, b2];
        z.sort_by(f64::total_cmp);
        out.len = 3;
        out.z = z;
        return out;
    }
    if d > 0.0 {
        let sd = d.sqrt();
        let u = (-(hq + sd.copysign(hq))).cbrt();
        let t = if u == 0.0 { 0.0 } else { u - p3 / u };
        out.len = 1;
        out.z[0] = polish(c2, c1, c0, t - sh);
        return out;
    }
    let m = (-p3).sqrt();
    let arg = (-hq / (m * m * m)).clamp(-1.0, 1.0);
    let th = arg.acos() / 3.0;
    const TWO_PI_3: f64 = 2.0 * std::f64::consts::PI / 3.0;
    let mut z = [
        2.0 * m * (th + TWO_PI_3).cos() - sh,
        2.0 * m * (th - TWO_PI_3).cos() - sh,
        2.0 * m * th.cos() - sh,
    ];
    for zi in &mut z {
        *zi = polish(c2, c1, c0, *zi);
    }
    z.sort_by(f64::total_cmp);
    out.len = 3;
    out.z = z;
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn from_roots(r: [f64; 3]) -> (f64, f64, f64) {
        let c2 = -(r[0] + r[1] + r[2]);
        let c1 = r[0] * r[1] + r[0] * r[2] + r[1] * r[2];
        let c0 = -r[0] * r[1] * r[2];
        (c2, c1, c0)
    }

    #[test]
    fn three_separated_roots() {
        let (c2, c1, c0) = from_roots([0.01, 0.3, 0.9]);
        let r = solve_cubic(c2, c1, c0);
        assert_eq!(r.as_slice().len(), 3);
        for (got, want) in r.as_slice().iter().zip([0.01, 0.3, 0.9]) {
            assert_relative_eq!(*got, want, max_relative = 1e-12);
        }
    }

    #[test]
    fn one_real_root_without_cancellation() {
        // (Z - 0.9)(Z^2 + 1e-4): one real root, imaginary pair close to zero.
        let (c2, c1, c0) = (-0.9, 1e-4, -0.9e-4);
        let r = solve_cubic(c2, c1, c0);
        assert_eq!(r.as_slice().len(), 1);
        assert_relative_eq!(r.largest(), 0.9, max_relative = 1e-14);
    }

    #[test]
    fn exact_triple_root() {
        // (Z - 0.3074)^3: the Peng-Robinson critical point is a triple root.
        let z0 = 0.307_401_3;
        let (c2, c1, c0) = from_roots([z0; 3]);
        let r = solve_cubic(c2, c1, c0);
        assert_eq!(r.as_slice().len(), 3);
        for z in r.as_slice() {
            assert_relative_eq!(*z, z0, max_relative = 1e-9);
        }
    }

    #[test]
    fn near_equal_roots_keep_both() {
        // Two roots separated by 1e-9: a phase next to its spinodal must not vanish.
        for sep in [1e-7, 1e-8, 1e-9] {
            let (c2, c1, c0) = from_roots([0.05, 0.6, 0.6 + sep]);
            let r = solve_cubic(c2, c1, c0);
            assert_eq!(r.as_slice().len(), 3, "separation {sep}");
            assert_relative_eq!(r.smallest(), 0.05, max_relative = 1e-10);
            assert!((r.largest() - 0.6).abs() < 1e-6);
        }
    }

    #[test]
    fn agrees_with_the_roots_crate_on_separated_roots() {
        // Independent check: the general-purpose `roots` crate on well-separated cubics.
        let mut seed = 7_u64;
        let mut rnd = || {
            seed = seed.wrapping_mul(6_364_136_223_846_793_005).wrapping_add(1);
            (seed >> 11) as f64 / (1u64 << 53) as f64
        };
        for _ in 0..2000 {
            let a = rnd();
            let b = a + 0.05 + rnd();
            let c = b + 0.05 + rnd();
            let (c2, c1, c0) = from_roots([a, b, c]);
            let ours = solve_cubic(c2, c1, c0);
            let theirs = roots::find_roots_cubic(1.0, c2, c1, c0);
            let mut t: Vec<f64> = theirs.as_ref().to_vec();
            t.sort_by(f64::total_cmp);
            assert_eq!(t.len(), 3);
            for (x, y) in ours.as_slice().iter().zip(&t) {
                assert!((x - y).abs() < 1e-9, "{x} vs {y}");
            }
        }
    }

    #[test]
    fn two_small_distinct_roots_beside_a_large_one() {
        // Redlich-Kwong methane at Tr = 0.3 and 0.044 Pa: Z of the dense liquid and the middle
        // root are tiny and distinct beside the vapour root near 1, and the discriminant is
        // within rounding of zero. Their mean is not a root.
        let (c2, c1, c0) = (-1.0, 8.055149390705166e-8, -2.31234528160521e-16);
        let r = solve_cubic(c2, c1, c0);
        let z = r.as_slice();
        assert_eq!(z.len(), 3);
        assert!(z[1] > 10.0 * z[0], "{z:?}");
        for zi in z {
            let scale = (c1 * zi).abs() + c0.abs() + zi.powi(3);
            assert!(poly(c2, c1, c0, *zi).abs() < 1e-10 * scale, "{zi}");
        }
    }

    #[test]
    fn roots_satisfy_the_polynomial() {
        for &(c2, c1, c0) in &[(-1.0, 0.2, -0.001), (-0.95, 0.01, -1e-5), (2.0, -3.0, 0.5)] {
            for z in solve_cubic(c2, c1, c0).as_slice() {
                let scale = 1.0 + z.abs().powi(3);
                assert!(poly(c2, c1, c0, *z).abs() < 1e-13 * scale);
            }
        }
    }
}
