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

/// Every bubble or dew point of the feed at the given T or P, by increasing free variable:
/// the direct solution, and one more for each other crossing of the traced envelope's branch
/// (where the dew curve is retrograde, between the critical temperature and the
/// cricondentherm, there are two dew pressures at one temperature; likewise two dew or
/// bubble temperatures at one pressure between the critical pressure and the
/// cricondenbar). An error when not even one point exists.
pub(crate) fn every_point(
    model: &dyn Model,
    z: &[f64],
    side: Side,
    given: Given,
) -> Result<Vec<SaturationPoint>> {
    let first = point(model, z, side, given)?;
    let mut all = vec![first];
    if let Ok(env) = envelope::trace(model, z, EnvelopeOptions::default()) {
        let unsolved = Unsolved::new(model, z, side, given);
        for p in crossings(&env.points, &unsolved) {
            let free = |q: &SaturationPoint| match given {
                Given::T(_) => q.p.ln(),
                Given::P(_) => q.t.ln(),
            };
            if all.iter().all(|q| (free(q) - free(&p)).abs() > SAME_POINT) {
                all.push(p);
            }
        }
    }
    all.sort_by(|a, b| match given {
        Given::T(_) => a.p.total_cmp(&b.p),
        Given::P(_) => a.t.total_cmp(&b.t),
    });
    Ok(all)
}

/// Two solutions closer than this in ln P (or ln T) are one point.
const SAME_POINT: f64 = 1e-6;

/// Starts from the traced phase envelope ([`super::envelope`]): the first crossing of the
/// given T or P by the wanted branch that Newton's method solves.
fn from_envelope(model: &dyn Model, unsolved: &Unsolved) -> Option<SaturationPoint> {
    let env = envelope::trace(model, unsolved.sys.z, EnvelopeOptions::default()).ok()?;
    let first = crossings(&env.points, unsolved).next();
    first
}

/// On each pair of consecutive points of the wanted branch that brackets the given T or P
/// (in trace order, so the dew point of the rising dew curve comes before the retrograde
/// one), the unknowns interpolated linearly in the given variable and corrected by Newton's
/// method; the points that converge.
fn crossings<'a>(
    points: &'a [EnvelopePoint],
    unsolved: &'a Unsolved,
) -> impl Iterator<Item = SaturationPoint> + 'a {
    let (sys, given, value) = (&unsolved.sys, unsolved.given, unsolved.value());
    let z = sys.z;
    let n = z.len();
    let m = n + 2;
    let bubble = sys.side == Side::Bubble;
    let on_side = move |pt: &EnvelopePoint| (pt.vapor_fraction < 0.5) == bubble;
    let coord = move |pt: &EnvelopePoint| match given {
        Given::T(_) => pt.t.ln(),
        Given::P(_) => pt.p.ln(),
    };
    let unknowns = move |pt: &EnvelopePoint| {
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
    points.windows(2).filter_map(move |pair| {
        let (a, b) = (&pair[0], &pair[1]);
        if !(on_side(a) && on_side(b)) {
            return None;
        }
        let (ca, cb) = (coord(a), coord(b));
        if (value - ca) * (value - cb) > 0.0 {
            return None;
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
        unsolved.attempt(&mut x[..m])
    })
}
