//! Solids are not fluids: the warnings for a state in (or possibly in) a pure fluid's solid
//! region, and the cautions for a mixture component that may freeze out, whatever model
//! computed the state ([`eos::solid`] has the curves).

use crate::feed::Feed;
use eos::solid::{self, SolidCheck};
use fluids::ComponentRecord;

/// The solid curves of a component: from [`eos::solid`] for the fluids with published
/// curves, else its triple point (the reference formulation's, with its pressure, or the
/// component table's temperature).
fn lines(r: &ComponentRecord) -> Option<solid::SolidLines> {
    let formulation = eos::helmholtz::reference_formulation(&r.id);
    let t = formulation.map(|f| f.t_triple).or(r.ttriple_k);
    let p = formulation.map(|f| f.p_triple);
    solid::lines(&r.id, t, p)
}

/// The solid curves of a pure feed with its name, where any are known; `None` for mixtures.
pub fn pure_lines(feed: &Feed) -> Option<(solid::SolidLines, String)> {
    let r = feed.records.first().filter(|_| feed.is_pure())?;
    lines(r).map(|l| (l, r.name.clone()))
}

/// Where a pure feed at (T, P) stands against its solid phase; mixtures are always
/// [`SolidCheck::Fluid`] here (see [`freeze_out`]).
pub fn pure(feed: &Feed, t: f64, p: f64) -> SolidCheck {
    match pure_lines(feed) {
        Some((l, name)) => solid::check(&l, &name, t, p),
        None => SolidCheck::Fluid,
    }
}

/// The triple-point temperature (K) of a pure feed, where known.
pub fn triple_point(feed: &Feed) -> Option<f64> {
    pure_lines(feed).map(|(l, _)| l.t_triple)
}

/// Cautions for the components of a mixture at T below their triple-point temperature: they
/// may freeze out, and solid-fluid equilibrium is not modelled.
pub fn freeze_out(feed: &Feed, t: f64) -> Vec<String> {
    if feed.is_pure() {
        return Vec::new();
    }
    feed.records
        .iter()
        .filter_map(|r| lines(r).map(|l| (r, l.t_triple)))
        .filter(|&(_, tt)| t < tt)
        .map(|(r, tt)| {
            format!(
                "{} may freeze out: the state is below its triple-point temperature ({tt} K); \
                 solid-fluid equilibrium is not modelled, so the fluid values assume no solid",
                r.name
            )
        })
        .collect()
}
