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
