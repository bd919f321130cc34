//! Generalized correlations of the second virial coefficient,
//! B Pc / (R Tc) = f0(Tr) + omega f1(Tr), each term a polynomial in 1/Tr.
//!
//! - Tsonopoulos, AIChE J. 20 (1974) 263-272 (non-polar form):
//!   f0 = 0.1445 - 0.330/Tr - 0.1385/Tr^2 - 0.0121/Tr^3 - 0.000607/Tr^8,
//!   f1 = 0.0637 + 0.331/Tr^2 - 0.423/Tr^3 - 0.008/Tr^8.
//! - Pitzer & Curl, J. Am. Chem. Soc. 79 (1957) 2369-2370:
//!   f0 = 0.1445 - 0.330/Tr - 0.1385/Tr^2 - 0.0121/Tr^3,
//!   f1 = 0.073 + 0.46/Tr - 0.50/Tr^2 - 0.097/Tr^3 - 0.0073/Tr^8.

/// Which correlation gives B.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Correlation {
    /// Tsonopoulos (1974), the default.
    #[default]
    Tsonopoulos,
    /// Pitzer & Curl (1957).
    PitzerCurl,
}

/// Coefficients a_k of f = sum_k a_k Tr^-k, k = 0..8.
type Poly = [f64; 9];

const TSONOPOULOS_F0: Poly = [
    0.1445, -0.330, -0.1385, -0.0121, 0.0, 0.0, 0.0, 0.0, -0.000607,
];
const TSONOPOULOS_F1: Poly = [0.0637, 0.0, 0.331, -0.423, 0.0, 0.0, 0.0, 0.0, -0.008];
const PITZER_CURL_F0: Poly = [0.1445, -0.330, -0.1385, -0.0121, 0.0, 0.0, 0.0, 0.0, 0.0];
const PITZER_CURL_F1: Poly = [0.073, 0.46, -0.50, -0.097, 0.0, 0.0, 0.0, 0.0, -0.0073];

/// A reduced quantity with its scaled temperature derivatives: (f, T df/dT, T^2 d2f/dT2).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct WithDerivatives {
    pub f: f64,
    pub f_t: f64,
    pub f_tt: f64,
}

fn eval(poly: &Poly, inv_tr: f64) -> WithDerivatives {
    let mut out = WithDerivatives::default();
    let mut p = 1.0;
    for (k, &a) in poly.iter().enumerate() {
        let k = k as f64;
        out.f += a * p;
        out.f_t -= k * a * p;
        out.f_tt += k * (k + 1.0) * a * p;
        p *= inv_tr;
    }
    out
}

impl Correlation {
    /// B Pc/(R Tc) and its scaled temperature derivatives at Tr for acentric factor omega.
    pub fn reduced_b(self, tr: f64, omega: f64) -> WithDerivatives {
        let (p0, p1) = match self {
            Correlation::Tsonopoulos => (&TSONOPOULOS_F0, &TSONOPOULOS_F1),
            Correlation::PitzerCurl => (&PITZER_CURL_F0, &PITZER_CURL_F1),
        };
        let inv = 1.0 / tr;
        let (a, b) = (eval(p0, inv), eval(p1, inv));
        WithDerivatives {
            f: a.f + omega * b.f,
            f_t: a.f_t + omega * b.f_t,
            f_tt: a.f_tt + omega * b.f_tt,
        }
    }

    /// Short name.
    pub fn name(self) -> &'static str {
        match self {
            Correlation::Tsonopoulos => "Tsonopoulos (1974)",
            Correlation::PitzerCurl => "Pitzer-Curl (1957)",
        }
    }
}
