//! Plocker-Knapp-Prausnitz mixing rules for the Lee-Kesler equation.
//!
//! U. Plocker, H. Knapp, J. Prausnitz, Ind. Eng. Chem. Process Des. Dev. 17 (1978) 324-332:
//!
//! - Zc_j = 0.2905 - 0.085 omega_j, Vc_j = Zc_j R Tc_j / Pc_j
//! - Vc_jk = (Vc_j^(1/3) + Vc_k^(1/3))^3 / 8, Tc_jk = (Tc_j Tc_k)^(1/2) k*_jk
//! - Vc_m = sum_j sum_k x_j x_k Vc_jk
//! - Tc_m = Vc_m^(-1/4) sum_j sum_k x_j x_k Vc_jk^(1/4) Tc_jk
//! - omega_m = sum_j x_j omega_j, Pc_m = (0.2905 - 0.085 omega_m) R Tc_m / Vc_m
//!
//! Vc_jk and Vc_jk^(1/4) Tc_jk depend on the components only; [`PairTerms`] computes them once
//! so that a composition costs two weighted sums over the pairs (taken once per unordered
//! pair, the terms being symmetric) and one fourth root.
//!
//! k*_jk is the binary parameter of the paper (1 when unknown). For a pure fluid the rules
//! return its own Tc and omega, and Pc, since Vc_j is defined by the same Zc relation.

use crate::constants::R;

/// Pseudo-critical constants of a mixture.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PseudoCritical {
    /// K.
    pub tc: f64,
    /// Pa.
    pub pc: f64,
    /// m3/mol.
    pub vc: f64,
    pub omega: f64,
}

/// Lee-Kesler critical compressibility of a fluid with acentric factor omega.
pub fn zc(omega: f64) -> f64 {
    0.2905 - 0.085 * omega
}

/// Applies the rules. `vc_cbrt[j]` = Vc_j^(1/3), `kstar` row-major n x n.
pub fn pseudo_critical(
    tc: &[f64],
    omega: &[f64],
    vc_cbrt: &[f64],
    kstar: &[f64],
    x: &[f64],
) -> PseudoCritical {
    let n = x.len();
    let (mut vcm, mut tsum, mut om) = (0.0, 0.0, 0.0);
    for j in 0..n {
        om += x[j] * omega[j];
        for k in 0..n {
            let v = (vc_cbrt[j] + vc_cbrt[k]).powi(3) / 8.0;
            let t = (tc[j] * tc[k]).sqrt() * kstar[j * n + k];
            let w = x[j] * x[k];
            vcm += w * v;
            tsum += w * v.powf(0.25) * t;
        }
    }
    let tcm = tsum / vcm.powf(0.25);
    PseudoCritical {
        tc: tcm,
        pc: zc(om) * R * tcm / vcm,
        vc: vcm,
        omega: om,
    }
}

/// The composition-independent terms of the rules, for every pair of components.
#[derive(Debug, Clone)]
pub struct PairTerms {
    n: usize,
    omega: Vec<f64>,
    /// Vc_jk, row-major n x n.
    v: Vec<f64>,
    /// Vc_jk^(1/4) Tc_jk, row-major n x n.
    vt: Vec<f64>,
}

impl PairTerms {
    /// The terms for components with `tc`, `omega`, `vc_cbrt` = Vc^(1/3) and `kstar` (row-major
    /// n x n, symmetric).
    pub fn new(tc: &[f64], omega: &[f64], vc_cbrt: &[f64], kstar: &[f64]) -> Self {
        let n = tc.len();
        let mut v = vec![0.0; n * n];
        let mut vt = vec![0.0; n * n];
        for j in 0..n {
            for k in 0..n {
                let vjk = (vc_cbrt[j] + vc_cbrt[k]).powi(3) / 8.0;
                v[j * n + k] = vjk;
                vt[j * n + k] = vjk.powf(0.25) * (tc[j] * tc[k]).sqrt() * kstar[j * n + k];
            }
        }
        PairTerms {
            n,
            omega: omega.to_vec(),
            v,
            vt,
        }
    }

    /// The pseudo-critical constants of composition `x` (one fraction per component).
    pub fn pseudo_critical(&self, x: &[f64]) -> PseudoCritical {
        let n = self.n.min(x.len());
        let (mut vcm, mut tsum, mut om) = (0.0, 0.0, 0.0);
        for j in 0..n {
            let xj = x[j];
            om += xj * self.omega[j];
            let row = j * self.n;
            // x_j (x_j T_jj + 2 sum_{k > j} x_k T_jk): each unordered pair once
            let (mut sv, mut st) = (0.0, 0.0);
            let pairs = x[j + 1..n]
                .iter()
                .zip(&self.v[row + j + 1..row + n])
                .zip(&self.vt[row + j + 1..row + n]);
            for ((xk, v), vt) in pairs {
                sv += xk * v;
                st += xk * vt;
            }
            vcm += xj * (xj * self.v[row + j] + 2.0 * sv);
            tsum += xj * (xj * self.vt[row + j] + 2.0 * st);
        }
        let tcm = tsum / vcm.sqrt().sqrt();
        PseudoCritical {
            tc: tcm,
            pc: zc(om) * R * tcm / vcm,
            vc: vcm,
            omega: om,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pair_terms_give_the_rules_of_the_direct_sums() {
        // The precomputed, pair-symmetric sums are the double sums of the rules above,
        // rearranged: equal to round-off (10-component gas, asymmetric-looking k*).
        let tc = [
            126.2, 304.1, 190.6, 305.3, 369.8, 407.8, 425.1, 460.4, 469.7, 507.6,
        ];
        let pc = [
            34.0e5, 73.8e5, 46.0e5, 48.7e5, 42.5e5, 36.4e5, 38.0e5, 33.8e5, 33.7e5, 30.3e5,
        ];
        let omega = [
            0.037, 0.224, 0.011, 0.099, 0.152, 0.186, 0.2, 0.229, 0.252, 0.301,
        ];
        let n = tc.len();
        let vc_cbrt: Vec<f64> = (0..n)
            .map(|j| (zc(omega[j]) * R * tc[j] / pc[j]).cbrt())
            .collect();
        let mut kstar = vec![1.0; n * n];
        for j in 0..n {
            for k in 0..j {
                let v = 1.0 + 0.01 * ((j * 7 + k * 3) % 11) as f64 - 0.05;
                kstar[j * n + k] = v;
                kstar[k * n + j] = v;
            }
        }
        let terms = PairTerms::new(&tc, &omega, &vc_cbrt, &kstar);
        for s in 0..20 {
            let raw: Vec<f64> = (0..n)
                .map(|j| 1.0 + ((s * 13 + j * 5) % 17) as f64)
                .collect();
            let sum: f64 = raw.iter().sum();
            let x: Vec<f64> = raw.iter().map(|r| r / sum).collect();
            let a = pseudo_critical(&tc, &omega, &vc_cbrt, &kstar, &x);
            let b = terms.pseudo_critical(&x);
            for (p, q) in [(a.tc, b.tc), (a.pc, b.pc), (a.vc, b.vc), (a.omega, b.omega)] {
                assert!((p - q).abs() <= 1e-13 * p.abs(), "{a:?} vs {b:?}");
            }
        }
    }
}
