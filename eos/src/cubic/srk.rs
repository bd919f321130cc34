//! Soave-Redlich-Kwong (1972): the Redlich-Kwong volume dependence with Soave's alpha,
//! m = 0.480 + 1.574 omega - 0.176 omega^2.
//! G. Soave, Chem. Eng. Sci. 27 (1972) 1197-1203.

use super::{Alpha, CubicSpec};

fn m(omega: f64) -> f64 {
    0.480 + 1.574 * omega - 0.176 * omega * omega
}

pub const SPEC: CubicSpec = CubicSpec {
    id: "srk",
    name: "Soave-Redlich-Kwong",
    citation: "G. Soave, Chem. Eng. Sci. 27 (1972) 1197-1203",
    d1: 1.0,
    d2: 0.0,
    alpha: Alpha::Soave(m),
};
