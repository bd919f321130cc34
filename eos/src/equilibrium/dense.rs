//! Small dense linear systems solved in place by Gaussian elimination with partial pivoting
//! (G. H. Golub, C. F. Van Loan, *Matrix Computations*, 4th ed., 2013, algorithm 3.4.1), on
//! caller-provided storage so that Newton steps allocate nothing.

/// Solves A x = b for an n x n row-major `a`; `b` is overwritten with x and `a` with its LU
/// factors. Returns false when a pivot is zero or not finite (singular to working precision).
pub fn solve(a: &mut [f64], b: &mut [f64], n: usize) -> bool {
    let scale = a[..n * n].iter().fold(0.0_f64, |m, v| m.max(v.abs()));
    if !(scale.is_finite() && scale > 0.0) {
        return false;
    }
    for k in 0..n {
        let mut piv = k;
        let mut best = a[k * n + k].abs();
        for i in k + 1..n {
            let v = a[i * n + k].abs();
            if v > best {
                best = v;
                piv = i;
            }
        }
        if best.is_nan() || best <= 1e-300 * scale || !best.is_finite() {
            return false;
        }
        if piv != k {
            for j in 0..n {
                a.swap(k * n + j, piv * n + j);
            }
            b.swap(k, piv);
        }
        let d = a[k * n + k];
        for i in k + 1..n {
            let f = a[i * n + k] / d;
            if f != 0.0 {
                for j in k + 1..n {
                    a[i * n + j] -= f * a[k * n + j];
                }
                b[i] -= f * b[k];
            }
        }
    }
    for k in (0..n).rev() {
        let mut s = b[k];
        for j in k + 1..n {
            s -= a[k * n + j] * b[j];
        }
        b[k] = s / a[k * n + k];
    }
    b[..n].iter().all(|v| v.is_finite())
}

#[cfg(test)]
mod tests {
    use super::solve;

    #[test]
    fn solves_a_system_needing_a_pivot() {
        // [[0, 2, 1], [1, 1, 1], [2, 1, 3]] x = [7, 6, 13] has x = [1, 2, 3] (by substitution).
        let mut a = [0.0, 2.0, 1.0, 1.0, 1.0, 1.0, 2.0, 1.0, 3.0];
        let mut b = [7.0, 6.0, 13.0];
        assert!(solve(&mut a, &mut b, 3));
        for (x, want) in b.iter().zip([1.0, 2.0, 3.0]) {
            assert!((x - want).abs() < 1e-14);
        }
    }

    #[test]
    fn refuses_a_singular_matrix() {
        let mut a = [1.0, 2.0, 2.0, 4.0];
        let mut b = [1.0, 2.0];
        assert!(!solve(&mut a, &mut b, 2));
    }
}
