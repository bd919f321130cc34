//! The last start of a bubble or dew point: the traced phase envelope of the feed (M. L.
//! Michelsen, Fluid Phase Equilib. 4 (1980) 1-10), tried when no direct start of
//! [`super::saturation_point`] converged. It lives apart from the direct solver because the
//! envelope's own first point is a direct dew point: the envelope uses the direct solver, the
//! fallback uses the envelope, and neither module imports the other's importer.

use super::envelope::{self, EnvelopeOptions, EnvelopePoint};
use super::sat_system::{Side, MAX_VARS};
use super::saturation_point::{direct, Direct, Given, SaturationPoint, Unsolved};
use crate::error::Result;
use crate::model::Model;

/// A bubble or dew point from the direct starts, then from the phase envelope.
pub(crate) fn point(
    model: &dyn Model,
    z: &[f64],
    side: Side,
    given: Given,
) -> Result<SaturationPoint> {
    match direct(model, z, side, given)? {
        Direct::Found(r) => Ok(r),
        Direct::NotFound(u) => from_envelope(model, &u).ok_or_else(|| u.error()),
    }
}

/// Starts from the traced phase envelope ([`super::envelope`]): on each pair of consecutive
/// points of the wanted branch that brackets the given T or P (in trace order, so the dew
/// point of the rising dew curve comes before the retrograde one), the unknowns are
/// interpolated linearly in the given variable and corrected by Newton's method.
fn from_envelope(model: &dyn Model, unsolved: &Unsolved) -> Option<SaturationPoint> {
    let (sys, given, value) = (&unsolved.sys, unsolved.given, unsolved.value());
    let z = sys.z;
    let n = z.len();
    let m = n + 2;
    let env = envelope::trace(model, z, EnvelopeOptions::default()).ok()?;
    let bubble = sys.side == Side::Bubble;
    let on_side = |pt: &EnvelopePoint| (pt.vapor_fraction < 0.5) == bubble;
    let coord = |pt: &EnvelopePoint| match given {
        Given::T(_) => pt.t.ln(),
        Given::P(_) => pt.p.ln(),
    };
    let unknowns = |pt: &EnvelopePoint| {
        let mut x = [0.0; MAX_VARS];
        for i in 0..n {
            if z[i] > 0.0 && pt.incipient[i] > 0.0 {
                let r = (pt.incipient[i] / z[i]).ln();
                x[i] = if bubble { r } else { -r };
            }
        }
        x[n] = pt.t.ln();
        x[n + 1] = pt.p.ln();
        x
    };
    for pair in env.points.windows(2) {
        let (a, b) = (&pair[0], &pair[1]);
        if !(on_side(a) && on_side(b)) {
            continue;
        }
        let (ca, cb) = (coord(a), coord(b));
        if (value - ca) * (value - cb) > 0.0 {
            continue;
        }
        let span = cb - ca;
        let s = if span.abs() > 0.0 {
            (value - ca) / span
        } else {
            0.0
        };
        let (xa, xb) = (unknowns(a), unknowns(b));
        let mut x = [0.0; MAX_VARS];
        for i in 0..m {
            x[i] = xa[i] + s * (xb[i] - xa[i]);
        }
        if let Some(r) = unsolved.attempt(&mut x[..m]) {
            return Some(r);
        }
    }
    None
}
