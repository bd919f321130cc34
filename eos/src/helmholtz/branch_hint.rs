//! Which density root of (T, p) is the stable one, decided before any search from the
//! formulation's vapour-pressure ancillary p_anc(T) (see [`super::ancillary`]): below Tc,
//! p > p_anc (1 + m) is liquid and p < p_anc (1 - m) vapour, with m the margin the ancillary
//! is trusted to against the formulation's own saturation solve. Within the margin, above
//! [`TOP`] Tc, or without an ancillary, the answer is `None` and the caller solves both
//! branches and compares Gibbs energies.
//!
//! The margins are checked in `eos/tests/pure_states.rs` (each ancillary within a quarter of
//! its margin from the triple point to 0.99 Tc): the reference formulations' own ancillaries
//! agree with them to 1.7e-4 or better; the 12-term technical equations use the reference
//! paper's ancillary and depart from it by up to 3.5e-3.

use super::density::Branch;
use super::formulation::{Formulation, Tier};

/// Margin of a reference formulation's ancillary.
pub const MARGIN_REFERENCE: f64 = 1e-3;
/// Margin of the ancillary used with a 12-term technical equation.
pub const MARGIN_TECHNICAL: f64 = 1.5e-2;
/// Fraction of Tc above which the ancillary is not used.
pub const TOP: f64 = 0.99;

/// The ancillary vapour pressure at T (Pa) and its margin, below [`TOP`] Tc.
pub fn ancillary_pressure(f: &Formulation, t: f64) -> Option<(f64, f64)> {
    if !(t > 0.0 && t < TOP * f.tc) {
        return None;
    }
    let est = f.pc * f.ps_anc.as_ref()?.reduced(t, f.tc);
    let margin = match f.tier {
        Tier::Reference => MARGIN_REFERENCE,
        Tier::Technical => MARGIN_TECHNICAL,
    };
    (est.is_finite() && est > 0.0).then_some((est, margin))
}

/// The stable branch at (T, p) when the ancillary settles it: from the triple point up,
/// where its margin is checked. Below the triple point the ancillary is an extrapolation and
/// the formulation itself (outside its range) can have roots the ancillary knows nothing of,
/// so the answer there is `None` (CO2 with the 12-term equation at 160 K and 94 bar: the
/// ancillary says liquid, the root of lowest Gibbs energy is a low-density one).
pub fn stable_branch(f: &Formulation, t: f64, p: f64) -> Option<Branch> {
    if t < f.t_triple {
        return None;
    }
    let (est, m) = ancillary_pressure(f, t)?;
    if p > est * (1.0 + m) {
        Some(Branch::Liquid)
    } else if p < est * (1.0 - m) {
        Some(Branch::Vapour)
    } else {
        None
    }
}
