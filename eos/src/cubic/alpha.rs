//! Alpha functions: the temperature dependence of the attraction parameter a(T) = a_c alpha(T).
//!
//! Each returns sqrt(alpha) with its scaled temperature derivatives, the form the van der
//! Waals mixing rule needs (sqrt(a_i a_j) = sqrt(a_ci a_cj) sqrt(alpha_i) sqrt(alpha_j)).

/// An alpha function of reduced temperature Tr = T/Tc.
#[derive(Debug, Clone, Copy)]
pub enum Alpha {
    /// alpha = 1 (van der Waals).
    Constant,
    /// alpha = Tr^(-1/2) (Redlich-Kwong).
    InverseSqrtTr,
    /// alpha = [1 + m (1 - sqrt(Tr))]^2 (Soave 1972), with m a function of the acentric factor.
    Soave(fn(f64) -> f64),
}

/// sqrt(alpha), T d(sqrt alpha)/dT and T^2 d2(sqrt alpha)/dT2 at one temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SqrtAlpha {
    pub s: f64,
    pub s_t: f64,
    pub s_tt: f64,
}

impl Alpha {
    /// The component parameter of the alpha function (m for Soave, unused otherwise).
    pub fn parameter(&self, omega: f64) -> f64 {
        match self {
            Alpha::Soave(m) => m(omega),
            _ => 0.0,
        }
    }

    /// sqrt(alpha) and its derivatives at reduced temperature `tr`, for parameter `m`;
    /// `sqrt_tr` is sqrt(tr), which the caller can form for every component of a mixture
    /// from one square root (sqrt(T) / sqrt(Tc,i)).
    #[inline]
    pub fn sqrt_alpha(&self, tr: f64, sqrt_tr: f64, m: f64) -> SqrtAlpha {
        match self {
            Alpha::Constant => SqrtAlpha {
                s: 1.0,
                s_t: 0.0,
                s_tt: 0.0,
            },
            Alpha::InverseSqrtTr => {
                let s = tr.powf(-0.25);
                SqrtAlpha {
                    s,
                    s_t: -0.25 * s,
                    s_tt: 0.3125 * s,
                }
            }
            Alpha::Soave(_) => {
                let r = sqrt_tr;
                SqrtAlpha {
                    s: 1.0 + m * (1.0 - r),
                    s_t: -0.5 * m * r,
                    s_tt: 0.25 * m * r,
                }
            }
        }
    }
}
