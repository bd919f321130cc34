//! Acceleration of successive substitution by the general dominant eigenvalue method.
//!
//! A linearly convergent fixed-point iteration x_(k+1) = G(x_k) has increments
//! g_k = x_(k+1) - x_k that soon lie in the span of the dominant eigenvectors of its
//! Jacobian A. With two of them, g_k + c1 g_(k-1) + c2 g_(k-2) = 0 (least squares for c1,
//! c2), and the remaining sum of increments, (I - A)^-1 g_(k-1) = [(1 + c1) g_(k-1) + g_k] /
//! (1 + c1 + c2), gives
//!
//! x* = x_(k+1) + (a - 1) g_(k-1) + (b - 1) g_k, with a = (1 + c1)/(1 + c1 + c2) and
//! b = 1/(1 + c1 + c2).
//!
//! With one eigenvalue (c2 = 0, lambda = -c1) this is the dominant eigenvalue method that M.
//! L. Michelsen, *The isothermal flash problem. Part II. Phase-split calculation*, Fluid Phase
//! Equilib. 9 (1982) 21-40, applies to ln K every fifth substitution; the two-eigenvalue form
//! is that of D. M. Crowe, M. Nishio, AIChE J. 21 (1975) 528. The caller keeps the step only
//! if it lowers the residual.

/// Writes the extrapolated point into `x` (which holds x_(k+1) on entry), from the last
/// three increments `g0` = g_(k-2), `g1` = g_(k-1), `g2` = g_k. Returns false (leaving `x`
/// unchanged) when the extrapolation is ill-conditioned.
pub fn extrapolate(x: &mut [f64], g0: &[f64], g1: &[f64], g2: &[f64]) -> bool {
    let dot = |a: &[f64], b: &[f64]| a.iter().zip(b).map(|(u, v)| u * v).sum::<f64>();
    let (a11, a12, a22) = (dot(g1, g1), dot(g1, g0), dot(g0, g0));
    let (b1, b2) = (-dot(g1, g2), -dot(g0, g2));
    let det = a11 * a22 - a12 * a12;
    let (c1, c2) = if det.abs() > 1e-10 * a11 * a22 {
        ((b1 * a22 - b2 * a12) / det, (a11 * b2 - a12 * b1) / det)
    } else if a11 > 0.0 {
        (b1 / a11, 0.0)
    } else {
        return false;
    };
    let den = 1.0 + c1 + c2;
    if den.is_nan() || den.abs() <= 1e-3 || !den.is_finite() {
        return false;
    }
    let a = (1.0 + c1) / den;
    let b = 1.0 / den;
    // Refuse wild extrapolations (more than 50 further increments' worth).
    if a.is_nan() || b.is_nan() || a.abs() >= 50.0 || b.abs() >= 50.0 {
        return false;
    }
    for i in 0..x.len() {
        x[i] += (a - 1.0) * g1[i] + (b - 1.0) * g2[i];
    }
    true
}

#[cfg(test)]
mod tests {
    use super::extrapolate;

    #[test]
    fn exact_for_a_linear_iteration_with_two_modes() {
        // x_(k+1) = A x_k + c with A = diag(0.9, 0.5): fixed point x* = c / (1 - diag).
        let c = [0.1, 1.0];
        let step = |x: [f64; 2]| [0.9 * x[0] + c[0], 0.5 * x[1] + c[1]];
        let x0 = [0.0, 0.0];
        let x1 = step(x0);
        let x2 = step(x1);
        let x3 = step(x2);
        let g = |a: [f64; 2], b: [f64; 2]| [b[0] - a[0], b[1] - a[1]];
        let mut x = x3;
        assert!(extrapolate(&mut x, &g(x0, x1), &g(x1, x2), &g(x2, x3)));
        assert!(
            (x[0] - 1.0).abs() < 1e-12 && (x[1] - 2.0).abs() < 1e-12,
            "{x:?}"
        );
    }
}
