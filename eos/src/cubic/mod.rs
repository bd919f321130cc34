//! The generic two-parameter cubic equation of state and its members.
//!
//! P = R T / (v - b) - a(T) / ((v + d1 b)(v + d2 b))
//!
//! with a(T) = Omega_a (R Tc)^2 / Pc alpha(T) and b = Omega_b R Tc / Pc. Each member supplies
//! only d1, d2 and its alpha function ([`spec`]); Omega_a, Omega_b and Zc follow from the
//! critical conditions (a triple root of the cubic in Z at Tc, Pc) and are derived once in
//! [`spec::CriticalConstants`]. Mixtures use the van der Waals one-fluid rules
//! a = sum_ij x_i x_j sqrt(a_i a_j)(1 - k_ij), b = sum_i x_i b_i.
//!
//! | id | member | d1 | d2 | alpha |
//! |---|---|---|---|---|
//! | `vdw` | van der Waals (1873) | 0 | 0 | 1 |
//! | `rk` | Redlich & Kwong (1949), Chem. Rev. 44:233 | 1 | 0 | Tr^-1/2 |
//! | `srk` | Soave (1972), Chem. Eng. Sci. 27:1197 | 1 | 0 | Soave, m(omega) |
//! | `pr` | Peng & Robinson (1976), Ind. Eng. Chem. Fundam. 15:59 | 1+sqrt2 | 1-sqrt2 | Soave, kappa(omega) |
//! | `pr78` | Robinson & Peng (1978), GPA Research Report RR-28 | 1+sqrt2 | 1-sqrt2 | kappa(omega), heavier fluids revised |

mod alpha;
mod model;
mod pr76;
mod pr78;
mod rk;
pub mod roots;
pub mod spec;
mod srk;
mod vdw;

pub use alpha::Alpha;
pub use model::{Cubic, MAX_COMPONENTS};
pub use spec::{CriticalConstants, CubicSpec};

/// The members of the cubic family.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum CubicKind {
    /// van der Waals (1873).
    Vdw,
    /// Redlich-Kwong (1949).
    Rk,
    /// Soave-Redlich-Kwong (1972).
    Srk,
    /// Peng-Robinson (1976).
    Pr76,
    /// Peng-Robinson (1978).
    Pr78,
}

impl CubicKind {
    /// Every member, simplest first.
    pub const ALL: [CubicKind; 5] = [
        CubicKind::Vdw,
        CubicKind::Rk,
        CubicKind::Srk,
        CubicKind::Pr76,
        CubicKind::Pr78,
    ];

    /// The member's constants and alpha function.
    pub fn spec(self) -> &'static CubicSpec {
        match self {
            CubicKind::Vdw => &vdw::SPEC,
            CubicKind::Rk => &rk::SPEC,
            CubicKind::Srk => &srk::SPEC,
            CubicKind::Pr76 => &pr76::SPEC,
            CubicKind::Pr78 => &pr78::SPEC,
        }
    }

    /// Looks a member up by its id (`vdw`, `rk`, `srk`, `pr`, `pr78`).
    pub fn from_id(id: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|k| k.spec().id == id)
    }
}
