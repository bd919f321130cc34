//! Z over a whole T-P grid for one cubic model and one composition, on all cores.
//!
//! Each temperature row of the grid is handed to `eos::batch::ZBatch::z_isotherm` (lowest
//! Gibbs energy root; a(T) once per row), rows are spread over the cores with rayon, and every
//! state is independent of the others, so the result is identical, bit for bit and in the same
//! order, to a single-threaded run ([`z_grid_serial`]). The batch kernel serves the members
//! whose sqrt(alpha) is linear in sqrt(T) (vdw, srk, pr, pr78); [`batch_model`] says which ids
//! qualify and builds the model with the k_ij of [`crate::models::kij_for`], as
//! [`crate::models::build`] does.

use crate::feed::Feed;
use eos::batch::{BatchRoot, ZBatch};
use eos::cubic::{Cubic, CubicKind};
use rayon::prelude::*;

/// The batch kernel for model `id` and `feed`, or `None` when the id is not a member the
/// kernel serves (or the model cannot be built; the caller then takes the per-state path,
/// which reports the reason).
pub fn batch_model(id: &str, feed: &Feed) -> Option<ZBatch> {
    let kind = CubicKind::from_id(id).filter(|k| *k != CubicKind::Rk)?;
    let kij = crate::models::kij_for(kind, feed, &mut Vec::new());
    let cubic = Cubic::new(kind, &feed.components(), kij.as_deref()).ok()?;
    ZBatch::new(&cubic, &feed.mole).ok()
}

/// Z at every (t[i], p[j]), row-major (temperature outer), on all cores; `tick(n)` is called
/// after each row with the number of states done.
pub fn z_grid<F>(batch: &ZBatch, t: &[f64], p: &[f64], tick: F) -> eos::Result<Vec<f64>>
where
    F: Fn(u64) + Sync,
{
    let np = p.len();
    let mut out = vec![0.0; t.len() * np];
    if np == 0 {
        return Ok(out);
    }
    out.par_chunks_mut(np)
        .zip(t.par_iter())
        .try_for_each(|(row, &ti)| {
            let r = batch.z_isotherm(ti, p, BatchRoot::LowestGibbs, row);
            tick(np as u64);
            r
        })?;
    Ok(out)
}

/// The same grid on one thread (the check of [`z_grid`]).
pub fn z_grid_serial(batch: &ZBatch, t: &[f64], p: &[f64]) -> eos::Result<Vec<f64>> {
    let np = p.len();
    let mut out = vec![0.0; t.len() * np];
    if np == 0 {
        return Ok(out);
    }
    for (row, &ti) in out.chunks_mut(np).zip(t) {
        batch.z_isotherm(ti, p, BatchRoot::LowestGibbs, row)?;
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::cli::Basis;
    use eos::state::RootChoice;

    #[test]
    fn parallel_equals_serial_and_matches_the_state_solver() {
        // The demo's invented pipeline gas: a mixture with k_ij.
        let feed =
            crate::feed::parse_mix(crate::commands::demo::DEMO_GAS, Basis::Mole, false).unwrap();
        let t: Vec<f64> = (0..37).map(|i| 150.0 + 10.0 * i as f64).collect();
        let p: Vec<f64> = (0..29).map(|j| 1e5 + 5e5 * j as f64).collect();
        for id in ["vdw", "srk", "pr", "pr78"] {
            let b = batch_model(id, &feed).unwrap();
            let par = z_grid(&b, &t, &p, |_| {}).unwrap();
            let ser = z_grid_serial(&b, &t, &p).unwrap();
            assert!(par
                .iter()
                .zip(&ser)
                .all(|(a, b)| a.to_bits() == b.to_bits()));
            // The same model through the per-state path (models::build, State::at_tp): the
            // two root solvers agree to rounding (1e-9 relative allows for the closed-form
            // cubic near double roots).
            let m = crate::models::build(id, &feed).unwrap();
            for (i, &ti) in t.iter().enumerate().step_by(6) {
                for (j, &pj) in p.iter().enumerate().step_by(5) {
                    let s = m
                        .at_tp(ti, pj, &feed.mole, RootChoice::LowestGibbs)
                        .unwrap();
                    let z = par[i * p.len() + j];
                    assert!(
                        (z / s.props.z - 1.0).abs() < 1e-9,
                        "{id} at {ti} K, {pj} Pa: {z} vs {}",
                        s.props.z
                    );
                }
            }
        }
        assert!(batch_model("rk", &feed).is_none());
        assert!(batch_model("ideal", &feed).is_none());
    }
}
