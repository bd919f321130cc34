//! The Rachford-Rice equation of an isothermal two-phase split.
//!
//! For feed z and K-values K_i = y_i / x_i, the vapour fraction beta solves (H. H. Rachford,
//! J. D. Rice, J. Pet. Technol. 4 (1952) 19)
//!
//! f(beta) = sum_i z_i (K_i - 1) / (1 + beta (K_i - 1)) = 0,
//!
//! f is strictly decreasing between its poles nearest to [0, 1], beta_min = 1/(1 - K_max) and
//! beta_max = 1/(1 - K_min), and has exactly one root there when K_max > 1 > K_min (the
//! negative flash of C. H. Whitson, M. L. Michelsen, Fluid Phase Equilib. 53 (1989) 51). The
//! root is found on that bracket by Newton's method on the function of C. F. Leibovici, J.
//! Neoschil, Fluid Phase Equilib. 74 (1992) 303,
//!
//! F(beta) = (beta - beta_min)(beta_max - beta) f(beta),
//!
//! which removes the two poles and is nearly linear, safeguarded by bisection: F(beta_min) =
//! (beta_max - beta_min) z_(Kmax) > 0 and F(beta_max) = -(beta_max - beta_min) z_(Kmin) < 0.
//! Components with z_i = 0 do not take part.

/// The outcome of the Rachford-Rice solve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum RrOutcome {
    /// The root beta (possibly outside [0, 1]) and the iterations used.
    Root {
        /// Vapour fraction.
        beta: f64,
        /// Newton/bisection iterations.
        iterations: usize,
    },
    /// Every K_i <= 1: no vapour can form (the feed is liquid for these K-values).
    AllBelowOne,
    /// Every K_i >= 1: no liquid can form.
    AllAboveOne,
}

const MAX_ITER: usize = 100;

/// Solves the Rachford-Rice equation for feed `z` and K-values `k`.
pub fn solve(z: &[f64], k: &[f64]) -> RrOutcome {
    let (mut kmax, mut kmin) = (f64::NEG_INFINITY, f64::INFINITY);
    for (&zi, &ki) in z.iter().zip(k) {
        if zi > 0.0 {
            kmax = kmax.max(ki);
            kmin = kmin.min(ki);
        }
    }
    if kmax.is_nan() || kmax <= 1.0 {
        return RrOutcome::AllBelowOne;
    }
    if kmin.is_nan() || kmin >= 1.0 {
        return RrOutcome::AllAboveOne;
    }
    let bmin = 1.0 / (1.0 - kmax);
    let bmax = 1.0 / (1.0 - kmin);
    let eval = |b: f64| {
        let (mut f, mut df) = (0.0, 0.0);
        for (&zi, &ki) in z.iter().zip(k) {
            if zi > 0.0 {
                let c = ki - 1.0;
                let d = 1.0 / (1.0 + b * c);
                let t = zi * c * d;
                f += t;
                df -= t * c * d;
            }
        }
        let (u, w) = (b - bmin, bmax - b);
        (u * w * f, (w - u) * f + u * w * df)
    };
    let (mut lo, mut hi) = (bmin, bmax);
    // Start from the physical interval's middle when it lies inside the bracket.
    let mut b = 0.5_f64.clamp(bmin + 0.25 * (bmax - bmin), bmax - 0.25 * (bmax - bmin));
    for it in 1..=MAX_ITER {
        let (f, df) = eval(b);
        if f == 0.0 {
            return RrOutcome::Root {
                beta: b,
                iterations: it,
            };
        }
        if f > 0.0 {
            lo = b;
        } else {
            hi = b;
        }
        let newton = b - f / df;
        // A Newton step within round-off ends the solve here: it would land on the end of
        // the bracket just set to b and be refused, and bisection would go on to the width.
        if newton.is_finite() && (newton - b).abs() <= 1e-15 * (1.0 + b.abs()) {
            return RrOutcome::Root {
                beta: newton,
                iterations: it,
            };
        }
        let next = if newton.is_finite() && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
        if (next - b).abs() <= 1e-15 * (1.0 + b.abs()) || hi - lo <= 1e-15 * (1.0 + b.abs()) {
            return RrOutcome::Root {
                beta: next,
                iterations: it,
            };
        }
        b = next;
    }
    RrOutcome::Root {
        beta: b,
        iterations: MAX_ITER,
    }
}

/// Phase compositions of a split: x_i = z_i / (1 + beta (K_i - 1)), y_i = K_i x_i.
#[inline]
pub fn compositions(z: &[f64], k: &[f64], beta: f64, x: &mut [f64], y: &mut [f64]) {
    for i in 0..z.len() {
        x[i] = z[i] / (1.0 + beta * (k[i] - 1.0));
        y[i] = k[i] * x[i];
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn residual(z: &[f64], k: &[f64], b: f64) -> f64 {
        z.iter()
            .zip(k)
            .map(|(z, k)| z * (k - 1.0) / (1.0 + b * (k - 1.0)))
            .sum()
    }

    #[test]
    fn binary_has_a_closed_form() {
        // For two components the equation is linear in beta after clearing denominators:
        // beta = -(z1 c1 + z2 c2) / (c1 c2) with c = K - 1 (algebra of the definition).
        let (z, k) = ([0.4, 0.6], [3.0, 0.2]);
        let (c1, c2) = (2.0, -0.8);
        let want = -(0.4 * c1 + 0.6 * c2) / (c1 * c2);
        match solve(&z, &k) {
            RrOutcome::Root { beta, .. } => assert!((beta - want).abs() < 1e-14, "{beta}"),
            o => panic!("{o:?}"),
        }
    }

    #[test]
    fn wide_k_range_and_negative_flash() {
        let z = [0.01, 0.2, 0.3, 0.29, 0.2];
        let k = [1e6, 5.0, 1.1, 0.01, 1e-8];
        match solve(&z, &k) {
            RrOutcome::Root { beta, .. } => assert!(residual(&z, &k, beta).abs() < 1e-13),
            o => panic!("{o:?}"),
        }
        // A feed whose root lies below zero (negative flash).
        let (z, k) = ([0.05, 0.95], [2.0, 0.5]);
        match solve(&z, &k) {
            RrOutcome::Root { beta, .. } => {
                assert!(beta < 0.0);
                assert!(residual(&z, &k, beta).abs() < 1e-13);
            }
            o => panic!("{o:?}"),
        }
    }

    #[test]
    fn one_sided_k_values_are_reported() {
        assert_eq!(solve(&[0.5, 0.5], &[0.5, 0.9]), RrOutcome::AllBelowOne);
        assert_eq!(solve(&[0.5, 0.5], &[1.5, 1.0]), RrOutcome::AllAboveOne);
        // A component absent from the feed does not count.
        assert_eq!(solve(&[1.0, 0.0], &[0.5, 2.0]), RrOutcome::AllBelowOne);
    }

    /// Newton's method on the Leibovici-Neoschil function converges in a few steps once near
    /// the root (quadratic convergence); a solve that ends in bisection to the bracket width
    /// takes some fifty. K-values over six decades, 2,000 sets.
    #[test]
    fn converges_in_few_iterations() {
        let z = [
            0.015, 0.01, 0.855, 0.07, 0.03, 0.005, 0.007, 0.002, 0.002, 0.004,
        ];
        let mut worst = 0;
        for s in 0..2000 {
            let spread = 3.0 * s as f64 / 1999.0 + 0.05;
            let k: Vec<f64> = (0..10)
                .map(|i| (spread * (2.0 - 0.5 * i as f64) + 0.1 * ((s * 7 + i) % 5) as f64).exp())
                .collect();
            if let RrOutcome::Root { beta, iterations } = solve(&z, &k) {
                assert!(residual(&z, &k, beta).abs() < 1e-12, "set {s}");
                worst = worst.max(iterations);
            }
        }
        assert!(worst <= 12, "{worst} iterations");
    }
}
