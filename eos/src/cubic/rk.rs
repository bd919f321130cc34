//! Redlich-Kwong (1949): P = RT/(v - b) - a/(sqrt(T) v (v + b)).
//! O. Redlich, J. N. S. Kwong, Chem. Rev. 44 (1949) 233-244.

use super::{Alpha, CubicSpec};

pub const SPEC: CubicSpec = CubicSpec {
    id: "rk",
    name: "Redlich-Kwong",
    citation: "O. Redlich, J. N. S. Kwong, Chem. Rev. 44 (1949) 233-244",
    d1: 1.0,
    d2: 0.0,
    alpha: Alpha::InverseSqrtTr,
};
