//! Non-analytic term of a residual Helmholtz energy (IAPWS-95 terms 55-56; Span & Wagner (1996)
//! for carbon dioxide, terms 40-42):
//!
//! ```text
//! phi = n Delta^b delta psi
//! Delta = theta^2 + B ((delta - 1)^2)^a
//! theta = (1 - tau) + A ((delta - 1)^2)^(1 / (2 beta))
//! psi   = exp(-C (delta - 1)^2 - D (tau - 1)^2)
//! ```
//!
//! The derivatives are those of IAPWS R6-95(2018), Table 5. At delta = 1 the delta-derivatives
//! of Delta contain 0/0 whose limits are zero; exactly at the critical point (delta = tau = 1)
//! Delta = 0 and the second derivatives diverge, so Delta is kept at or above [`DELTA_FLOOR`]
//! and the result is a very large finite number there instead of an infinity. Far from the
//! critical point (psi < [`PSI_NEGLIGIBLE`]) the term is left out.

use super::derivs::Derivs;

/// Smallest Delta used; keeps Delta^(b-2) finite at the exact critical point.
pub const DELTA_FLOOR: f64 = 1e-200;

/// psi below which the term is left out. psi < 1e-30 needs |tau - 1| or |delta - 1| large
/// (D = 700 to 800, C = 28 to 32 in IAPWS-95), where Delta is of order 1e-2 or more, so the
/// term and its derivatives are below 1e-24 in absolute value, far below the rounding of
/// phi_r.
pub const PSI_NEGLIGIBLE: f64 = 1e-30;

/// n Delta^b delta psi.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct NonAnalyticTerm {
    /// Coefficient n.
    pub n: f64,
    /// Exponent a of ((delta-1)^2) in Delta.
    pub a: f64,
    /// Exponent b of Delta.
    pub b: f64,
    /// beta of the exponent 1/(2 beta) in theta.
    pub beta: f64,
    /// A in theta.
    pub big_a: f64,
    /// B in Delta.
    pub big_b: f64,
    /// C in psi.
    pub big_c: f64,
    /// D in psi.
    pub big_d: f64,
}

impl NonAnalyticTerm {
    /// The term and its plain partial derivatives at (tau, delta).
    pub fn evaluate(&self, tau: f64, delta: f64) -> Derivs {
        let (a, b, beta) = (self.a, self.b, self.beta);
        let (ca, cb, cc, cd) = (self.big_a, self.big_b, self.big_c, self.big_d);
        let dm = delta - 1.0;
        let tm = tau - 1.0;
        let dm2 = dm * dm;
        let ex = 0.5 / beta; // 1/(2 beta)
        let psi = (-cc * dm2 - cd * tm * tm).exp();
        if psi < PSI_NEGLIGIBLE {
            return Derivs::default();
        }
        // (dm2)^ex and (dm2)^a once; the lower powers by division.
        let dm2_ex = dm2.powf(ex);
        let dm2_a = dm2.powf(a);
        let theta = -tm + ca * dm2_ex;
        let big_delta = (theta * theta + cb * dm2_a).max(DELTA_FLOOR);
        let psi_d = -2.0 * cc * dm * psi;
        let psi_dd = (2.0 * cc * dm2 - 1.0) * 2.0 * cc * psi;
        let psi_t = -2.0 * cd * tm * psi;
        let psi_tt = (2.0 * cd * tm * tm - 1.0) * 2.0 * cd * psi;
        let psi_dt = 4.0 * cc * cd * dm * tm * psi;

        // Delta and its delta-derivatives; their limits at delta = 1 are zero.
        let (ddel, dddel, cross) = if dm2 > 0.0 {
            let inv = 1.0 / dm2;
            let p1 = dm2_ex * inv; // dm2^(ex - 1)
            let a1 = dm2_a * inv; // dm2^(a - 1)
            let ddel = dm * (ca * theta * (2.0 / beta) * p1 + 2.0 * cb * a * a1);
            let dddel = ddel / dm
                + dm2
                    * (4.0 * cb * a * (a - 1.0) * a1 * inv
                        + 2.0 * ca * ca * (1.0 / beta).powi(2) * p1 * p1
                        + ca * theta * (4.0 / beta) * (ex - 1.0) * p1 * inv);
            (ddel, dddel, dm * p1)
        } else {
            (0.0, 0.0, 0.0)
        };

        let db1 = big_delta.powf(b - 1.0); // Delta^(b-1)
        let db2 = db1 / big_delta; // Delta^(b-2)
        let db = db1 * big_delta; // Delta^b
        let db_d = b * db1 * ddel;
        let db_dd = b * (db1 * dddel + (b - 1.0) * db2 * ddel * ddel);
        let db_t = -2.0 * theta * b * db1;
        let db_tt = 2.0 * b * db1 + 4.0 * theta * theta * b * (b - 1.0) * db2;
        let db_dt = -ca * b * (2.0 / beta) * db1 * cross - 2.0 * theta * b * (b - 1.0) * db2 * ddel;

        let n = self.n;
        Derivs {
            a: n * db * delta * psi,
            d: n * (db * (psi + delta * psi_d) + db_d * delta * psi),
            dd: n
                * (db * (2.0 * psi_d + delta * psi_dd)
                    + 2.0 * db_d * (psi + delta * psi_d)
                    + db_dd * delta * psi),
            t: n * delta * (db_t * psi + db * psi_t),
            tt: n * delta * (db_tt * psi + 2.0 * db_t * psi_t + db * psi_tt),
            dt: n
                * (db * (psi_t + delta * psi_dt)
                    + delta * db_d * psi_t
                    + db_t * (psi + delta * psi_d)
                    + db_dt * delta * psi),
        }
    }
}
