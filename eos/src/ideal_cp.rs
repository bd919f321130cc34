//! Ideal-gas isobaric heat capacity as a piecewise polynomial in T.
//!
//! Each segment gives cp0/R = a0 + a1 T + a2 T^2 + a3 T^3 + a4 T^4 over [t_lo, t_hi]. This is
//! the form of the NASA 7-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993;
//! GRI-Mech 3.0 uses two segments) and of the single-range polynomials tabulated in Poling,
//! Prausnitz & O'Connell, *The Properties of Gases and Liquids*, 5th ed. (2001), Appendix A.
//!
//! Enthalpy and entropy are integrated analytically from the reference state of
//! [`crate::constants`]: h0(T_REF) = 0 and s0(T_REF, P_REF) = 0 for every pure ideal gas, unless
//! the component carries another zero ([`IdealGasCp::with_zero`]): water is on the steam-table
//! zero (IAPWS-95: u = 0 and s = 0 for the saturated liquid at the triple point), which puts its
//! ideal gas at T_REF, P_REF at the values of [`crate::helmholtz::steam_table_zero`].
//! Outside the fitted range the end segment is extrapolated; [`IdealGasCp::range`] tells the
//! caller where that starts.

use crate::constants::T_REF;

/// One polynomial segment of cp0/R.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CpSegment {
    /// Lower end of the segment, K.
    pub t_lo: f64,
    /// Upper end of the segment, K.
    pub t_hi: f64,
    /// Coefficients of cp0/R in powers of T (K): a0..a4.
    pub a: [f64; 5],
}

impl CpSegment {
    fn cp_r(&self, t: f64) -> f64 {
        let a = &self.a;
        a[0] + t * (a[1] + t * (a[2] + t * (a[3] + t * a[4])))
    }
    /// Integral of cp0/R dT from 0 to t (an antiderivative).
    fn h_int(&self, t: f64) -> f64 {
        let a = &self.a;
        t * (a[0] + t * (a[1] / 2.0 + t * (a[2] / 3.0 + t * (a[3] / 4.0 + t * a[4] / 5.0))))
    }
    /// An antiderivative of cp0/(R T) dT.
    fn s_int(&self, t: f64) -> f64 {
        let a = &self.a;
        a[0] * t.ln() + t * (a[1] + t * (a[2] / 2.0 + t * (a[3] / 3.0 + t * a[4] / 4.0)))
    }
}

/// Ideal-gas isobaric heat capacity of one component: segments sorted by temperature and
/// joined end to end.
#[derive(Debug, Clone, PartialEq)]
pub struct IdealGasCp {
    segments: Vec<CpSegment>,
    /// h0/R (K) and s0/R of the ideal gas at T_REF, P_REF on the component's zero; (0, 0) on
    /// the crate's.
    zero: (f64, f64),
}

/// Ideal-gas caloric properties of one component or mixture at T, in reduced form.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct IdealGasValues {
    /// cp0/R.
    pub cp_r: f64,
    /// h0/R in K, relative to T_REF.
    pub h_r: f64,
    /// s0/R at P_REF, relative to T_REF (no mixing term).
    pub s_r: f64,
}

impl IdealGasCp {
    /// A constant cp0 = `cp_over_r` R, valid at every temperature.
    pub fn constant(cp_over_r: f64) -> Self {
        IdealGasCp {
            segments: vec![CpSegment {
                t_lo: 0.0,
                t_hi: f64::INFINITY,
                a: [cp_over_r, 0.0, 0.0, 0.0, 0.0],
            }],
            zero: (0.0, 0.0),
        }
    }

    /// The same heat capacity with enthalpy and entropy on another zero: h0/R (K) and s0/R
    /// of the ideal gas at T_REF and P_REF.
    pub fn with_zero(mut self, h0_r: f64, s0_r: f64) -> Self {
        self.zero = (h0_r, s0_r);
        self
    }

    /// h0/R (K) and s0/R of the ideal gas at T_REF, P_REF: (0, 0) on the crate's zero.
    pub fn zero(&self) -> (f64, f64) {
        self.zero
    }

    /// Piecewise polynomial from segments; returns `None` unless the segments are non-empty,
    /// sorted, contiguous and finite.
    pub fn piecewise(segments: Vec<CpSegment>) -> Option<Self> {
        if segments.is_empty() {
            return None;
        }
        let finite = segments
            .iter()
            .all(|s| s.a.iter().all(|c| c.is_finite()) && s.t_lo < s.t_hi && s.t_lo >= 0.0);
        let joined = segments
            .windows(2)
            .all(|w| (w[0].t_hi - w[1].t_lo).abs() < 1e-9);
        (finite && joined).then_some(IdealGasCp {
            segments,
            zero: (0.0, 0.0),
        })
    }

    /// The segments, lowest temperature first.
    pub fn segments(&self) -> &[CpSegment] {
        &self.segments
    }

    /// Temperature range covered by data, in K.
    pub fn range(&self) -> (f64, f64) {
        (
            self.segments[0].t_lo,
            self.segments[self.segments.len() - 1].t_hi,
        )
    }

    fn index(&self, t: f64) -> usize {
        self.segments
            .iter()
            .position(|s| t <= s.t_hi)
            .unwrap_or(self.segments.len() - 1)
    }

    /// cp0/R at T.
    pub fn cp_r(&self, t: f64) -> f64 {
        self.segments[self.index(t)].cp_r(t)
    }

    /// Integrals of cp0/R from T_REF to t: (integral of cp0/R dT, integral of cp0/(R T) dT).
    fn integrals(&self, t: f64) -> (f64, f64) {
        let (lo, hi, sign) = if t >= T_REF {
            (T_REF, t, 1.0)
        } else {
            (t, T_REF, -1.0)
        };
        let (mut h, mut s) = (0.0, 0.0);
        let last = self.segments.len() - 1;
        for (k, seg) in self.segments.iter().enumerate() {
            let a = if k == 0 { lo } else { lo.max(seg.t_lo) };
            let b = if k == last { hi } else { hi.min(seg.t_hi) };
            if b > a {
                h += seg.h_int(b) - seg.h_int(a);
                s += seg.s_int(b) - seg.s_int(a);
            }
        }
        (sign * h, sign * s)
    }

    /// cp0/R, h0/R and s0/R (at P_REF) at T.
    pub fn values(&self, t: f64) -> IdealGasValues {
        let (h, s) = self.integrals(t);
        IdealGasValues {
            cp_r: self.cp_r(t),
            h_r: h + self.zero.0,
            s_r: s + self.zero.1,
        }
    }
}

/// Mole-fraction average of the components' cp0/R, h0/R and s0/R at T (no mixing term).
pub fn mixture_values<'a>(
    cps: impl IntoIterator<Item = &'a IdealGasCp>,
    x: &[f64],
    t: f64,
) -> IdealGasValues {
    let mut sum = IdealGasValues {
        cp_r: 0.0,
        h_r: 0.0,
        s_r: 0.0,
    };
    for (cp, &xi) in cps.into_iter().zip(x) {
        let v = cp.values(t);
        sum.cp_r += xi * v.cp_r;
        sum.h_r += xi * v.h_r;
        sum.s_r += xi * v.s_r;
    }
    sum
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn constant_cp_integrates_exactly() {
        // h = cp (T - T0), s = cp ln(T/T0): exact calculus.
        let cp = IdealGasCp::constant(3.5);
        let v = cp.values(500.0);
        assert_relative_eq!(v.h_r, 3.5 * (500.0 - T_REF), max_relative = 1e-13);
        assert_relative_eq!(v.s_r, 3.5 * (500.0 / T_REF).ln(), max_relative = 1e-13);
        let v = cp.values(200.0);
        assert_relative_eq!(v.h_r, 3.5 * (200.0 - T_REF), max_relative = 1e-13);
    }

    #[test]
    fn piecewise_integrals_match_numerical_quadrature() {
        let seg = |lo, hi, a| CpSegment {
            t_lo: lo,
            t_hi: hi,
            a,
        };
        let cp = IdealGasCp::piecewise(vec![
            seg(200.0, 1000.0, [3.5, 1e-3, -1e-6, 2e-10, 0.0]),
            seg(1000.0, 3000.0, [3.45, 3e-4, -5e-8, 0.0, 0.0]),
        ])
        .unwrap();
        let t = 1500.0;
        let n = 200_000;
        let (mut h, mut s) = (0.0, 0.0);
        let dt = (t - T_REF) / n as f64;
        for k in 0..n {
            let tm = T_REF + (k as f64 + 0.5) * dt;
            h += cp.cp_r(tm) * dt;
            s += cp.cp_r(tm) / tm * dt;
        }
        let v = cp.values(t);
        assert_relative_eq!(v.h_r, h, max_relative = 1e-8);
        assert_relative_eq!(v.s_r, s, max_relative = 1e-8);
    }

    #[test]
    fn rejects_gaps_and_nan() {
        let seg = |lo, hi| CpSegment {
            t_lo: lo,
            t_hi: hi,
            a: [3.5, 0.0, 0.0, 0.0, 0.0],
        };
        assert!(IdealGasCp::piecewise(vec![seg(200.0, 900.0), seg(1000.0, 2000.0)]).is_none());
        assert!(IdealGasCp::piecewise(vec![]).is_none());
        let mut bad = seg(200.0, 900.0);
        bad.a[1] = f64::NAN;
        assert!(IdealGasCp::piecewise(vec![bad]).is_none());
    }
}
